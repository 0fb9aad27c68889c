import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { ErrorMessage } from '../../../components/ui/alert';
import { DEPARTMENTS, type Department } from '../../../../shared/schemas/roles';
import { swatchCreateSchema, type SwatchCreateInput } from '../../../../shared/schemas/swatch';
import { isSpectralTableError, readSpectralTable } from '../../../../shared/import/spectral-table';
import { reflectanceFromPairs } from '../../../../shared/spectral/bases';
import { SpectralInputError } from '../../../../shared/spectral/errors';
import { toPairs } from '../../../../shared/spectral/spectrum';
import { zodFieldErrors, apiFieldError } from '../../../lib/form-errors';
import { SpectrumLine } from './spectrum-line';

type Mode = 'hex' | 'rgb' | 'lab' | 'measured';
const MODES: { id: Mode; label: string }[] = [
  { id: 'hex', label: 'Hex or picker' },
  { id: 'rgb', label: 'RGB 0–255' },
  { id: 'lab', label: 'L*a*b*' },
  { id: 'measured', label: 'Measured file' },
];

/** The three numbers of a colour given as RGB or L*a*b*: label, field name, starting value. */
const TRIPLES: Record<'rgb' | 'lab', { inputMode: 'numeric' | 'decimal'; fields: [string, string, string][] }> = {
  rgb: { inputMode: 'numeric', fields: [['R', 'r', '163'], ['G', 'g', '59'], ['B', 'b', '59']] },
  lab: { inputMode: 'decimal', fields: [['L*', 'L', '40'], ['a*', 'a', '45'], ['b*', 'b', '25']] },
};

interface Props {
  myDepartment: Department;
  /** editors and owners may file a swatch under any department */
  anyDepartment: boolean;
  pending: boolean;
  error: unknown;
  onSubmit: (input: SwatchCreateInput, reset: () => void) => void;
}

