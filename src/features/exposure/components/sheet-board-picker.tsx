import type { ExposureSheet } from '../../../../shared/schemas/sheet';
import { Button } from '../../../components/ui/button';

/**
 * The boards whose swatches the sheet lists: by default those that show the look; any of the production's
 * boards can be picked instead (a newly made look shows on none, so they are offered here).
 */
export function SheetBoardPicker({ s, picked, onPick }: { s: ExposureSheet; /** the pick in the address, ahead of the sheet that answers it */ picked?: readonly number[]; onPick: (boardIds: number[] | null) => void }) {
  const shown = s.boardChoices.filter((b) => b.showsLook);
  const on = picked ? [...picked] : s.boardChoices.filter((b) => b.onSheet).map((b) => b.id);
  const toggle = (id: number, checked: boolean) => onPick(checked ? [...on, id] : on.filter((x) => x !== id));
  const none = !picked && shown.length === 0;
  return (
    <section className={`no-print mb-4 rounded-lg border p-3 text-sm ${none ? 'border-warn bg-warn-soft' : 'border-paper-line bg-white'}`} aria-label="Boards on this sheet" data-testid="sheet-board-picker">
      <div className="mb-1 flex flex-wrap items-baseline gap-2">
        <h2 className="text-[11px] font-semibold uppercase tracking-widest text-accent">Boards on this sheet</h2>
        <span className="text-xs text-ink-mute">
          {picked ? 'Picked here; the PDF lists the same.' : 'The boards that show this look.'}
        </span>
        {picked && (
          <Button className="ml-auto" onClick={() => onPick(null)}>Back to the boards that show it</Button>
        )}
      </div>
      {none && s.boardChoices.length > 0 && (
        <p className="mb-2 font-semibold" data-testid="sheet-no-board">No board shows this look yet. Pick the production’s boards to list their swatches on the sheet:</p>
      )}
      {s.boardChoices.length === 0 ? (
        <p className="text-ink-mute">This production has no boards yet.</p>
      ) : (
        <ul className="flex flex-wrap gap-x-4 gap-y-1">
          {s.boardChoices.map((b) => (
            <li key={b.id}>
              <label className="inline-flex items-center gap-1.5">
                <input type="checkbox" checked={on.includes(b.id)} onChange={(e) => toggle(b.id, e.target.checked)} />
                <span className="[font-variant-numeric:normal]">{b.name}</span>
                <span className="text-xs text-ink-mute">{b.department} · {b.swatchCount} swatch{b.swatchCount === 1 ? '' : 'es'}{b.showsLook ? ' · shows this look' : ''}</span>
              </label>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
