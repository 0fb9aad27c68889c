import { ZONES } from '../../../lib/zones';

/** The key of the zone map: the eleven steps, the contour colour, and the hatching for tones off the scale. */
export function ZoneLegend() {
  return (
    <div className="text-xs text-ink-soft">
      <div className="flex overflow-hidden rounded border border-paper-line" aria-hidden="true">
        <span className="w-5" style={{ background: 'repeating-linear-gradient(45deg, #c2410c 0 4px, #000 4px 10px)' }} />
        {ZONES.map(({ zone: z, numeral }) => (
          <span key={z} className={`flex-1 py-0.5 text-center text-[10px] ${z < 6 ? 'text-white/80' : 'text-black/70'}`} style={{ background: `var(--zone-${z})` }}>{numeral}</span>
        ))}
        <span className="w-5" style={{ background: 'repeating-linear-gradient(-45deg, #c2410c 0 4px, #fff 4px 10px)' }} />
      </div>
      <p className="mt-1">Each area in the grey of its zone; <span className="font-medium text-accent">accent lines</span> between zones; <span className="font-medium text-warn">hatching</span> below zone 0 and above X.</p>
    </div>
  );
}
