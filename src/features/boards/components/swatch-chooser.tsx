import { Card } from '../../../components/ui/card';
import type { SwatchView } from '../../../../shared/schemas/swatch';

/** Ticks the swatches that are on a board: any department's (e.g. the wall behind a costume). */
export function SwatchChooser({ swatches, chosen, onChange }: { swatches: SwatchView[]; chosen: number[]; onChange: (ids: number[]) => void }) {
  return (
    <Card className="mb-4">
      <fieldset>
        <legend className="mb-2 text-sm font-semibold">Swatches on this board (any department's, e.g. the wall behind a costume)</legend>
        <div className="grid gap-1 sm:grid-cols-2 lg:grid-cols-4">
          {swatches.map((s) => {
            const on = chosen.includes(s.id);
            return (
              <label key={s.id} className="flex items-center gap-2 text-sm">
                <input type="checkbox" checked={on} onChange={() => onChange(on ? chosen.filter((x) => x !== s.id) : [...chosen, s.id])} />
                <span className="h-3 w-5 rounded-sm border border-paper-line" style={{ background: s.hex }} />
                <span className="truncate">{s.name}</span>
                <span className="text-xs text-ink-mute">{s.department}</span>
              </label>
            );
          })}
        </div>
      </fieldset>
    </Card>
  );
}
