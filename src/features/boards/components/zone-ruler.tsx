import { useLayoutEffect, useRef, useState } from 'react';
import type { SwatchTone } from '../../../../shared/schemas/board';
import { signedStops } from '../../../lib/tone-format';
import { ZONES } from '../../../lib/zones';

/** Label lanes on each side of the ramp, and their spacing, px. */
const LANES = 3;
const LANE_PX = 17;
const RAMP_PX = 24;

export interface RulerPin {
  id: number;
  name: string;
  hex: string;
  tone: SwatchTone;
  merged: boolean;
}

/** Rough label width for a name at 10 px Inter, px (enough to keep neighbours apart). */
const labelWidth = (name: string) => Math.min(128, 5.4 * name.length + 12);

/**
 * Spreads labels over lanes above and below the ramp: each pin takes the first lane whose last label
 * ends before its own starts (the lane with the most room when none is free).
 */
function assignLanes(pins: RulerPin[], xOf: (p: RulerPin) => number): Map<number, { lane: number; up: boolean }> {
  const ends = Array.from({ length: LANES * 2 }, () => -Infinity);
  const out = new Map<number, { lane: number; up: boolean }>();
  for (const p of pins) {
    const w = labelWidth(p.name);
    const start = xOf(p) - w / 2;
    let k = ends.findIndex((e) => e + 4 <= start);
    if (k < 0) k = ends.indexOf(Math.min(...ends));
    ends[k] = start + w;
    out.set(p.id, { lane: Math.floor(k / 2), up: k % 2 === 0 });
  }
  return out;
}

/**
 * The zone scale 0..X with every swatch pinned where it lands (the zone is continuous: 5 + stops).
 * Each pin is focusable and names its swatch, zone and stops; off-scale tones sit at the ends with an arrow.
 */
export function ZoneRuler({ pins, title }: { pins: RulerPin[]; title: string }) {
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
  const frac = (z: number) => (Math.min(10.5, Math.max(-0.5, z)) + 0.5) / 11;
  const lanes = assignLanes(sorted, (p) => frac(p.tone.zone) * width);
  const pad = LANES * LANE_PX + 14;
  return (
    <div ref={ref} className="relative select-none" style={{ paddingTop: pad, paddingBottom: pad }} role="group" aria-label={title}>
      <div className="flex overflow-hidden rounded border border-paper-line" style={{ height: RAMP_PX }} aria-hidden="true">
        {ZONES.map(({ zone: z, numeral: n }) => (
          <div key={n} className="flex flex-1 items-center justify-center text-[10px] font-medium" style={{ background: `var(--zone-${z})`, color: z < 6 ? 'rgba(255,255,255,.8)' : 'rgba(0,0,0,.7)' }}>{n}</div>
        ))}
      </div>
      {sorted.map((p) => {
        const { lane, up } = lanes.get(p.id)!;
        const stem = 6 + lane * LANE_PX;
        const off = p.tone.zone < -0.5 ? 'low' : p.tone.zone > 10.5 ? 'high' : null;
        const active = focus === p.id;
        const label = (
          <span className={`block max-w-[8rem] truncate rounded px-1 text-[10px] leading-4 ${active ? 'bg-ink text-paper' : p.merged ? 'bg-warn-soft text-warn' : 'bg-paper-raised text-ink-soft'}`}>
            {off === 'low' && '◂ '}{p.name}{off === 'high' && ' ▸'}
          </span>
        );
        const dot = <span className={`block h-3 w-3 rounded-full border-2 ${p.merged ? 'border-warn' : 'border-ink'}`} style={{ background: p.hex }} />;
        const line = <span className="block w-px bg-ink-mute" style={{ height: stem }} />;
        return (
          <button
            key={p.id}
            type="button"
            className={`absolute flex -translate-x-1/2 flex-col items-center focus:outline-none focus-visible:outline focus-visible:outline-2 focus-visible:outline-accent ${active ? 'z-10' : ''}`}
            style={{ left: `${frac(p.tone.zone) * 100}%`, ...(up ? { bottom: pad + RAMP_PX - 6 } : { top: pad + RAMP_PX - 6 }) }}
            aria-label={`${p.name}: zone ${p.tone.numeral} (${p.tone.zone.toFixed(1)}), ${signedStops(p.tone.stops)}${p.merged ? ', merges with another swatch' : ''}`}
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
