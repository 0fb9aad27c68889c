import type { LightBudgetAnswer } from '../../../shared/schemas/look';
import { formatRelative } from '../../../shared/tone/light-budget';
import { formatEI, formatFootcandles, formatSeconds, formatStopsLabel, formatTStop } from '../../../shared/tone/exposure-format';

/** A round top for the scale: 2, 4, 5, 10, 20 … at or above `v`. */
function scaleTop(v: number): number {
  const steps = [1, 2, 4, 5, 10];
  const p = 10 ** Math.floor(Math.log10(Math.max(v, 1)));
  return (steps.find((s) => s * p >= v - 1e-9) ?? 10) * p;
}

const FIELD_WORDS = { tStop: 'T-stop', fps: 'frame rate', shutterAngle: 'shutter', calibrationConstant: 'meter constant' } as const;
/** "T-stop, frame rate, shutter and meter constant" for the fields taken from the defaults look. */
function defaultedWords(fields: LightBudgetAnswer['camera']['defaulted']): string {
  const w = fields.map((f) => FIELD_WORDS[f]);
  return w.length > 1 ? `${w.slice(0, -1).join(', ')} and ${w[w.length - 1]}` : (w[0] ?? '');
}

/**
 * The light budget as bars the producer reads at a glance: one bar per look, its length the light it needs
 * against the first look (linear, so 4× is four times as long), the reference marked at 1×, the look in
 * question (`highlightId`) in the accent colour, the rest in ink greys. Figures beside each bar: ratio,
 * stops, effective EI and foot-candles at the camera of the answer.
 */
export function LightBudgetChart({ budget, highlightId, caption = true }: { budget: LightBudgetAnswer; highlightId?: number; caption?: boolean }) {
  const rows = budget.looks;
  const top = scaleTop(Math.max(1, ...rows.map((r) => r.relative ?? 0)));
  const at = (v: number) => `${Math.min(100, (v / top) * 100).toFixed(2)}%`;
  const cam = budget.camera;
  const ref = rows[0];
  return (
    <figure className="m-0" data-testid="light-budget-chart">
      <ol className="grid gap-1.5" aria-label={`Light each look needs against ${ref.name}`}>
        {rows.map((r, i) => {
          const mine = r.lookId === highlightId;
          const fill = mine ? 'bg-accent' : i === 0 ? 'bg-ink-mute' : 'bg-ink-soft';
          return (
            <li key={r.lookId} className="grid grid-cols-[minmax(8rem,15rem)_1fr_15.5rem] items-center gap-3 text-sm" data-look={r.lookId}>
              <span className={`leading-tight ${mine ? 'font-semibold text-accent' : 'text-ink'}`}>{r.name}</span>
              <span className="relative h-4 rounded-sm bg-paper-sunk" aria-hidden="true">
                {r.relative !== null && <span className={`absolute inset-y-0 left-0 rounded-sm ${fill}`} style={{ width: at(r.relative) }} />}
                <span className="absolute -inset-y-0.5 w-px border-l border-dashed border-ink" style={{ left: at(1) }} />
              </span>
              {r.relative === null ? (
                <span className="text-xs text-ink-mute">no exposure index (the eye)</span>
              ) : (
                <span className="grid grid-cols-[3rem_1fr] items-baseline gap-x-2 whitespace-nowrap tabular-nums">
                  <span className={`text-right text-base font-semibold ${mine ? 'text-accent' : ''}`}>{formatRelative(r.relative)}</span>
                  <span className="text-xs text-ink-soft">
                    {i === 0 ? 'reference' : r.opaque ? 'opaque filter' : formatStopsLabel(r.stops!)} · {formatEI(r.effectiveEI!)} · {formatFootcandles(r.footcandles!)}
                  </span>
                </span>
              )}
            </li>
          );
        })}
      </ol>
      {caption && (
        <figcaption className="mt-2 text-xs text-ink-mute">
          Bars: light needed against <em>{ref.name}</em> (dashed line, 1×), from the effective EIs (box speed, rating and development,
          every filter on the lens or the lamps, each for its own light and medium). Foot-candles incident at {formatTStop(cam.tStop)}, {cam.fps} fps,
          {' '}{cam.shutterAngle}° ({formatSeconds(cam.exposureSeconds)}), meter constant {cam.calibrationConstant}, after ISO 2720
          {'; '}{defaultedWords(cam.defaulted)} from the settings of <em>{cam.defaultsFrom.name}</em>.
        </figcaption>
      )}
    </figure>
  );
}
