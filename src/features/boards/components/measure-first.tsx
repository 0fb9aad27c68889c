import type { MeasureFirst } from '../lib/board-rows';
import { MEASURE_FIRST_WIDTH } from '../../../lib/tone-range';

/**
 * The estimated swatches whose grey is least sure through the looks shown (widest plausible range first):
 * measuring their reflectance settles the most. Nothing when every swatch is sure to within
 * MEASURE_FIRST_WIDTH stops.
 */
export function MeasureFirstList({ items }: { items: MeasureFirst[] }) {
  if (!items.length) return null;
  return (
    <section className="mb-4 rounded-lg border border-paper-line bg-paper-raised px-4 py-3" aria-labelledby="measure-first" data-testid="measure-first">
      <div className="flex flex-wrap items-baseline justify-between gap-x-4">
        <h2 id="measure-first" className="text-base">Measure these first</h2>
        <p className="text-xs text-ink-mute">Colour values only: their grey could move this far with a realistic spectrum (plausible range {MEASURE_FIRST_WIDTH} st or wider).</p>
      </div>
      <ol className="mt-2 grid gap-x-6 gap-y-1 text-sm md:grid-cols-2">
        {items.map((m, i) => (
          <li key={m.id} className="flex items-baseline gap-2">
            <span className="w-4 text-right text-xs text-ink-mute tabular">{i + 1}.</span>
            <span className="min-w-0 flex-1 truncate font-medium" title={m.name}>{m.name}</span>
            <span className={`tabular ${m.widthStops >= 1 ? 'font-semibold text-warn' : 'text-ink-soft'}`}>{m.widthStops.toFixed(1)} st</span>
            <span className="max-w-[14rem] truncate text-xs text-ink-mute" title={`through ${m.lookName}`}>through {m.lookName}</span>
          </li>
        ))}
      </ol>
    </section>
  );
}
