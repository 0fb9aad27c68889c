import { ZONES } from '../../lib/zones';

/** The eleven-step grey ramp that doubles as the zone scale (0..X). */
export function ZoneRamp({ compact = false }: { compact?: boolean }) {
  return (
    <div className="flex w-full overflow-hidden rounded-md border border-paper-line" aria-label="Zone scale 0 to X">
      {ZONES.map(({ zone: z, numeral }) => (
        <div key={z} className={`zone-swatch flex-1 ${compact ? 'h-3' : 'h-8'} flex items-end justify-center`} style={{ background: `var(--zone-${z})` }}>
          {!compact && <span className={`pb-0.5 text-[10px] font-medium ${z < 6 ? 'text-white/80' : 'text-black/70'}`}>{numeral}</span>}
        </div>
      ))}
    </div>
  );
}
