import { useEffect, useMemo } from 'react';
import { useDebounced } from '../../../lib/use-debounced';
import { ErrorMessage } from '../../../components/ui/alert';
import { signedStops } from '../../../lib/tone-format';
import type { SourcedLook } from '../../../lib/look-sources';
import { sourceKey, type SurfaceSource } from '../../../lib/swatch-source';
import { useLiveZones, type LiveZones as Answer } from '../api/simulate-zones';

/**
 * The zone of a surface being typed or slid, through each look, live: a split chip (its colour in
 * daylight beside the zone's grey) per look, computed on the server a moment after the last change.
 */
export function LiveZones({ looks, surface, onColour, caption }: { looks: SourcedLook[]; surface: SurfaceSource | null; onColour?: (a: Answer) => void; caption?: string }) {
  // the source's key stands for it (a fresh object each render), so the surface is held per key, then settled
  const key = sourceKey(surface);
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const held = useMemo(() => surface, [key]);
  const settled = useDebounced(held, 250);
  const q = useLiveZones(looks, settled);
  const data = q.data;
  useEffect(() => {
    if (data && onColour) onColour(data);
  }, [data, onColour]);
  if (!looks.length) return <p className="text-xs text-ink-mute">No looks to preview through yet.</p>;
  const stale = q.isFetching || sourceKey(settled) !== sourceKey(surface);
  return (
    <section aria-label="Zone through each look, live" aria-busy={stale} className="rounded-md border border-paper-line bg-paper px-3 py-2">
      <div className="mb-1 flex items-center justify-between gap-2">
        <h4 className="text-xs font-semibold uppercase tracking-wide text-ink-mute">{caption ?? 'Zone through each look'}</h4>
        {stale && <span className="text-[11px] text-ink-mute" role="status">computing…</span>}
      </div>
      {q.error ? <ErrorMessage error={q.error} /> : null}
      {!data && !q.error && <p className="text-xs text-ink-mute">{surface ? 'Computing…' : 'Give a colour or choose a preset to see it through each look.'}</p>}
      {data && (
        <ul className={`grid grid-cols-2 gap-2 ${stale ? 'opacity-70' : ''}`}>
          {data.looks.map((l) => {
            const z = Math.min(10, Math.max(0, Math.round(l.zone)));
            return (
              <li key={l.lookId} className="min-w-0" data-testid="live-zone" data-look={l.lookName} data-zone={l.numeral} data-stops={l.stops.toFixed(3)}>
                <div className="flex h-9 overflow-hidden rounded border border-paper-line" aria-hidden="true">
                  <div className="flex-1" style={{ background: data.hex }} />
                  <div className="flex flex-1 items-center justify-center text-sm font-semibold tabular" style={{ background: `var(--zone-${z})`, color: z < 6 ? '#fff' : '#1b1a18' }}>{l.numeral}</div>
                </div>
                <p className="mt-0.5 truncate text-[11px]" title={l.lookName}>
                  <span className="font-medium">zone {l.numeral}</span> <span className="tabular text-ink-mute">({l.zone.toFixed(1)}, {signedStops(l.stops)})</span> · {l.lookName}
                </p>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
