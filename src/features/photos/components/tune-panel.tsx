import { Button } from '../../../components/ui/button';
import type { PhotoLookView } from '../../../../shared/schemas/photo';
import { hasEdits, type LookEdits } from '../lib/look-edits';

const PARAM_WORDS = { cutOnNm: 'cut-on', cutOffNm: 'cut-off', centreNm: 'centre' } as const;
/** Range of a moved filter edge, nm (inside the working grid, clear of its ends). */
const FILTER_NM: [number, number] = [400, 760];

/**
 * Live changes to the look for the preview: the light's colour temperature and each parametric
 * filter's edge. Nothing is saved; "Render full resolution" renders exactly this.
 */
export function TunePanel({ view, edits, onChange }: { view: PhotoLookView; edits: LookEdits; onChange: (e: LookEdits, at: number) => void }) {
  const le = view.light.edit;
  const tunable = view.filters.map((f, i) => ({ f, i })).filter((x) => x.f.edit);
  if (!le && !tunable.length) return <p className="text-xs text-ink-mute">This look's light and filters are measured curves: nothing to retune here (change the look on the bench).</p>;
  return (
    <div className="flex flex-col gap-3">
      {le && (
        <div>
          <label htmlFor="tune-kelvin" className="flex justify-between text-xs font-medium uppercase tracking-wide text-ink-soft">
            <span>Light, {le.kind === 'blackbody' ? 'blackbody' : 'daylight'} CCT</span>
            <span className="tabular normal-case">{Math.round(edits.kelvin ?? le.kelvin)} K</span>
          </label>
          <input
            id="tune-kelvin"
            type="range"
            className="w-full accent-accent"
            min={le.minKelvin}
            max={le.maxKelvin}
            step={50}
            value={edits.kelvin ?? le.kelvin}
            onChange={(e) => onChange({ ...edits, kelvin: Number(e.target.value) }, performance.now())}
          />
        </div>
      )}
      {tunable.map(({ f, i }) => (
        <div key={i}>
          <label htmlFor={`tune-filter-${i}`} className="flex justify-between gap-2 text-xs font-medium uppercase tracking-wide text-ink-soft">
            <span className="truncate">{f.label} ({f.on === 'light' ? 'gel' : 'lens'}), {PARAM_WORDS[f.edit!.param]}</span>
            <span className="tabular normal-case">{Math.round(edits.filterNm?.[i] ?? f.edit!.nm)} nm</span>
          </label>
          <input
            id={`tune-filter-${i}`}
            type="range"
            className="w-full accent-accent"
            min={FILTER_NM[0]}
            max={FILTER_NM[1]}
            step={1}
            value={edits.filterNm?.[i] ?? f.edit!.nm}
            onChange={(e) => onChange({ ...edits, filterNm: { ...edits.filterNm, [i]: Number(e.target.value) } }, performance.now())}
          />
        </div>
      ))}
      {hasEdits(edits) && (
        <Button variant="ghost" className="self-start" onClick={() => onChange({}, performance.now())}>Back to the saved look</Button>
      )}
    </div>
  );
}
