import { useId } from 'react';

/** −4 … +4 stops in thirds-free half steps, as the gaffer says them. */
const STEPS = Array.from({ length: 17 }, (_, i) => -4 + i * 0.5);

/** The light on a surface in words: "lit as the key", "lit 1 stop over the key", "2 stops under the key". */
export function lightWords(stops: number): string {
  if (Math.abs(stops) < 1e-9) return 'lit as the key';
  const n = Math.abs(stops);
  return `lit ${n} stop${n === 1 ? '' : 's'} ${stops > 0 ? 'over' : 'under'} the key`;
}

/**
 * A surface's own light against the key, −4 … +4 stops: the white wall lit a stop hotter, a face in fill two
 * stops under. Its tones move by as much on every look.
 */
export function LightStopsField({ value, onChange, error }: { value: number; onChange: (v: number) => void; error?: string }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-xs font-medium uppercase tracking-wide text-ink-soft">Light on this surface</label>
      <div className="flex items-center gap-2">
        <select id={id} value={value} onChange={(e) => onChange(Number(e.target.value))} aria-invalid={!!error} aria-describedby={`${id}-hint`}
          className="rounded-md border border-paper-line bg-paper-raised px-2 py-1.5 text-sm tabular">
          {STEPS.map((s) => <option key={s} value={s}>{s > 0 ? `+${s}` : s < 0 ? `−${-s}` : '0'} st</option>)}
        </select>
        <span id={`${id}-hint`} className="text-xs text-ink-mute">{lightWords(value)}{value > 0 ? ' (a wall nearer the lamp, a hot spot)' : value < 0 ? ' (a face in the fill side, a corner in shadow)' : ''}; every look’s tone moves by as much.</span>
      </div>
      {error && <p role="alert" className="text-xs text-warn">{error}</p>}
    </div>
  );
}
