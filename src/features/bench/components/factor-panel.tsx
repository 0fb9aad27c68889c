import type { FactorForLight, LookAnalysis } from '../../../../shared/schemas/look';

function stops(v: number) {
  return `${v.toFixed(2)} st`;
}
function times(v: number) {
  return `×${v < 10 ? v.toFixed(2) : v.toFixed(1)}`;
}

function Row({ f, main, caption }: { f: FactorForLight; main?: boolean; caption: string }) {
  return (
    <div className={`rounded-md border p-3 ${main ? 'border-ink bg-paper-raised' : 'border-paper-line bg-paper'}`} data-testid={main ? 'factor-main' : undefined}>
      <p className="text-[10px] font-semibold uppercase tracking-widest text-ink-mute">{caption}</p>
      <p className="truncate text-xs text-ink-soft" title={f.light}>{f.light}</p>
      {f.opaque ? (
        <p className="mt-1 text-lg font-semibold text-warn">effectively opaque <span className="text-sm font-normal">(&gt; 10 st)</span></p>
      ) : (
        <p className="mt-1 flex items-baseline gap-2 tabular">
          <span className={main ? 'text-2xl font-semibold' : 'text-lg font-semibold'}>{stops(f.stops)}</span>
          <span className="text-sm text-ink-soft">{times(f.factor)}</span>
        </p>
      )}
    </div>
  );
}

/** The filter factor in stops and as a multiplier, for the look's light and for daylight and tungsten. */
export function FactorPanel({ analysis, stale }: { analysis: LookAnalysis; stale?: boolean }) {
  return (
    <section aria-label="Filter factor" aria-busy={stale} className={stale ? 'opacity-70 transition-opacity' : ''}>
      <h2 className="mb-2 text-base">Filter factor</h2>
      <div className="grid gap-2 sm:grid-cols-3">
        <Row f={analysis.factor} main caption="This light" />
        <Row f={analysis.daylight} caption="In daylight" />
        <Row f={analysis.tungsten} caption="Under tungsten" />
      </div>
      <p className="mt-2 text-xs text-ink-mute">
        Every filter of the look (lens and light) against the bare light, on this medium: F = Σ E·S ÷ Σ E·T·S, stops = log₂ F.
        {analysis.ratedEI ? ` Rated EI ${Math.round(analysis.ratedEI)} before the filter.` : ''}
      </p>
    </section>
  );
}
