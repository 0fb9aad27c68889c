import { useEffect, useState } from 'react';
import type { BoardView } from '../../../../shared/schemas/board';
import { MAX_BOARD_LOOKS } from '../../../../shared/schemas/board';

interface Props {
  board: BoardView;
  looks: { id: number; name: string }[];
  lookIds: number[];
  onLooks: (ids: number[]) => void;
  mergeStops: number;
  mergeDeltaE: number;
  onThresholds: (t: { mergeStops: number; mergeDeltaE: number }) => void;
  canEdit: boolean;
  onSave: () => void;
  saving: boolean;
  dirty: boolean;
}

/** Which looks the board is seen through (up to four) and its merge thresholds. */
export function BoardSettings({ looks, lookIds, onLooks, mergeStops, mergeDeltaE, onThresholds, canEdit, onSave, saving, dirty }: Props) {
  const [stops, setStops] = useState(String(Number(mergeStops.toFixed(3))));
  const [de, setDe] = useState(String(mergeDeltaE));
  useEffect(() => setStops(String(Number(mergeStops.toFixed(3)))), [mergeStops]);
  useEffect(() => setDe(String(mergeDeltaE)), [mergeDeltaE]);
  const commit = (s: string, d: string) => {
    const a = Number(s.replace(',', '.'));
    const b = Number(d.replace(',', '.'));
    if (a > 0 && a <= 3 && b >= 0 && b <= 100) onThresholds({ mergeStops: a, mergeDeltaE: b });
  };
  return (
    <div className="grid gap-3 md:grid-cols-[1fr_auto]">
      <fieldset>
        <legend className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Seen through (up to {MAX_BOARD_LOOKS})</legend>
        <div className="flex flex-wrap gap-1">
          {looks.map((l) => {
            const on = lookIds.includes(l.id);
            return (
              <label key={l.id} className={`flex cursor-pointer items-center gap-1 rounded-md border px-2 py-1 text-sm has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-accent ${on ? 'border-ink bg-ink text-paper' : 'border-paper-line bg-paper-raised'}`}>
                <input type="checkbox" className="sr-only" checked={on} disabled={!on && lookIds.length >= MAX_BOARD_LOOKS}
                  onChange={() => onLooks(on ? lookIds.filter((x) => x !== l.id) : [...lookIds, l.id])} />
                {l.name}
              </label>
            );
          })}
        </div>
      </fieldset>
      <fieldset className="flex flex-wrap items-end gap-3">
        <legend className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">A merge is</legend>
        <label className="flex flex-col text-xs text-ink-soft">within (stops on the medium)
          <input className="w-28 rounded-md border border-paper-line bg-paper px-2 py-1 text-sm tabular" inputMode="decimal" value={stops}
            onChange={(e) => setStops(e.target.value)} onBlur={() => commit(stops, de)} onKeyDown={(e) => e.key === 'Enter' && commit(stops, de)} aria-label="Merge threshold in stops on the medium" />
        </label>
        <label className="flex flex-col text-xs text-ink-soft">yet more than (ΔE₀₀ to the eye)
          <input className="w-28 rounded-md border border-paper-line bg-paper px-2 py-1 text-sm tabular" inputMode="decimal" value={de}
            onChange={(e) => setDe(e.target.value)} onBlur={() => commit(stops, de)} onKeyDown={(e) => e.key === 'Enter' && commit(stops, de)} aria-label="Merge threshold in CIEDE2000 to the eye" />
        </label>
        {canEdit && <button type="button" className="rounded-md bg-accent px-3 py-1.5 text-sm text-white hover:bg-accent-strong disabled:opacity-50" disabled={!dirty || saving} onClick={onSave}>Save board settings</button>}
      </fieldset>
    </div>
  );
}
