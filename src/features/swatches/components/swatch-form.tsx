import { useMemo, useState, type FormEvent, type ReactNode } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { ErrorMessage } from '../../../components/ui/alert';
import { DEPARTMENTS, type Department } from '../../../../shared/schemas/roles';
import { swatchCreateSchema, type SwatchCreateInput, type SwatchView } from '../../../../shared/schemas/swatch';
import { isSpectralTableError, readSpectralTable } from '../../../../shared/import/spectral-table';
import { reflectanceFromPairs } from '../../../../shared/spectral/bases';
import { SpectralInputError } from '../../../../shared/spectral/errors';
import { toPairs } from '../../../../shared/spectral/spectrum';
import { SKIN_PRESETS } from '../../../../shared/spectral/skin-presets';
import { zodFieldErrors, apiFieldError } from '../../../lib/form-errors';
import { lightStopsOf, originOf, type MakeupParams, type SkinParams, type SurfaceSource } from '../../../lib/swatch-source';
import { SpectrumLine } from './spectrum-line';
import { SkinFields } from './skin-fields';
import { MakeupFields } from './makeup-fields';
import { LightStopsField } from './light-stops-field';

type Mode = 'hex' | 'rgb' | 'lab' | 'measured' | 'skin' | 'makeup';
const MODES: { id: Mode; label: string }[] = [
  { id: 'hex', label: 'Hex or picker' },
  { id: 'rgb', label: 'RGB 0–255' },
  { id: 'lab', label: 'L*a*b*' },
  { id: 'measured', label: 'Measured file' },
  { id: 'skin', label: 'Skin' },
  { id: 'makeup', label: 'Makeup over skin' },
];

type Triple = [string, string, string];
/** The three numbers of a colour given as RGB or L*a*b*: label, field name, starting value. */
const TRIPLES: Record<'rgb' | 'lab', { inputMode: 'numeric' | 'decimal'; fields: [string, string][]; start: Triple }> = {
  rgb: { inputMode: 'numeric', fields: [['R', 'r'], ['G', 'g'], ['B', 'b']], start: ['163', '59', '59'] },
  lab: { inputMode: 'decimal', fields: [['L*', 'L'], ['a*', 'a'], ['b*', 'b']], start: ['40', '45', '25'] },
};

const num = (s: string) => Number(s.replace(',', '.'));
const HEX = /^#([0-9a-f]{6}|[0-9a-f]{3})$/i;

/** What the form holds of a swatch's colour or parameters. */
interface Draft {
  mode: Mode;
  hex: string;
  rgb: Triple;
  lab: Triple;
  skin: SkinParams;
  makeup: MakeupParams;
}

function startDraft(initial?: SwatchView): Draft {
  const firstSkin = SKIN_PRESETS[0]?.skin ?? { melanin: 0.05, blood: 0.02, oxygenation: 0.75 };
  const d: Draft = {
    mode: 'hex',
    hex: initial?.hex ?? '#a33b3b',
    // a swatch being edited starts its RGB fields from its own colour
    rgb: initial ? ([1, 3, 5].map((i) => String(parseInt(initial.hex.slice(i, i + 2), 16))) as Triple) : TRIPLES.rgb.start,
    lab: TRIPLES.lab.start,
    skin: { ...firstSkin },
    makeup: { over: { skin: { ...firstSkin } }, colour: '#a33b4a', coverage: 0.6 },
  };
  if (!initial) return d;
  const o = originOf(initial);
  const colour = (initial.origin as { colour?: { space: string; hex?: string; rgb?: number[]; lab?: number[] } }).colour;
  if (o.type === 'skin' && o.skin) return { ...d, mode: 'skin', skin: o.skin };
  if (o.type === 'makeup' && o.makeup) return { ...d, mode: 'makeup', makeup: o.makeup };
  if (o.type === 'measured') return { ...d, mode: 'measured' };
  if (colour?.space === 'rgb' && colour.rgb) return { ...d, mode: 'rgb', rgb: colour.rgb.map(String) as Triple };
  if (colour?.space === 'lab' && colour.lab) return { ...d, mode: 'lab', lab: colour.lab.map(String) as Triple };
  return d;
}

/** The draft as a surface for the live preview; null while it is not a complete colour. */
function surfaceOfDraft(d: Draft, measured: [number, number][] | null): SurfaceSource | null {
  switch (d.mode) {
    case 'hex': return HEX.test(d.hex.trim()) ? { srgb: d.hex.trim() } : null;
    case 'rgb': { const v = d.rgb.map(num); return v.every((x) => Number.isFinite(x) && x >= 0 && x <= 255) ? { rgb: v as [number, number, number] } : null; }
    case 'lab': { const v = d.lab.map(num); return v.every(Number.isFinite) && v[0] >= 0 && v[0] <= 100 ? { lab: v as [number, number, number] } : null; }
    case 'measured': return measured ? { reflectance: measured, basis: 'fraction' } : null;
    case 'skin': return { skin: d.skin };
    case 'makeup': return typeof d.makeup.colour === 'string' && !HEX.test(d.makeup.colour) ? null : { makeup: d.makeup };
  }
}

