import { useEffect, useId, useState, type ReactNode } from 'react';
import { toneSettingsSchema, type ToneSettings } from '../../../../shared/schemas/exposure';
import { mediumToneDefaults } from '../../../../shared/tone/media-tone';
import { developmentGammaFactor, developmentSpeedStops, DEVELOPMENT_STOPS_RANGE } from '../../../../shared/tone/development';
import { GRADE_RANGE } from '../../../../shared/tone/print';
import { formatStops } from '../../../../shared/tone/ei-chain';
import { roundToIsoSeries } from '../../../../shared/tone/iso-series';
import { ZONES } from '../../../lib/zones';

export interface ToneSettingsFormProps {
  /** the tone model's medium id: its defaults fill the placeholders */
  mediumId: string;
  value: ToneSettings;
  /** called with valid settings after each edit */
  onChange: (next: ToneSettings) => void;
  /** swatches that can be the key (from the board on the bench) */
  keySwatches?: { id: number; name: string }[];
  disabled?: boolean;
  /** which parts to show (default all): box speed, development and rating, print, key and thresholds */
  sections?: readonly ToneSection[];
}

export type ToneSection = 'box' | 'development' | 'print' | 'key';
const ALL_SECTIONS: readonly ToneSection[] = ['box', 'development', 'print', 'key'];

type Field = 'boxSpeed' | 'developmentStops' | 'ratingStops' | 'printGrade' | 'printExposureStops' | 'keySwatchId' | 'keyZone' | 'shadowDetailStops' | 'highlightRollOffStops';
const NULLABLE: Field[] = ['boxSpeed', 'keySwatchId', 'shadowDetailStops', 'highlightRollOffStops'];
const THIRDS = Array.from({ length: 19 }, (_, i) => Math.round(((i - 12) / 3) * 1000) / 1000); // −4 .. +2 stops
const control = 'w-full rounded-md border border-paper-line bg-paper-raised px-2 py-1 text-sm aria-[invalid=true]:border-warn disabled:bg-paper-sunk';

const toText = (v: ToneSettings): Record<Field, string> => ({
  boxSpeed: v.boxSpeed === null ? '' : String(v.boxSpeed),
  developmentStops: String(v.developmentStops),
  ratingStops: String(v.ratingStops),
  printGrade: String(v.printGrade),
  printExposureStops: String(v.printExposureStops),
  keySwatchId: v.keySwatchId === null ? '' : String(v.keySwatchId),
  keyZone: String(v.keyZone),
  shadowDetailStops: v.shadowDetailStops === null ? '' : String(v.shadowDetailStops),
  highlightRollOffStops: v.highlightRollOffStops === null ? '' : String(v.highlightRollOffStops),
});

/**
 * Development, rating, print and key settings of a look, checked with toneSettingsSchema (the server's own
 * schema) on every edit; the medium's defaults (box speed, thresholds) show as placeholders.
 */
