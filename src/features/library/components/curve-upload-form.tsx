import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { ErrorMessage } from '../../../components/ui/alert';
import { CURVE_BASES, CURVE_BASIS_LABELS, curveCreateSchema, type CurveBasis, type CurveCreateInput, type CurveKind } from '../../../../shared/schemas/curve';
import { cgatsSampleList, isSpectralTableError, readSpectralTable, type SpectralTable } from '../../../../shared/import/spectral-table';
import { filterFromPairs, lightFromPairs, mediumFromPairs, type FilterBasis, type MediumBasis } from '../../../../shared/spectral/bases';
import { SpectralInputError } from '../../../../shared/spectral/errors';
import { toPairs } from '../../../../shared/spectral/spectrum';
import { apiFieldError, zodFieldErrors } from '../../../lib/form-errors';
import { CurveChart } from './curve-chart';

interface Props {
  pending: boolean;
  error: unknown;
  onSubmit: (input: CurveCreateInput, reset: () => void) => void;
}

type Preview = { raw: [number, number][]; grid: [number, number][]; headers: string[]; decimalComma: boolean; cgats: SpectralTable['cgats'] } | { error: string };

/** Reads the table the way the server will (the shared readers and the engine's basis conversion) for a preview. */
function previewOf(text: string, kind: CurveKind, basis: CurveBasis, valueColumn: number, sample: string): Preview {
  try {
    const t = readSpectralTable(text, { valueColumn, sample: sample || undefined });
    try {
      const s = kind === 'filter' ? filterFromPairs(t.pairs, basis as FilterBasis) : kind === 'medium' ? mediumFromPairs(t.pairs, basis as MediumBasis) : lightFromPairs(t.pairs);
      return { raw: t.pairs, grid: toPairs(s), headers: t.headers, decimalComma: t.decimalComma, cgats: t.cgats };
    } catch (e) {
      if (!(e instanceof SpectralInputError)) throw e;
      const i = typeof e.path[0] === 'number' ? e.path[0] : -1;
      return { error: `${i >= 0 ? `line ${t.lines[i]}${t.fields?.[i] ? `, field ${t.fields[i]}` : ''}: ` : ''}${e.reason}` };
    }
  } catch (e) {
    if (isSpectralTableError(e)) return { error: e.message };
    throw e;
  }
}

/**
 * Upload a CSV, TSV or semicolon table of wavelength and value, or a CGATS.17 / Argyll file (one sample, or the
 * sample chosen), choose its basis, see it charted, then save.
 */
export function CurveUploadForm({ pending, error, onSubmit }: Props) {
  const [kind, setKind] = useState<CurveKind>('filter');
  const [basis, setBasis] = useState<CurveBasis>('transmittance');
  const [text, setText] = useState<string | null>(null);
  const [fileName, setFileName] = useState('');
  const [column, setColumn] = useState(2);
  const [sample, setSample] = useState('');
  const samples = text !== null ? cgatsSampleList(text) : null;
  const [errors, setErrors] = useState<Record<string, string>>({});
  const preview = text !== null ? previewOf(text, kind, basis, column - 1, sample) : null;
  const serverErrors = apiFieldError(error);

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const f = new FormData(form);
    const input: CurveCreateInput = {
      kind,
      name: String(f.get('name') ?? ''),
      notes: String(f.get('notes') ?? ''),
      origin: { type: 'table', basis, table: { text: text ?? '', fileName: fileName || undefined, ...(samples ? { sample: sample || undefined } : { valueColumn: column - 1 }) } },
    };
    const parsed = curveCreateSchema.safeParse(input);
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    if (!text) return setErrors({ 'origin.table.text': 'Choose a file.' });
    if (preview && 'error' in preview) return setErrors({ 'origin.table.text': preview.error });
    setErrors({});
    onSubmit(input, () => {
      form.reset();
      setText(null);
      setFileName('');
      setSample('');
    });
  }
  const fileError = errors['origin.table.text'] ?? serverErrors['origin.table.text'];

  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="Upload a curve">
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField label="It is a" value={kind} onChange={(e) => { const k = e.target.value as CurveKind; setKind(k); setBasis(CURVE_BASES[k][0]); }}>
          <option value="filter">filter</option>
          <option value="light">light</option>
          <option value="medium">medium</option>
        </SelectField>
        <SelectField label="Values are" value={basis} onChange={(e) => setBasis(e.target.value as CurveBasis)}>
          {CURVE_BASES[kind].map((b) => <option key={b} value={b}>{CURVE_BASIS_LABELS[b]}</option>)}
        </SelectField>
      </div>
      <TextField label="Name" name="name" error={errors.name ?? serverErrors.name} placeholder="e.g. Lab's own pale green gel" />
      <div className="grid gap-3 sm:grid-cols-[1fr_auto]">
        <label className="flex flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">
          File: CSV, TSV or semicolons (wavelength in nm first; header rows and decimal commas are fine), or CGATS.17 / .ti3 / .sp
          <input type="file" accept=".csv,.tsv,.txt,.cgats,.ti3,.sp,text/csv,text/plain" className="text-sm normal-case" aria-invalid={!!fileError}
            onChange={async (e) => { const file = e.target.files?.[0]; setFileName(file?.name ?? ''); setSample(''); setText(file ? await file.text() : null); }} />
        </label>
        {samples ? (
          samples.length > 1 && (
            <SelectField label="Sample" value={sample} onChange={(e) => setSample(e.target.value)}>
              <option value="">choose one of {samples.length}</option>
              {samples.map((s, i) => <option key={i} value={s.id}>{s.name}{s.id !== s.name ? ` (${s.id})` : ''}</option>)}
            </SelectField>
          )
        ) : (
          <TextField label="Value column" type="number" min={2} max={20} value={column} onChange={(e) => setColumn(Math.max(2, Number(e.target.value) || 2))} />
        )}
      </div>
      {(fileError ?? (preview && 'error' in preview ? preview.error : null)) && (
        <p role="alert" className="text-sm text-warn">{fileName ? `${fileName}: ` : ''}{fileError ?? (preview && 'error' in preview ? preview.error : '')}</p>
      )}
      {preview && 'raw' in preview && (
        <div>
          <p className="mb-1 text-xs text-ink-mute">
            Preview: {preview.raw.length} points{preview.headers.length ? `, ${preview.headers.length} header line${preview.headers.length > 1 ? 's' : ''}` : ''}{preview.decimalComma ? ', decimal commas' : ''}. As read, and on the working grid in the engine's basis.
          </p>
          {preview.cgats && (
            <p className="mb-1 text-xs text-ink-mute">
              {preview.cgats.fileType} file, sample “{preview.cgats.sampleName}”. The file's values look like {preview.cgats.percent ? 'percent' : 'fractions'} ({preview.cgats.assumption}) — the basis chosen above decides.
            </p>
          )}
          <CurveChart series={[{ label: `as read (${CURVE_BASIS_LABELS[basis]})`, pairs: preview.raw }]} yLabel={CURVE_BASIS_LABELS[basis]} height={160} />
          <CurveChart series={[{ label: kind === 'filter' ? 'transmittance 0..1' : 'relative, peak 1', pairs: preview.grid }]} yLabel={kind === 'filter' ? 'transmittance' : 'relative'} yMax={kind === 'filter' ? 1 : undefined} height={160} />
        </div>
      )}
      <TextAreaField label="Notes (where it came from)" name="notes" rows={2} />
      <ErrorMessage error={!Object.keys(serverErrors).length && error} />
      <Button type="submit" variant="primary" disabled={pending || !preview || 'error' in preview} className="self-start">Save to the library</Button>
    </form>
  );
}
