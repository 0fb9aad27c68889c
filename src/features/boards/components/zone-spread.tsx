import type { SwatchTone } from '../../../../shared/schemas/board';
import type { MergeCertainty } from '../lib/board-rows';
import { zoneFrac } from '../../../components/ui/range-bar';
import { ZONES } from '../../../lib/zones';

/** A swatch on a zone ruler (or counted in its spread). */
export interface RulerPin {
  id: number;
  name: string;
  hex: string;
  tone: SwatchTone;
  /** how sure its merge is, when it merges with another swatch through this look */
  merged: MergeCertainty | null;
}

/** Bins per zone of the spread (a third of a zone is a third of a stop). */
const BINS_PER_ZONE = 3;
/** The spread's bins run from zone −0.5 to 10.5; off-scale tones fall into the end bins. */
const BINS = 11 * BINS_PER_ZONE;
const BAR_PX = 56;
const RAMP_PX = 24;

interface Bin {
  lo: number;
  hi: number;
  count: number;
  merged: number;
  names: string[];
}

/** Which bin a zone falls into (off-scale ones into the end bins). */
const binOf = (zone: number) => Math.min(BINS - 1, Math.max(0, Math.floor((zone + 0.5) * BINS_PER_ZONE)));

/** Counts the pins per third of a zone, with how many of them merge with another swatch. */
export function spreadBins(pins: readonly RulerPin[]): Bin[] {
  const bins: Bin[] = Array.from({ length: BINS }, (_, i) => ({ lo: i / BINS_PER_ZONE - 0.5, hi: (i + 1) / BINS_PER_ZONE - 0.5, count: 0, merged: 0, names: [] }));
  for (const p of pins) {
    const b = bins[binOf(p.tone.zone)];
    b.count++;
    if (p.merged === 'certain') b.merged++;
    if (b.names.length < 3) b.names.push(p.name);
  }
  return bins;
}

const n = (v: number) => v.toLocaleString('en');

/**
 * The zone scale for a board too long to label every swatch: a column per third of a zone, as tall as the
 * swatches that land there (the tallest column full height), its part that merges with another swatch in
 * the warning colour. Each column names its count and a few of its swatches on hover and to a screen
 * reader; the chips and the table below still list every swatch.
 */
export function ZoneSpread({ pins, title }: { pins: readonly RulerPin[]; title: string }) {
  const bins = spreadBins(pins);
  const most = Math.max(1, ...bins.map((b) => b.count));
  const offLow = pins.filter((p) => p.tone.zone < -0.5).length;
  const offHigh = pins.filter((p) => p.tone.zone > 10.5).length;
  return (
    <div role="group" aria-label={`${title}: ${n(pins.length)} swatches, counted per third of a zone`} data-testid="zone-spread">
      <div className="relative" style={{ height: BAR_PX }}>
        {bins.map((b, i) =>
          b.count === 0 ? null : (
            <div
              key={i}
              role="img"
              tabIndex={0}
              className="absolute bottom-0 flex flex-col justify-end focus:outline-none focus-visible:outline focus-visible:outline-2 focus-visible:outline-accent"
              style={{ left: `${(zoneFrac(b.lo) * 100).toFixed(2)}%`, width: `calc(${((zoneFrac(b.hi) - zoneFrac(b.lo)) * 100).toFixed(2)}% - 2px)`, height: `${Math.max(6, (b.count / most) * 100).toFixed(1)}%` }}
              title={`${n(b.count)} swatch${b.count > 1 ? 'es' : ''} between zone ${b.lo.toFixed(1)} and ${b.hi.toFixed(1)}${b.merged ? `, ${n(b.merged)} merging` : ''}: ${b.names.join(', ')}${b.count > b.names.length ? '…' : ''}`}
              aria-label={`Zone ${b.lo.toFixed(1)} to ${b.hi.toFixed(1)}: ${n(b.count)} swatch${b.count > 1 ? 'es' : ''}${b.merged ? `, ${n(b.merged)} merging with another` : ''}`}
              data-testid="spread-bin"
            >
              <span className="block w-full rounded-t-sm bg-ink-soft/70" style={{ flexGrow: b.count - b.merged }} />
              <span className="block w-full bg-warn/80" style={{ flexGrow: b.merged }} />
            </div>
          ),
        )}
      </div>
      <div className="mt-0.5 flex overflow-hidden rounded border border-paper-line" style={{ height: RAMP_PX }} aria-hidden="true">
        {ZONES.map(({ zone: z, numeral }) => (
          <div key={numeral} className="flex flex-1 items-center justify-center text-[10px] font-medium" style={{ background: `var(--zone-${z})`, color: z < 6 ? 'rgba(255,255,255,.8)' : 'rgba(0,0,0,.7)' }}>{numeral}</div>
        ))}
      </div>
      <p className="mt-1 text-[11px] text-ink-mute">
        {n(pins.length)} swatches, too many to label: each column counts those within a third of a zone (a third of a stop);
        <span className="text-warn"> orange</span>, those that merge with another swatch.
        {offLow + offHigh > 0 && ` Off the scale: ${n(offLow)} below zone 0, ${n(offHigh)} above zone X (in the end columns).`}
      </p>
    </div>
  );
}