export function ToneSettingsForm({ mediumId, value, onChange, keySwatches = [], disabled, sections = ALL_SECTIONS }: ToneSettingsFormProps) {
  const uid = useId();
  const d = mediumToneDefaults(mediumId);
  const [text, setText] = useState(() => toText(value));
  const [errors, setErrors] = useState<Partial<Record<Field, string>>>({});
  useEffect(() => {
    const t = toText(value);
    setText((cur) => (Object.keys(t) as Field[]).every((k) => Number(cur[k] || 'NaN') === Number(t[k] || 'NaN') || cur[k] === t[k]) ? cur : t);
  }, [value]);

  function edit(field: Field, v: string) {
    const next = { ...text, [field]: v };
    setText(next);
    const raw: Record<string, unknown> = { ...value };
    for (const k of Object.keys(next) as Field[]) {
      const s = next[k].trim();
      raw[k] = s === '' ? (NULLABLE.includes(k) ? null : undefined) : Number(s);
    }
    const parsed = toneSettingsSchema.safeParse(raw);
    if (!parsed.success) {
      const e: Partial<Record<Field, string>> = {};
      for (const i of parsed.error.issues) e[i.path[0] as Field] ??= i.message;
      return setErrors(e);
    }
    setErrors({});
    onChange(parsed.data);
  }

  const negative = d.kind === 'negative';
  const box = value.boxSpeed ?? d.boxSpeed ?? 100;
  const dev = clampDev(value.developmentStops);
  const input = (field: Field, extra: { step?: number; min?: number; max?: number; placeholder?: string }) => (
    <input id={`${uid}-${field}`} type="number" inputMode="decimal" className={control} value={text[field]} disabled={disabled || (!negative && field === 'developmentStops')}
      aria-invalid={!!errors[field]} onChange={(e) => edit(field, e.target.value)} {...extra} />
  );
  const row = (field: Field, label: string, control: ReactNode, hint?: ReactNode) => (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={`${uid}-${field}`} className="text-[11px] text-ink-soft">{label}</label>
      {control}
      {errors[field] ? <span role="alert" className="text-[11px] text-warn">{errors[field]}</span> : hint && <span className="text-[11px] text-ink-mute">{hint}</span>}
    </div>
  );

  if (d.kind === 'eye') {
    return <p className="text-sm text-ink-mute">The eye is shown as it sees: no development, rating or print to set.</p>;
  }
  const show = (x: ToneSection) => sections.includes(x);
  const boxField = row('boxSpeed', 'Box speed (ISO)', input('boxSpeed', { step: 1, min: 1, placeholder: `${d.boxSpeed} (medium)` }), value.boxSpeed === null ? 'the medium’s own' : 'set for this look');
  const legend = 'mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft';
  return (
    <form className="space-y-3" aria-label="Development, print and key" onSubmit={(e) => e.preventDefault()}>
      {show('development') && (
        <fieldset className="grid grid-cols-3 gap-2">
          <legend className={legend}>Development and rating</legend>
          {show('box') ? boxField : <span />}
          {row('developmentStops', negative ? 'Push / pull (stops)' : 'Push / pull (film only)',
            input('developmentStops', { step: 0.5, min: DEVELOPMENT_STOPS_RANGE[0], max: DEVELOPMENT_STOPS_RANGE[1] }),
            negative ? `gamma ×${developmentGammaFactor(dev).toFixed(2)}, shadow speed ${formatStops(developmentSpeedStops(dev))} stop` : undefined)}
          {row('ratingStops', 'Rating (stops)', (
            <select id={`${uid}-ratingStops`} className={control} disabled={disabled} value={nearestThird(value.ratingStops)} onChange={(e) => edit('ratingStops', e.target.value)}>
              {THIRDS.map((t) => <option key={t} value={t}>{formatStops(t)} → EI {roundToIsoSeries(box * 2 ** t)}</option>)}
            </select>
          ), 'rated slower (−) gives more shadow room')}
        </fieldset>
      )}
      {show('print') && (
        <fieldset className="grid grid-cols-3 gap-2">
          <legend className={legend}>{negative ? 'Print' : 'Display'}</legend>
          {row('printGrade', 'Contrast grade', input('printGrade', { step: 0.5, min: GRADE_RANGE[0], max: GRADE_RANGE[1] }), '2 is normal; higher is harder')}
          {row('printExposureStops', `${negative ? 'Print' : 'Display'} exposure (stops)`, input('printExposureStops', { step: 1 / 3, min: -6, max: 6 }), '+ prints darker')}
        </fieldset>
      )}
      {show('key') && (
        <fieldset className="grid grid-cols-3 gap-2">
          <legend className={legend}>Key and thresholds</legend>
          {row('keySwatchId', 'Key', (
            <select id={`${uid}-keySwatchId`} className={control} disabled={disabled} value={text.keySwatchId} onChange={(e) => edit('keySwatchId', e.target.value)}>
              <option value="">Middle grey (18 %)</option>
              {keySwatches.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
              {value.keySwatchId !== null && !keySwatches.some((s) => s.id === value.keySwatchId) && <option value={value.keySwatchId}>swatch {value.keySwatchId}</option>}
            </select>
          ))}
          {row('keyZone', 'on zone', (
            <select id={`${uid}-keyZone`} className={control} disabled={disabled} value={Math.round(value.keyZone)} onChange={(e) => edit('keyZone', e.target.value)}>
              {ZONES.map(({ zone: z, numeral: n }) => <option key={n} value={z}>zone {n}</option>)}
            </select>
          ))}
          {show('box') && !show('development') ? boxField : <span />}
          {row('shadowDetailStops', 'Shadow detail (stops under key)', input('shadowDetailStops', { step: 0.5, min: 0.5, max: 12, placeholder: `${d.shadowDetailStops} (medium)` }), 'texture is lost below this')}
          {row('highlightRollOffStops', 'Highlight roll-off (stops over key)', input('highlightRollOffStops', { step: 0.5, min: 0.5, max: 12, placeholder: `${Number(d.highlightRollOffStops.toFixed(1))} (medium)` }), 'highlights blow above this')}
        </fieldset>
      )}
    </form>
  );
}

function nearestThird(stops: number): number {
  return THIRDS.reduce((best, t) => (Math.abs(t - stops) < Math.abs(best - stops) ? t : best), THIRDS[0]);
}
function clampDev(s: number): number {
  return Math.min(DEVELOPMENT_STOPS_RANGE[1], Math.max(DEVELOPMENT_STOPS_RANGE[0], s));
}
