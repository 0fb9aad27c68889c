import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { ErrorMessage } from '../../../components/ui/alert';
import { curveCreateSchema, type CurveCreateInput } from '../../../../shared/schemas/curve';
import type { FilterSource } from '../../../../shared/schemas/simulate';
import { resolveFilter } from '../../../../shared/spectral/compute';
import { SpectralInputError } from '../../../../shared/spectral/errors';
import { toPairs } from '../../../../shared/spectral/spectrum';
import { apiFieldError, zodFieldErrors } from '../../../lib/form-errors';
import { CurveChart } from './curve-chart';

type Family = 'longPass' | 'shortPass' | 'bandPass' | 'notch' | 'neutralDensity';
const FAMILIES: { id: Family; label: string }[] = [
  { id: 'longPass', label: 'long-pass (passes above the cut-on)' },
  { id: 'shortPass', label: 'short-pass (passes below the cut-off)' },
  { id: 'bandPass', label: 'band-pass (passes a band)' },
  { id: 'notch', label: 'notch (blocks a band)' },
  { id: 'neutralDensity', label: 'neutral density' },
];

const n = (s: string) => Number(s.replace(',', '.'));

/** The form's fields → an engine filter source. */
function sourceOf(family: Family, v: Record<string, string>): FilterSource {
  const common = { slopeNm: n(v.slope), peak: n(v.peak) };
  if (family === 'longPass') return { longPass: { cutOnNm: n(v.edge), ...common } };
  if (family === 'shortPass') return { shortPass: { cutOffNm: n(v.edge), ...common } };
  if (family === 'bandPass') return { bandPass: { centreNm: n(v.edge), widthNm: n(v.width), ...common } };
  if (family === 'notch') return { notch: { centreNm: n(v.edge), widthNm: n(v.width), ...common } };
  return { neutralDensity: n(v.density) };
}

/** A parametric filter from a form: family, cut-on or centre, slope or width, peak; previewed by the engine itself. */
export function ParametricFilterForm({ pending, error, onSubmit }: { pending: boolean; error: unknown; onSubmit: (input: CurveCreateInput, reset: () => void) => void }) {
  const [family, setFamily] = useState<Family>('longPass');
  const [v, setV] = useState({ edge: '580', width: '60', slope: '20', peak: '0.9', density: '0.3', name: '' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const source = sourceOf(family, v);
  let preview: [number, number][] | string;
  try {
    preview = toPairs(resolveFilter(source));
    if (preview.some((p) => !Number.isFinite(p[1]))) preview = 'Check the numbers.';
  } catch (e) {
    preview = e instanceof SpectralInputError ? e.message : 'Check the numbers.';
  }
  const set = (k: keyof typeof v) => (e: { target: { value: string } }) => setV({ ...v, [k]: e.target.value });
  const serverErrors = apiFieldError(error);

  function submit(e: FormEvent) {
    e.preventDefault();
    const input: CurveCreateInput = { kind: 'filter', name: v.name, origin: { type: 'parametric', filter: source } };
    const parsed = curveCreateSchema.safeParse(input);
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    onSubmit(input, () => setV({ ...v, name: '' }));
  }
  const fieldErr = Object.entries({ ...serverErrors, ...errors }).find(([k]) => k.startsWith('origin'))?.[1];

  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="Parametric filter">
      <SelectField label="Family" value={family} onChange={(e) => setFamily(e.target.value as Family)}>
        {FAMILIES.map((f) => <option key={f.id} value={f.id}>{f.label}</option>)}
      </SelectField>
      {family === 'neutralDensity' ? (
        <TextField label="Optical density" inputMode="decimal" value={v.density} onChange={set('density')} hint="0.3 ≈ one stop" />
      ) : (
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField label={family === 'longPass' ? 'Cut-on (nm)' : family === 'shortPass' ? 'Cut-off (nm)' : 'Centre (nm)'} inputMode="decimal" value={v.edge} onChange={set('edge')} hint="the 50 % point" />
          {(family === 'bandPass' || family === 'notch') && <TextField label="Width (nm)" inputMode="decimal" value={v.width} onChange={set('width')} hint="between the 50 % points" />}
          <TextField label="Slope (nm)" inputMode="decimal" value={v.slope} onChange={set('slope')} hint="10 %–90 % width of each edge" />
          <TextField label={family === 'notch' ? 'Transmittance outside the notch' : 'Peak transmittance'} inputMode="decimal" value={v.peak} onChange={set('peak')} hint="0..1" />
        </div>
      )}
      {typeof preview === 'string' ? <p role="alert" className="text-sm text-warn">{preview}</p> : <CurveChart series={[{ label: 'transmittance', pairs: preview }]} yLabel="transmittance" yMax={1} height={170} />}
      {fieldErr && <p role="alert" className="text-sm text-warn">{fieldErr}</p>}
      <TextField label="Name" value={v.name} onChange={set('name')} error={errors.name ?? serverErrors.name} placeholder="e.g. Orange 580 nm, soft edge" />
      <ErrorMessage error={!Object.keys(serverErrors).length && error} />
      <Button type="submit" variant="primary" disabled={pending || typeof preview === 'string'} className="self-start">Save to the library</Button>
    </form>
  );
}
