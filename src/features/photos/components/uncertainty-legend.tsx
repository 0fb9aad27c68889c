import type { UncertaintyStatus } from '../../../../shared/schemas/photo';
import { SHADE_FROM_STOPS, SHADE_FULL_STOPS, SHADE_MAX_ALPHA, shadeAlpha } from '../lib/uncertainty-shade';

/** Legend scale, stops: 0 … 2.5, with ticks. */
const SCALE_MAX = 2.5;
const TICKS = [0.25, 0.5, 1, 1.5, 2];

/**
 * The overlay's key: the warning colour's opacity against the width of a colour's plausible tone range, in
 * stops (over the zone V grey the photo mostly sits in), and the progress while the table builds.
 */
export function UncertaintyLegend({ status, pending, lookName, shaded, error }: { status: UncertaintyStatus | undefined; pending: boolean; lookName: string; shaded: number | null; error: unknown }) {
  const stops = Array.from({ length: 11 }, (_, i) => (i / 10) * SCALE_MAX);
  const gradient = `linear-gradient(to right, ${stops.map((s) => `rgba(194, 65, 12, ${shadeAlpha(s).toFixed(3)}) ${((s / SCALE_MAX) * 100).toFixed(0)}%`).join(', ')})`;
  const building = status && status.status === 'running';
  return (
    <div className="text-xs text-ink-soft" data-testid="uncertainty-legend">
      {building && (
        <div aria-live="polite" className="mb-2">
          <div className="flex justify-between">
            <span>Working out how sure each colour is through {lookName}…</span>
            <span className="tabular">{Math.round(status.progress * 100)} %</span>
          </div>
          <progress className="h-2 w-full appearance-none overflow-hidden rounded [&::-webkit-progress-bar]:bg-paper-sunk [&::-webkit-progress-value]:bg-accent [&::-moz-progress-bar]:bg-accent" max={1} value={status.progress} aria-label="Uncertainty table progress" />
        </div>
      )}
      {pending && <p className="mb-2" aria-live="polite">Asking for the uncertainty table of {lookName}…</p>}
      {status?.status === 'done' && shaded === null && <p className="mb-2" aria-live="polite">Shading the preview…</p>}
      {status?.status === 'failed' && <p role="alert" className="mb-1 text-warn">The uncertainty table could not be built: {status.error}</p>}
      {error ? <p role="alert" className="mb-1 text-warn">The uncertainty table could not be fetched.</p> : null}
      <p className="mb-1 font-medium text-ink">Plausible range of a colour’s tone, stops</p>
      <div className="relative h-4 overflow-hidden rounded border border-paper-line" style={{ background: 'var(--zone-5)' }} aria-hidden="true">
        <div className="absolute inset-0" style={{ background: gradient }} />
      </div>
      <div className="relative mt-0.5 h-4 tabular" aria-hidden="true">
        {TICKS.map((t) => (
          <span key={t} className="absolute whitespace-nowrap border-l border-ink-mute/60 pl-0.5 text-[10px] leading-3 text-ink-mute" style={{ left: `${(t / SCALE_MAX) * 100}%` }}>{t === TICKS[TICKS.length - 1] ? `${t} st and wider` : t}</span>
        ))}
      </div>
      <p className="mt-1">
        Shaded where a colour’s grey is least sure through {lookName}: the width of its plausible tone range, clear under {SHADE_FROM_STOPS} st, fullest ({Math.round(SHADE_MAX_ALPHA * 100)} %) from {SHADE_FULL_STOPS} st.
        {shaded !== null && <> <span className="tabular">{(shaded * 100).toFixed(0)} %</span> of the frame is shaded.</>} Sample or measure the shaded surfaces to be sure.
      </p>
    </div>
  );
}
