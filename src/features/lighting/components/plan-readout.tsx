import type { LightPlanResponse } from '../../../../shared/schemas/light-plan';
import { formatEI, formatFootcandles, formatLux, formatSeconds, formatTStop } from '../../../../shared/tone/exposure-format';
import { describeAgainstNeed, formatPlanStops } from '../lib/format-plan';

/** The level needed, the lamps' total against it and the key-to-fill ratio against the shadow threshold. */
export function PlanReadout({ plan, stale }: { plan: LightPlanResponse; stale: boolean }) {
  const short = plan.stopsVsNeeded < -0.05;
  const k = plan.keyToFill;
  return (
    <div className={`grid grid-cols-3 gap-2 transition-opacity ${stale ? 'opacity-60' : ''}`} aria-live="polite">
      <p className="rounded-md border border-paper-line px-3 py-2">
        <span className="block text-xs text-ink-mute">Needed at {formatTStop(plan.tStop)}, {formatEI(plan.ei)}, {formatSeconds(plan.exposureSeconds)}</span>
        <span className="text-2xl font-semibold tabular-nums" data-testid="plan-needed">{formatFootcandles(plan.neededFc)}</span>
        <span className="ml-2 text-sm tabular-nums text-ink-soft">{formatLux(plan.neededLux)}</span>
      </p>
      <p className={`rounded-md px-3 py-2 ${short ? 'bg-warn-soft' : 'bg-ink text-paper'}`}>
        <span className={`block text-xs ${short ? 'text-ink-soft' : 'opacity-80'}`}>All lamps at the subject</span>
        <span className="text-2xl font-semibold tabular-nums" data-testid="plan-total">{formatFootcandles(plan.totalFc)}</span>
        <span className="ml-2 text-sm tabular-nums">{formatLux(plan.totalLux)}</span>
        <span className={`block text-sm ${short ? 'font-medium text-warn' : ''}`} data-testid="plan-total-vs">{formatPlanStops(plan.stopsVsNeeded)}: {describeAgainstNeed(plan.stopsVsNeeded)}</span>
      </p>
      <div className={`rounded-md px-3 py-2 ${k?.exceeds ? 'bg-warn-soft' : 'border border-paper-line'}`} data-testid="plan-key-fill">
        <span className="block text-xs text-ink-mute">Key-to-fill, against {plan.shadowDetailStops} stops of shadow detail</span>
        {k ? (
          <>
            <span className="text-2xl font-semibold tabular-nums" data-testid="plan-ratio-stops">{k.stops.toFixed(1)} stops</span>
            <span className="ml-2 text-sm tabular-nums text-ink-soft">{k.ratio.toFixed(1)}:1</span>
            <span className={`block text-sm leading-snug ${k.exceeds ? 'font-medium text-warn' : 'text-ink-soft'}`}>
              {k.exceeds ? `Past the threshold: bring ${k.fillName} to ${k.fillMaxDistanceM.toFixed(2)} m or closer.` : `Within it; ${k.fillName} could go back to ${k.fillMaxDistanceM.toFixed(2)} m.`}
            </span>
          </>
        ) : (
          <span className="block text-sm text-ink-soft">Mark one lamp as key and one as fill.</span>
        )}
      </div>
    </div>
  );
}

/** What the figures assume, what to check on this plan, and the cautions of the trade. */
export function PlanNotes({ plan }: { plan: LightPlanResponse }) {
  return (
    <div className="grid grid-cols-2 gap-4 text-[12px] leading-snug">
      <div>
        {plan.warnings.length > 0 && (
          <>
            <h3 className="mb-1 text-xs font-medium uppercase tracking-wide text-warn">Check</h3>
            <ul className="mb-3 list-disc space-y-1 pl-4" data-testid="plan-warnings">
              {plan.warnings.map((w) => <li key={w}>{w}</li>)}
            </ul>
          </>
        )}
        <h3 className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">The model</h3>
        <ul className="list-disc space-y-1 pl-4 text-ink-soft">
          {plan.model.map((m) => <li key={m}>{m}</li>)}
          <li>{plan.meterNote}.</li>
        </ul>
      </div>
      <div className="border-l-2 border-warn pl-3" data-testid="plan-cautions">
        <h3 className="mb-1 text-xs font-medium uppercase tracking-wide text-warn">Cautions</h3>
        <dl className="space-y-1 text-ink-soft">
          {plan.cautions.map((c) => (
            <div key={c.title}><dt className="inline font-medium text-ink">{c.title}. </dt><dd className="inline">{c.text}</dd></div>
          ))}
        </dl>
      </div>
    </div>
  );
}