interface Props {
  myDepartment: Department;
  /** editors and owners may file a swatch under any department */
  anyDepartment: boolean;
  pending: boolean;
  error: unknown;
  /** the swatch being edited (the form starts from it and saves changes); none to add one */
  initial?: SwatchView;
  /** swatches to paint with or over (makeup) */
  swatches?: readonly SwatchView[];
  /** the live preview of the colour being given (zone through each look) */
  preview?: (surface: SurfaceSource | null) => ReactNode;
  onSubmit: (input: SwatchCreateInput, reset: () => void) => void;
  onCancel?: () => void;
}

/**
 * Adds (or edits) a swatch: from a colour (hex, picker, RGB, L*a*b*), a measured reflectance file
 * (previewed before saving), skin made from physics, or makeup over a base; with its own light against the
 * key, its notes and department. While typing or sliding, `preview` shows the zone through each look.
 */
export function SwatchForm({ myDepartment, anyDepartment, pending, error, initial, swatches = [], preview, onSubmit, onCancel }: Props) {
  const [draft, setDraft] = useState<Draft>(() => startDraft(initial));
  const [touched, setTouched] = useState(false);
  const [fileText, setFileText] = useState<string | null>(null);
  const [fileName, setFileName] = useState('');
  const [basis, setBasis] = useState<'fraction' | 'percent'>('fraction');
  const [lightStops, setLightStops] = useState(initial ? lightStopsOf(initial) : 0);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const editing = !!initial;
  const set = (p: Partial<Draft>) => { setDraft((d) => ({ ...d, ...p })); setTouched(true); };
  const { mode, hex } = draft;

  let filePreview: { pairs: [number, number][] } | { error: string } | null = null;
  if (mode === 'measured' && fileText !== null) {
    try {
      const t = readSpectralTable(fileText);
      try {
        filePreview = { pairs: toPairs(reflectanceFromPairs(t.pairs, basis)) };
      } catch (e) {
        if (!(e instanceof SpectralInputError)) throw e;
        const i = typeof e.path[0] === 'number' ? e.path[0] : -1;
        filePreview = { error: `${i >= 0 ? `line ${t.lines[i]}${t.fields?.[i] ? `, field ${t.fields[i]}` : ''}: ` : ''}${e.reason}` };
      }
    } catch (e) {
      if (!isSpectralTableError(e)) throw e;
      filePreview = { error: `${e.message}${/samples/.test(e.message) ? ' (for a file of several samples use “Import measured file”)' : ''}` };
    }
  }
  const measuredPairs = filePreview && 'pairs' in filePreview ? filePreview.pairs : null;
  const keepMeasured = editing && mode === 'measured' && fileText === null;
  const measuredNow = editing && initial.spectrum === 'measured' && initial.reflectance ? initial.reflectance : null;
  const surface = useMemo(() => surfaceOfDraft(draft, measuredPairs ?? (keepMeasured ? measuredNow : null)), [draft, measuredPairs, keepMeasured, measuredNow]);

  function origin(): SwatchCreateInput['origin'] {
    const d = draft;
    switch (d.mode) {
      case 'hex': return { type: 'colour', colour: { space: 'hex', hex: d.hex } };
      case 'rgb': return { type: 'colour', colour: { space: 'rgb', rgb: d.rgb.map(num) as [number, number, number] } };
      case 'lab': return { type: 'colour', colour: { space: 'lab', lab: d.lab.map(num) as [number, number, number] } };
      case 'measured': return { type: 'measured', basis, table: { text: fileText ?? '', fileName: fileName || undefined } };
      case 'skin': return { type: 'skin', skin: d.skin } as SwatchCreateInput['origin'];
      case 'makeup': return { type: 'makeup', makeup: d.makeup } as SwatchCreateInput['origin'];
    }
  }

  function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const f = new FormData(form);
    const input: SwatchCreateInput = {
      name: String(f.get('name') ?? ''),
      notes: String(f.get('notes') ?? ''),
      department: (f.get('department') as Department) || initial?.department || myDepartment,
      origin: keepMeasured ? { type: 'colour', colour: { space: 'hex', hex: initial.hex } } : origin(),
      lightStops,
    };
    const parsed = swatchCreateSchema.safeParse(input);
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    if (mode === 'measured' && filePreview && 'error' in filePreview) return setErrors({ 'origin.table.text': filePreview.error });
    setErrors({});
    // an edit sends the colour only when it was changed (a measured swatch keeps its measurement)
    const out: SwatchCreateInput = editing && (!touched || keepMeasured) ? (({ origin: _o, ...rest }) => rest)(input) as SwatchCreateInput : input;
    onSubmit(out, () => {
      form.reset();
      setFileText(null);
      setFileName('');
      setTouched(false);
    });
  }

  const serverErrors = apiFieldError(error);
  const err = (k: string) => errors[k] ?? serverErrors[k];
  /** the first error under a path prefix (a field's parts: origin.colour.rgb.0 …) */
  const errUnder = (prefix: string) => Object.entries({ ...serverErrors, ...errors }).find(([k]) => k === prefix || k.startsWith(`${prefix}.`))?.[1];
  const shownElsewhere = (k: string) => /^origin\.(colour\.(hex|rgb|lab)|skin|makeup)/.test(k);
  const colourErr = Object.entries({ ...serverErrors, ...errors }).find(([k]) => k.startsWith('origin') && !shownElsewhere(k))?.[1];
  const fieldKeys = ['name', 'notes', 'department', 'lightStops'];
  const placed = Object.keys(serverErrors).some((k) => k.startsWith('origin') || fieldKeys.includes(k));

  return (
    <form onSubmit={submit} className="grid gap-3" noValidate aria-label={editing ? 'Edit the swatch' : 'Add a swatch'}>
      <TextField label="Name" name="name" defaultValue={initial?.name} placeholder="e.g. Lip colour, deep rose" error={err('name')} />
      {anyDepartment ? (
        <SelectField label="Department" name="department" defaultValue={initial?.department ?? myDepartment} error={err('department')}>{DEPARTMENTS.map((d) => <option key={d}>{d}</option>)}</SelectField>
      ) : (
        <p className="text-xs text-ink-mute">Department: <strong className="text-ink">{initial?.department ?? myDepartment}</strong></p>
      )}
      <fieldset>
        <legend className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Given as</legend>
        <div className="flex flex-wrap gap-1" role="radiogroup" aria-label="Given as">
          {MODES.map((m) => (
            <label key={m.id} className={`cursor-pointer rounded-md border px-2 py-1 text-sm has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-accent ${mode === m.id ? 'border-ink bg-ink text-paper' : 'border-paper-line bg-paper-raised'}`}>
              <input type="radio" name="mode" value={m.id} checked={mode === m.id} onChange={() => set({ mode: m.id })} className="sr-only" />
              {m.label}
            </label>
          ))}
        </div>
      </fieldset>
      {mode === 'hex' && (
        <div className="flex items-end gap-2">
          <div className="flex-1"><TextField label="sRGB hex" name="hex" value={hex} onChange={(e) => set({ hex: e.target.value })} error={err('origin.colour.hex')} /></div>
          <label className="flex flex-col gap-1 text-xs font-medium uppercase tracking-wide text-ink-soft">
            Picker
            <input type="color" value={/^#[0-9a-f]{6}$/i.test(hex) ? hex : '#000000'} onChange={(e) => set({ hex: e.target.value })} className="h-9 w-14 cursor-pointer rounded border border-paper-line bg-paper-raised" />
          </label>
        </div>
      )}
      {(mode === 'rgb' || mode === 'lab') && (
        <div className="grid grid-cols-3 gap-2">
          {TRIPLES[mode].fields.map(([label, name], i) => (
            <TextField key={`${mode}-${name}`} label={label} name={name} inputMode={TRIPLES[mode].inputMode} value={draft[mode][i]}
              error={err(`origin.colour.${mode}.${i}`) ?? (i === 0 ? err(`origin.colour.${mode}`) : undefined)}
              onChange={(e) => { const t = [...draft[mode]] as Triple; t[i] = e.target.value; set({ [mode]: t }); }} />
          ))}
        </div>
      )}
      {(mode === 'hex' || mode === 'rgb' || mode === 'lab') && <p className="text-xs text-ink-mute">A colour has no spectrum of its own: Grisaille estimates a smooth one that gives the same colour in daylight (D65), and marks the swatch “estimated spectrum”.</p>}
      {mode === 'skin' && <SkinFields skin={draft.skin} onChange={(skin) => set({ skin })} errors={(k) => errUnder(k)} />}
      {mode === 'makeup' && <MakeupFields makeup={draft.makeup} onChange={(makeup) => set({ makeup })} swatches={swatches.filter((s) => s.id !== initial?.id)} errors={(k) => errUnder(k)} />}
      {mode === 'measured' && (
        <div className="grid gap-2">
          {keepMeasured && measuredNow && <p className="text-xs text-ink-mute">Keeps its measurement unless you choose another file.</p>}
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
                setTouched(true);
              }}
            />
          </label>
          <SelectField label="Values are" value={basis} onChange={(e) => setBasis(e.target.value as 'fraction' | 'percent')}>
            <option value="fraction">reflectance 0..1</option>
            <option value="percent">reflectance in %</option>
          </SelectField>
          {filePreview && 'pairs' in filePreview && <SpectrumLine pairs={filePreview.pairs} max={1} width={300} label={`Preview of the reflectance in ${fileName}`} />}
          {filePreview && 'error' in filePreview && <p role="alert" className="text-xs text-warn">{filePreview.error}</p>}
        </div>
      )}
      {colourErr && <p role="alert" className="text-xs text-warn">{colourErr}</p>}
      {preview?.(surface)}
      <LightStopsField value={lightStops} onChange={setLightStops} error={err('lightStops')} />
      <TextAreaField label="Notes" name="notes" rows={2} defaultValue={initial?.notes} error={err('notes')} />
      <ErrorMessage error={!placed && error} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" disabled={pending} className="self-start">{editing ? 'Save changes' : 'Add swatch'}</Button>
        {onCancel && <Button onClick={onCancel}>Cancel</Button>}
      </div>
    </form>
  );
}
