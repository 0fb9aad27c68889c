import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { ErrorMessage } from '../../../components/ui/alert';
import type { CurveCreateInput, FilterRef, LightRef } from '../../../../shared/schemas/curve';
import { curveCreateSchema } from '../../../../shared/schemas/curve';
import { GRID_NM_LIST } from '../../../../shared/spectral/grid';
import { apiFieldError, zodFieldErrors } from '../../../lib/form-errors';
import { CurveChart } from './curve-chart';

export interface PickItem {
  value: string;
  label: string;
  values: number[];
}

const ref = (v: string): LightRef & FilterRef => (v.startsWith('curve:') ? { curveId: Number(v.slice(6)) } : { source: { id: v.slice(4) } });

/** A light through one or two gels: the product of the lamp and the gels' transmittance, renormalised. Previewed here; made by the engine on save. */
export function GelLightForm({ lights, filters, pending, error, onSubmit }: { lights: PickItem[]; filters: PickItem[]; pending: boolean; error: unknown; onSubmit: (input: CurveCreateInput, reset: () => void) => void }) {
  const [light, setLight] = useState(lights.find((l) => l.value === 'lib:tungsten-3200')?.value ?? lights[0]?.value ?? '');
  const [gel1, setGel1] = useState(filters[0]?.value ?? '');
  const [gel2, setGel2] = useState('');
  const [name, setName] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const serverErrors = apiFieldError(error);
  const L = lights.find((l) => l.value === light)?.values ?? [];
  const gels = [gel1, gel2].filter(Boolean).map((g) => filters.find((f) => f.value === g)?.values ?? []);
  const product = L.map((e, i) => gels.reduce((p, g) => p * (g[i] ?? 1), e));
  const peak = Math.max(1e-12, ...product);

  function submit(e: FormEvent) {
    e.preventDefault();
    const input: CurveCreateInput = { kind: 'light', name, origin: { type: 'gel', light: ref(light), gels: [gel1, gel2].filter(Boolean).map(ref) } };
    const parsed = curveCreateSchema.safeParse(input);
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    onSubmit(input, () => setName(''));
  }

  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="A light through a gel">
      <SelectField label="Light" value={light} onChange={(e) => setLight(e.target.value)}>{lights.map((l) => <option key={l.value} value={l.value}>{l.label}</option>)}</SelectField>
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField label="Gel" value={gel1} onChange={(e) => setGel1(e.target.value)}>{filters.map((f) => <option key={f.value} value={f.value}>{f.label}</option>)}</SelectField>
        <SelectField label="Second gel (optional)" value={gel2} onChange={(e) => setGel2(e.target.value)}>
          <option value="">none</option>
          {filters.map((f) => <option key={f.value} value={f.value}>{f.label}</option>)}
        </SelectField>
      </div>
      {L.length > 0 && (
        <CurveChart yLabel="relative power" yMax={1} height={170} series={[
          { label: 'the lamp', pairs: GRID_NM_LIST.map((nm, i) => [nm, L[i] / Math.max(1e-12, ...L)]) },
          { label: 'through the gel', pairs: GRID_NM_LIST.map((nm, i) => [nm, product[i] / peak]) },
        ]} />
      )}
      <TextField label="Name" value={name} onChange={(e) => setName(e.target.value)} error={errors.name ?? serverErrors.name} placeholder="e.g. Tungsten through the pale cyan gel" />
      <ErrorMessage error={error} />
      <Button type="submit" variant="primary" disabled={pending || !gel1} className="self-start">Save to the library</Button>
    </form>
  );
}
