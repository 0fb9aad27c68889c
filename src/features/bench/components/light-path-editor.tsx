import type { LightRef } from '../../../../shared/schemas/curve';
import type { LookDefinition, PathCurve } from '../../../../shared/schemas/look';
import { MAX_LOOK_FILTERS } from '../../../../shared/schemas/look';
import { PathCard } from './path-card';
import { refOf, valueOf, type PathOption } from '../lib/look-options';

export type LookDraft = LookDefinition;

interface Props {
  draft: LookDraft;
  onChange: (d: LookDraft) => void;
  options: { light: PathOption[]; filter: PathOption[]; medium: PathOption[] };
  /** the server's curves for the current draft (sparklines for inline lights) */
  curves?: PathCurve[];
  readOnly: boolean;
}

const sel = 'w-full rounded-md border border-paper-line bg-paper px-2 py-1 text-sm disabled:opacity-70';
const num = 'w-24 rounded-md border border-paper-line bg-paper px-2 py-1 text-sm tabular disabled:opacity-70';

function Options({ list }: { list: PathOption[] }) {
  const groups = ['Built-in', 'This production'] as const;
  return (
    <>
      {groups.map((g) => {
        const items = list.filter((o) => o.group === g);
        return items.length ? (
          <optgroup key={g} label={g}>
            {items.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
          </optgroup>
        ) : null;
      })}
    </>
  );
}

function lightKind(l: LightRef): 'pick' | 'daylight' | 'blackbody' {
  if (l.source?.daylight !== undefined) return 'daylight';
  if (l.source?.blackbody !== undefined) return 'blackbody';
  return 'pick';
}

/** The look drawn as its light path: light → surface → filters → medium → development → print, each a card. */
export function LightPathEditor({ draft, onChange, options, curves, readOnly }: Props) {
  const set = (patch: Partial<LookDraft>) => onChange({ ...draft, ...patch });
  const setTone = (patch: Partial<LookDraft['tone']>) => set({ tone: { ...draft.tone, ...patch } });
  const curveOf = (role: PathCurve['role'], i = 0) => curves?.filter((c) => c.role === role)[i]?.values;
  const valuesOf = (list: PathOption[], v: string) => list.find((o) => o.value === v)?.values;
  const kind = lightKind(draft.light);
  const lightValue = valueOf(draft.light);
  const mediumValue = valueOf(draft.medium);
  const lightOpt = options.light.find((o) => o.value === lightValue);
  const mediumOpt = options.medium.find((o) => o.value === mediumValue);
  const cct = draft.light.source?.daylight ?? draft.light.source?.blackbody ?? 5600;

  function moveFilter(i: number, d: -1 | 1) {
    const f = [...draft.filters];
    const j = i + d;
    if (j < 0 || j >= f.length) return;
    [f[i], f[j]] = [f[j], f[i]];
    set({ filters: f });
  }

  return (
    <ol aria-label="Light path" className="list-none">
      <PathCard
        step="Light"
        title={kind === 'daylight' ? `Daylight ${cct} K` : kind === 'blackbody' ? `Blackbody ${cct} K` : (lightOpt?.label ?? 'Choose a light')}
        values={valuesOf(options.light, lightValue) ?? curveOf('light')}
        sparkLabel="relative spectral power of the light"
      >
        <div className="grid gap-2">
          <label className="text-xs text-ink-soft">
            <span className="sr-only">Light</span>
            <select aria-label="Light" className={sel} disabled={readOnly} value={kind === 'pick' ? lightValue : kind}
              onChange={(e) => {
                const v = e.target.value;
                if (v === 'daylight') set({ light: { source: { daylight: 5600 } } });
                else if (v === 'blackbody') set({ light: { source: { blackbody: 3200 } } });
                else set({ light: refOf(v) });
              }}>
              <Options list={options.light} />
              <optgroup label="By colour temperature">
                <option value="daylight">Daylight at a colour temperature…</option>
                <option value="blackbody">Blackbody (tungsten, flame) at a colour temperature…</option>
              </optgroup>
            </select>
          </label>
          {kind !== 'pick' && (
            <label className="flex items-center gap-2 text-xs text-ink-soft">
              Colour temperature
              <input type="number" aria-label="Colour temperature in kelvin" className={num} disabled={readOnly} step={100}
                min={kind === 'daylight' ? 4000 : 1000} max={25000} value={cct}
                onChange={(e) => {
                  const k = Number(e.target.value);
                  if (!Number.isFinite(k)) return;
                  set({ light: { source: kind === 'daylight' ? { daylight: k } : { blackbody: k } } });
                }} />
              K
            </label>
          )}
          {lightOpt?.description && kind === 'pick' && <p className="text-xs text-ink-mute">{lightOpt.description}</p>}
        </div>
      </PathCard>

      <PathCard step="Surface" title="Each swatch of the board">
        <p className="text-xs text-ink-mute">Reflectance, measured or estimated from its colour; choose a board under “A board through this look” to see them through it.</p>
      </PathCard>

      {draft.filters.map((f, i) => {
        const v = valueOf(f.filter);
        const opt = options.filter.find((o) => o.value === v);
        return (
          <PathCard
            key={i}
            step={`Filter ${i + 1} · on the ${f.on}`}
            title={opt?.label ?? 'Filter'}
            values={opt?.values ?? curveOf('filter', i)}
            fixedMax={1}
            sparkLabel={`transmittance of filter ${i + 1}`}
            actions={!readOnly && (
              <span className="flex gap-0.5">
                <button type="button" className="rounded px-1 text-ink-soft hover:bg-paper-sunk disabled:opacity-30" aria-label={`Move filter ${i + 1} up`} disabled={i === 0} onClick={() => moveFilter(i, -1)}>↑</button>
                <button type="button" className="rounded px-1 text-ink-soft hover:bg-paper-sunk disabled:opacity-30" aria-label={`Move filter ${i + 1} down`} disabled={i === draft.filters.length - 1} onClick={() => moveFilter(i, 1)}>↓</button>
                <button type="button" className="rounded px-1 text-warn hover:bg-warn-soft" aria-label={`Remove filter ${i + 1}`} onClick={() => set({ filters: draft.filters.filter((_, j) => j !== i) })}>✕</button>
              </span>
            )}
          >
            <div className="grid gap-2 sm:grid-cols-[1fr_auto]">
              <select aria-label={`Filter ${i + 1}`} className={sel} disabled={readOnly} value={v}
                onChange={(e) => set({ filters: draft.filters.map((x, j) => (j === i ? { ...x, filter: refOf(e.target.value) } : x)) })}>
                {!v && <option value="">(inline filter)</option>}
                <Options list={options.filter} />
              </select>
              <fieldset className="flex gap-2 text-xs">
                <legend className="sr-only">Filter {i + 1} sits</legend>
                {(['lens', 'light'] as const).map((on) => (
                  <label key={on} className="flex items-center gap-1">
                    <input type="radio" name={`on-${i}`} checked={f.on === on} disabled={readOnly}
                      onChange={() => set({ filters: draft.filters.map((x, j) => (j === i ? { ...x, on } : x)) })} />
                    on the {on}
                  </label>
                ))}
              </fieldset>
            </div>
          </PathCard>
        );
      })}
      {!readOnly && draft.filters.length < MAX_LOOK_FILTERS && (
        <li className="mb-3 pl-6">
          <button type="button" className="rounded-md border border-dashed border-ink-mute px-3 py-1.5 text-sm text-ink-soft hover:border-accent hover:text-accent"
            onClick={() => set({ filters: [...draft.filters, { filter: refOf(options.filter[0]?.value ?? 'lib:yellow-490'), on: 'lens' }] })}>
            + Add a filter
          </button>
        </li>
      )}

      <PathCard step="Medium" title={mediumOpt?.label ?? 'Choose a medium'} values={mediumOpt?.values ?? curveOf('medium')} sparkLabel="relative spectral sensitivity of the medium">
        <select aria-label="Medium" className={sel} disabled={readOnly} value={mediumValue} onChange={(e) => set({ medium: refOf(e.target.value) })}>
          {!mediumValue && <option value="">(inline medium)</option>}
          <Options list={options.medium} />
        </select>
        {mediumOpt?.description && <p className="mt-1 text-xs text-ink-mute">{mediumOpt.description}</p>}
      </PathCard>

      <PathCard step="Development" title={draft.tone.developmentStops === 0 ? 'Normal development' : `${draft.tone.developmentStops > 0 ? 'Push' : 'Pull'} ${Math.abs(draft.tone.developmentStops)} st`}>
        <div className="flex flex-wrap gap-3 text-xs text-ink-soft">
          <label className="flex items-center gap-1">Push (+) / pull (−)
            <input type="number" className={num} step={1 / 3} min={-3} max={3} disabled={readOnly} value={Number(draft.tone.developmentStops.toFixed(2))}
              onChange={(e) => Number.isFinite(e.target.valueAsNumber) && setTone({ developmentStops: e.target.valueAsNumber })} /> st
          </label>
          <label className="flex items-center gap-1">Rating from box speed
            <input type="number" className={num} step={1 / 3} min={-6} max={6} disabled={readOnly} value={Number(draft.tone.ratingStops.toFixed(2))}
              onChange={(e) => Number.isFinite(e.target.valueAsNumber) && setTone({ ratingStops: e.target.valueAsNumber })} /> st
          </label>
        </div>
      </PathCard>

      <PathCard step="Print" title={`Grade ${draft.tone.printGrade}`} last>
        <div className="flex flex-wrap gap-3 text-xs text-ink-soft">
          <label className="flex items-center gap-1">Contrast grade
            <input type="number" className={num} step={1} min={-1} max={5} disabled={readOnly} value={draft.tone.printGrade}
              onChange={(e) => Number.isFinite(e.target.valueAsNumber) && setTone({ printGrade: e.target.valueAsNumber })} />
          </label>
          <label className="flex items-center gap-1">Print exposure
            <input type="number" className={num} step={1 / 3} min={-6} max={6} disabled={readOnly} value={Number(draft.tone.printExposureStops.toFixed(2))}
              onChange={(e) => Number.isFinite(e.target.valueAsNumber) && setTone({ printExposureStops: e.target.valueAsNumber })} /> st
          </label>
        </div>
      </PathCard>
    </ol>
  );
}