/** Adds a swatch from a colour (hex, picker, RGB, L*a*b*) or a measured reflectance file (previewed before saving). */
export function SwatchForm({ myDepartment, anyDepartment, pending, error, onSubmit }: Props) {
  const [mode, setMode] = useState<Mode>('hex');
  const [hex, setHex] = useState('#a33b3b');
  const [fileText, setFileText] = useState<string | null>(null);
  const [fileName, setFileName] = useState('');
  const [basis, setBasis] = useState<'fraction' | 'percent'>('fraction');
  const [errors, setErrors] = useState<Record<string, string>>({});

  let preview: { pairs: [number, number][] } | { error: string } | null = null;
  if (mode === 'measured' && fileText !== null) {
    try {
      const t = readSpectralTable(fileText);
      try {
        preview = { pairs: toPairs(reflectanceFromPairs(t.pairs, basis)) };
      } catch (e) {
        if (!(e instanceof SpectralInputError)) throw e;
        const i = typeof e.path[0] === 'number' ? e.path[0] : -1;
        preview = { error: `${i >= 0 ? `line ${t.lines[i]}${t.fields?.[i] ? `, field ${t.fields[i]}` : ''}: ` : ''}${e.reason}` };
      }
    } catch (e) {
      if (!isSpectralTableError(e)) throw e;
      preview = { error: `${e.message}${/samples/.test(e.message) ? ' (for a file of several samples use “Import measured file”)' : ''}` };
    }
  }

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const f = new FormData(form);
    const num = (k: string) => Number(String(f.get(k) ?? '').replace(',', '.'));
    const origin =
      mode === 'hex' ? { type: 'colour' as const, colour: { space: 'hex' as const, hex } }
      : mode === 'rgb' ? { type: 'colour' as const, colour: { space: 'rgb' as const, rgb: [num('r'), num('g'), num('b')] as [number, number, number] } }
      : mode === 'lab' ? { type: 'colour' as const, colour: { space: 'lab' as const, lab: [num('L'), num('a'), num('b')] as [number, number, number] } }
      : { type: 'measured' as const, basis, table: { text: fileText ?? '', fileName: fileName || undefined } };
    const input = { name: String(f.get('name') ?? ''), notes: String(f.get('notes') ?? ''), department: (f.get('department') as Department) || myDepartment, origin };
    const parsed = swatchCreateSchema.safeParse(input);
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    if (mode === 'measured' && preview && 'error' in preview) return setErrors({ 'origin.table.text': preview.error });
    setErrors({});
    onSubmit(input, () => {
      form.reset();
      setFileText(null);
      setFileName('');
    });
  }

  const serverErrors = apiFieldError(error);
  const err = (k: string) => errors[k] ?? serverErrors[k];
  const colourErr = Object.entries({ ...serverErrors, ...errors }).find(([k]) => k.startsWith('origin'))?.[1];

  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label="Add a swatch">
      <TextField label="Name" name="name" placeholder="e.g. Lip colour, deep rose" error={err('name')} />
      {anyDepartment ? (
        <SelectField label="Department" name="department" defaultValue={myDepartment}>{DEPARTMENTS.map((d) => <option key={d}>{d}</option>)}</SelectField>
      ) : (
        <p className="text-xs text-ink-mute">Department: <strong className="text-ink">{myDepartment}</strong></p>
      )}
      <fieldset>
        <legend className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Given as</legend>
        <div className="flex flex-wrap gap-1" role="radiogroup" aria-label="Given as">
          {MODES.map((m) => (
            <label key={m.id} className={`cursor-pointer rounded-md border px-2 py-1 text-sm has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-accent ${mode === m.id ? 'border-ink bg-ink text-paper' : 'border-paper-line bg-paper-raised'}`}>
              <input type="radio" name="mode" value={m.id} checked={mode === m.id} onChange={() => setMode(m.id)} className="sr-only" />
              {m.label}
            </label>
          ))}
        </div>
      </fieldset>
      {mode === 'hex' && (
        <div className="flex items-end gap-2">
          <div className="flex-1"><TextField label="sRGB hex" name="hex" value={hex} onChange={(e) => setHex(e.target.value)} error={err('origin.colour.hex')} /></div>
          <label className="flex flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">
            Picker
            <input type="color" value={/^#[0-9a-f]{6}$/i.test(hex) ? hex : '#000000'} onChange={(e) => setHex(e.target.value)} className="h-9 w-14 cursor-pointer rounded border border-paper-line bg-paper-raised" />
          </label>
        </div>
      )}
      {(mode === 'rgb' || mode === 'lab') && (
        <div className="grid grid-cols-3 gap-2">
          {TRIPLES[mode].fields.map(([label, name, start]) => (
            <TextField key={`${mode}-${name}`} label={label} name={name} inputMode={TRIPLES[mode].inputMode} defaultValue={start} />
          ))}
        </div>
      )}
      {mode !== 'measured' && <p className="text-xs text-ink-mute">A colour has no spectrum of its own: Grisaille estimates a smooth one that gives the same colour in daylight (D65), and marks the swatch “estimated spectrum”.</p>}
      {mode === 'measured' && (
        <div className="grid gap-2">
          <label className="flex flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">
            Reflectance file (CSV, TSV or semicolons; wavelength in nm, then value)
            <input
              type="file"
              accept=".csv,.tsv,.txt,text/csv,text/plain"
              className="text-sm normal-case"
              onChange={async (e) => {
                const file = e.target.files?.[0];
                setFileName(file?.name ?? '');
                setFileText(file ? await file.text() : null);
              }}
            />
          </label>
          <SelectField label="Values are" value={basis} onChange={(e) => setBasis(e.target.value as 'fraction' | 'percent')}>
            <option value="fraction">reflectance 0..1</option>
            <option value="percent">reflectance in %</option>
          </SelectField>
          {preview && 'pairs' in preview && <SpectrumLine pairs={preview.pairs} max={1} width={300} label={`Preview of the reflectance in ${fileName}`} />}
          {preview && 'error' in preview && <p role="alert" className="text-xs text-warn">{preview.error}</p>}
        </div>
      )}
      {colourErr && <p role="alert" className="text-xs text-warn">{colourErr}</p>}
      <TextAreaField label="Notes" name="notes" rows={2} />
      <ErrorMessage error={!Object.keys(serverErrors).length && error} />
      <Button type="submit" variant="primary" disabled={pending} className="self-start">Add swatch</Button>
    </form>
  );
}
