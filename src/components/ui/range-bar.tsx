import type { ToneRange } from '../../../shared/schemas/board';
import { zoneFromStops } from '../../../shared/tone/zones';
import { ZONES } from '../../lib/zones';
import { isExact, rangeLabel } from '../../lib/tone-range';

/** Where zone `z` sits across the zone scale 0..X (each zone a cell, −½ to 10½), 0..1: the zone ruler's own mapping. */
export const zoneFrac = (z: number) => (Math.min(10.5, Math.max(-0.5, z)) + 0.5) / 11;

const pct = (z: number) => `${(zoneFrac(z) * 100).toFixed(2)}%`;
const span = (r: readonly [number, number]) => ({ left: pct(zoneFromStops(r[0])), width: `${((zoneFrac(zoneFromStops(r[1])) - zoneFrac(zoneFromStops(r[0]))) * 100).toFixed(2)}%` });

/**
 * How sure a grey is, along the zone scale: the plausible range as a bar, every possible spectrum as a
 * fainter line behind it, the estimate as a tick, over a thin copy of the zone ramp. A measured swatch
 * (zero width) shows the tick alone.
 */
export function RangeBar({ range, stops, ramp = true, className = '' }: { range: ToneRange; stops: number; ramp?: boolean; className?: string }) {
  const exact = isExact(range);
  return (
    <div className={`relative h-[14px] min-w-16 ${className}`} role="img" aria-label={rangeLabel(range)} title={rangeLabel(range)} data-testid="range-bar" data-exact={exact || undefined}>
      {ramp && (
        <div className="absolute inset-x-0 bottom-0 flex h-[3px] overflow-hidden rounded-sm opacity-70" aria-hidden="true">
          {ZONES.map(({ zone }) => <span key={zone} className="flex-1" style={{ background: `var(--zone-${zone})` }} />)}
        </div>
      )}
      {!exact && (
        <>
          <span className="absolute top-[4px] h-[2px] rounded bg-ink-mute/35" style={span(range.possible)} data-part="possible" />
          <span className="absolute top-[2px] h-[6px] min-w-[2px] rounded-sm bg-ink-soft/80" style={span(range.plausible)} data-part="plausible" />
        </>
      )}
      <span className={`absolute top-0 h-[10px] w-[2px] -translate-x-1/2 ${exact ? 'bg-accent' : 'bg-ink'}`} style={{ left: pct(zoneFromStops(stops)) }} data-part="estimate" />
    </div>
  );
}
