import { useLayoutEffect, useRef, useState } from 'react';
import { zoneFromStops } from '../../../../shared/tone/zones';
import { zoneFrac } from '../../../components/ui/range-bar';
import { signedStops } from '../../../lib/tone-format';
import { isExact, rangeLabel } from '../../../lib/tone-range';
import { ZONES } from '../../../lib/zones';
import { ZoneSpread, type RulerPin } from './zone-spread';
export type { RulerPin };

/**
 * Above this many swatches the ruler counts them instead of pinning each (ZoneSpread): six lanes a side hold
 * a few dozen labels, and a thousand pins per look would be unreadable and slow to lay out.
 */
export const RULER_MAX_PINS = 120;

/** Label lanes on each side of the ramp (at least, at most), their spacing, and the ramp's height, px. */
const MIN_LANES = 3;
const MAX_LANES = 6;
/** Most lanes spent on keeping whole possible ranges apart. */
const POSSIBLE_LANES = 4;
const LANE_PX = 26;
const RAMP_PX = 24;
/** Stem of the first lane, px (room for the range bar between the dot and the label). */
const STEM_PX = 10;


/** Rough label width for a name at 10 px Inter, px (enough to keep neighbours apart). */
const labelWidth = (name: string) => Math.min(128, 5.4 * name.length + 12);

/**
 * Spreads labels (each with its plausible range bar) over `lanes` lanes above and below the ramp: each pin
 * takes the first lane whose last occupant ends before its own starts (the lane with the most room when
 * none is free, which counts as a clash).
 */
function assignLanes(pins: RulerPin[], width: number, lanes: number, extent: 'plausible' | 'possible') {
  const ends = Array.from({ length: lanes * 2 }, () => -Infinity);
  const out = new Map<number, { lane: number; up: boolean }>();
  let clashes = 0;
  const sorted = pins.map((p) => {
    const x = zoneFrac(p.tone.zone) * width;
    const w = labelWidth(p.name);
    const lo = zoneFrac(zoneFromStops(p.tone.range[extent][0])) * width;
    const hi = zoneFrac(zoneFromStops(p.tone.range[extent][1])) * width;
    return { p, start: Math.min(x - w / 2, lo), end: Math.max(x + w / 2, hi) };
  }).sort((a, b) => a.start - b.start);
  for (const { p, start, end } of sorted) {
    let k = ends.findIndex((e) => e + 4 <= start);
    if (k < 0) {
      k = ends.indexOf(Math.min(...ends));
      clashes++;
    }
    ends[k] = end;
    out.set(p.id, { lane: Math.floor(k / 2), up: k % 2 === 0 });
  }
  return { out, clashes };
}

/**
 * As few lanes as leave no clash: first keeping whole possible ranges apart (up to POSSIBLE_LANES), else
 * the plausible bars only (MIN_LANES … MAX_LANES), the faint possible lines then may run under a neighbour.
 */
function lanesFor(pins: RulerPin[], width: number) {
  for (let n = MIN_LANES; n <= POSSIBLE_LANES; n++) {
    const next = assignLanes(pins, width, n, 'possible');
    if (!next.clashes) return { lanes: n, ...next };
  }
  let best = { lanes: MIN_LANES, ...assignLanes(pins, width, MIN_LANES, 'plausible') };
  for (let n = MIN_LANES + 1; best.clashes > 0 && n <= MAX_LANES; n++) {
    const next = assignLanes(pins, width, n, 'plausible');
    if (next.clashes < best.clashes) best = { lanes: n, ...next };
  }
  return best;
}

const pct = (f: number) => `${(f * 100).toFixed(2)}%`;
const spanStyle = (r: readonly [number, number]) => {
  const lo = zoneFrac(zoneFromStops(r[0]));
  const hi = zoneFrac(zoneFromStops(r[1]));
  return { left: pct(lo), width: pct(Math.max(0, hi - lo)) };
};

/**
 * The zone scale 0..X with every swatch pinned where it lands (the zone is continuous: 5 + stops). Each
 * estimated swatch carries its plausible range as a bar across its stem, every possible spectrum as a fainter
 * line; a focused pin also marks its range on the ramp. Pins are focusable and name their swatch, zone,
 * stops and range; off-scale tones sit at the ends with an arrow.
 */
export function ZoneRuler({ pins, title }: { pins: RulerPin[]; title: string }) {
  return pins.length > RULER_MAX_PINS ? <ZoneSpread pins={pins} title={title} /> : <PinnedRuler pins={pins} title={title} />;
}

