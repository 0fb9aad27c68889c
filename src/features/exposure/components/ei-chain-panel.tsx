import type { ExposurePlan } from '../../../../shared/tone/exposure-plan';
import { formatStops } from '../../../../shared/tone/ei-chain';
import { formatEI, formatFactor, formatStopsLabel } from '../../../../shared/tone/exposure-format';

export interface EiChainPanelProps {
  plan: ExposurePlan;
  /** push (+) / pull (−) of the development, stops (shown beside the rating it calls for) */
  developmentStops: number;
  /** the light the filter factor is for, e.g. "Tungsten 3200 K" */
  lightLabel: string;
  /** the filters, e.g. "Red long-pass 590 nm"; empty when the look has none */
  filterLabel?: string;
  /** the filters pass almost nothing on this medium under this light */
  opaque?: boolean;
}

/** An amount of stops as the lab says it: ½ and 1½ in halves, else trade thirds (⅔, 1⅓). */
function amount(a: number): string {
  const halves = Math.round(a * 2);
  if (Math.abs(a * 2 - halves) < 1e-6 && halves % 2 === 1) return `${Math.floor(a) || ''}½`;
  return formatStops(a).replace('+', '');
}

function development(stops: number): string {
  if (Math.abs(stops) < 1e-9) return 'normal development';
  return `${stops > 0 ? 'pushed' : 'pulled'} ${amount(Math.abs(stops))} stop${Math.abs(stops) > 1 ? 's' : ''}`;
}

/**
 * Box speed → development / rating → filter factor for the chosen light → effective EI. Each step
 * shows its change in stops (trade thirds) and the EI after it on the ISO third-stop series.
 */
export function EiChainPanel({ plan, developmentStops, lightLabel, filterLabel, opaque }: EiChainPanelProps) {
  const [box, rating, filter] = plan.chain.steps;
  const factor = 2 ** -filter.stops;
  const rows = [
    { key: 'box', label: 'Box speed', detail: 'as the medium is rated', stops: null as string | null, ei: box.ei },
    { key: 'rating', label: 'Development / rating', detail: development(developmentStops), stops: formatStopsLabel(rating.stops), ei: rating.ei },
    {
      key: 'filter',
      label: 'Filter factor',
      detail: filterLabel ? `${filterLabel} under ${lightLabel} (${formatFactor(factor)})` : `no filter (${lightLabel})`,
      stops: formatStopsLabel(filter.stops),
      ei: filter.ei,
    },
  ];
  return (
    <section aria-label="Exposure-index chain">
      <h3 className="mb-2 text-xs font-medium uppercase tracking-wide text-ink-soft">Exposure-index chain</h3>
      <ol className="space-y-1">
        {rows.map((r, i) => (
          <li key={r.key} className="grid grid-cols-[1fr_auto_auto] items-baseline gap-x-3 border-b border-paper-line pb-1 text-sm last:border-0" data-testid={`ei-step-${r.key}`}>
            <span>
              <span className="text-ink-mute">{i + 1}. </span>
              <span className="font-medium">{r.label}</span>
              <span className="block text-xs text-ink-mute">{r.detail}</span>
            </span>
            <span className="text-right tabular-nums text-ink-soft">{r.stops ?? ''}</span>
            <span className="w-20 text-right font-medium tabular-nums">{formatEI(r.ei)}</span>
          </li>
        ))}
      </ol>
      <p className="mt-2 flex items-baseline justify-between rounded-md bg-ink px-3 py-2 text-paper">
        <span className="text-sm">Effective EI</span>
        <span className="text-2xl font-semibold tabular-nums" data-testid="effective-ei">{plan.chain.effectiveEI}</span>
      </p>
      <p className="mt-1 text-xs text-ink-mute">
        Total {formatStopsLabel(plan.chain.totalStops)} from box speed; each EI rounded to the ISO third-stop series (exact {filter.exactEI.toFixed(1)}).
      </p>
      {opaque && <p role="alert" className="mt-1 text-xs text-warn">The filters pass almost nothing of this light on this medium.</p>}
    </section>
  );
}