/** Every swatch pinned and labelled (boards up to RULER_MAX_PINS). */
function PinnedRuler({ pins, title }: { pins: RulerPin[]; title: string }) {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(900);
  const [focus, setFocus] = useState<number | null>(null);
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    setWidth(el.clientWidth);
    const ro = new ResizeObserver(([e]) => setWidth(e.contentRect.width));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  const sorted = [...pins].sort((a, b) => a.tone.zone - b.tone.zone);
  const { out: lanes, lanes: laneCount } = lanesFor(sorted, width);
  const pad = STEM_PX + (laneCount - 1) * LANE_PX + 6 + 16 + 6;
  const focused = sorted.find((p) => p.id === focus);
  return (
    <div ref={ref} className="relative select-none" style={{ paddingTop: pad, paddingBottom: pad }} role="group" aria-label={title}>
      <div className="flex overflow-hidden rounded border border-paper-line" style={{ height: RAMP_PX }} aria-hidden="true">
        {ZONES.map(({ zone: z, numeral: n }) => (
          <div key={n} className="flex flex-1 items-center justify-center text-[10px] font-medium" style={{ background: `var(--zone-${z})`, color: z < 6 ? 'rgba(255,255,255,.8)' : 'rgba(0,0,0,.7)' }}>{n}</div>
        ))}
      </div>
      {focused && !isExact(focused.tone.range) && (
        <div aria-hidden="true">
          <span className="absolute rounded-sm bg-accent/25 outline outline-2 outline-accent" style={{ top: pad, height: RAMP_PX, ...spanStyle(focused.tone.range.plausible) }} />
          <span className="absolute h-[3px] rounded bg-accent/60" style={{ top: pad + RAMP_PX + 1, ...spanStyle(focused.tone.range.possible) }} />
        </div>
      )}
      {sorted.map((p) => {
        const { lane, up } = lanes.get(p.id)!;
        const stem = STEM_PX + lane * LANE_PX;
        const barAt = pad + RAMP_PX + 6 + stem - 7; // from the edge of the box on the pin's side
        const edge = (px: number) => (up ? { bottom: px } : { top: px });
        const exact = isExact(p.tone.range);
        const active = focus === p.id;
        if (exact) return null;
        return (
          <div key={`range-${p.id}`} aria-hidden="true" data-testid="ruler-range" className={active ? 'z-10' : ''}>
            <span className="absolute h-[2px] rounded bg-ink-mute/35" style={{ ...edge(barAt + 2), ...spanStyle(p.tone.range.possible) }} />
            <span className={`absolute h-[6px] min-w-[2px] rounded-sm ${active ? 'bg-accent' : p.merged === 'certain' ? 'bg-warn/80' : 'bg-ink-soft/70'}`} style={{ ...edge(barAt), ...spanStyle(p.tone.range.plausible) }} />
          </div>
        );
      })}
      {sorted.map((p) => {
        const { lane, up } = lanes.get(p.id)!;
        const stem = STEM_PX + lane * LANE_PX;
        const off = p.tone.zone < -0.5 ? 'low' : p.tone.zone > 10.5 ? 'high' : null;
        const active = focus === p.id;
        const label = (
          <span className={`block max-w-[8rem] truncate rounded px-1 text-[10px] leading-4 ${active ? 'bg-ink text-paper' : p.merged === 'certain' ? 'bg-warn-soft text-warn' : 'bg-paper-raised text-ink-soft'}`}>
            {off === 'low' && '◂ '}{p.name}{off === 'high' && ' ▸'}
          </span>
        );
        const dot = <span className={`block h-3 w-3 rounded-full border-2 ${p.merged === 'certain' ? 'border-warn' : p.merged === 'possible' ? 'border-warn/60' : 'border-ink'}`} style={{ background: p.hex }} />;
        const line = <span className="block w-px bg-ink-mute" style={{ height: stem }} />;
        return (
          <button
            key={p.id}
            type="button"
            className={`absolute flex -translate-x-1/2 flex-col items-center focus:outline-none focus-visible:outline focus-visible:outline-2 focus-visible:outline-accent ${active ? 'z-20' : ''}`}
            style={{ left: pct(zoneFrac(p.tone.zone)), ...(up ? { bottom: pad + RAMP_PX - 6 } : { top: pad + RAMP_PX - 6 }) }}
            aria-label={`${p.name}: zone ${p.tone.numeral} (${p.tone.zone.toFixed(1)}), ${signedStops(p.tone.stops)}, ${rangeLabel(p.tone.range)}${p.merged === 'certain' ? ', merges with another swatch' : p.merged === 'possible' ? ', may merge with another swatch' : ''}`}
            onFocus={() => setFocus(p.id)}
            onBlur={() => setFocus(null)}
            onMouseEnter={() => setFocus(p.id)}
            onMouseLeave={() => setFocus(null)}
            data-testid="ruler-pin"
          >
            {up ? <>{label}{line}{dot}</> : <>{dot}{line}{label}</>}
          </button>
        );
      })}
    </div>
  );
}
