import { useId } from 'react';
import type { LookView } from '../../../../shared/schemas/look';
import type { ExposureSheet } from '../../../../shared/schemas/sheet';
import { CLASSIC_SHADOW_DETAIL_STOPS, MODERN_SHADOW_DETAIL_STOPS } from '../../../../shared/tone/media-tone';
import { INCIDENT_C_HEMISPHERICAL } from '../../../../shared/tone/light-level';
import { formatEI } from '../../../../shared/tone/exposure-format';
import type { CameraField, PlanDraft } from '../lib/plan-draft';

export interface PlanSetupProps {
  looks: LookView[];
  /** the chosen look, or null: the gaffer types an EI */
  lookId: number | null;
  onLook: (id: number | null) => void;
  sheet: ExposureSheet | undefined;
  sheetLoading: boolean;
  draft: PlanDraft;
  errors: Record<string, string>;
  onField: (field: CameraField, value: string) => void;
}

const FIELDS: { key: Exclude<CameraField, 'ei' | 'shadowDetailStops'>; label: string; unit: string; step: number }[] = [
  { key: 'tStop', label: 'T-stop', unit: '', step: 0.1 },
  { key: 'fps', label: 'Frame rate', unit: 'fps', step: 1 },
  { key: 'shutterAngle', label: 'Shutter', unit: '°', step: 1 },
  { key: 'meterConstant', label: 'Meter C', unit: 'lux·s', step: 1 },
];

const input = 'w-full rounded-md border border-paper-line bg-paper-raised px-2 py-1 text-sm tabular-nums aria-[invalid=true]:border-warn read-only:bg-paper-sunk';

/** The look (or a typed EI), the camera and meter, and the medium's shadow-detail threshold the plan is for. */
export function PlanSetup({ looks, lookId, onLook, sheet, sheetLoading, draft, errors, onField }: PlanSetupProps) {
  const uid = useId();
  const fromLook = lookId !== null && !!sheet?.chain;
  const field = (key: CameraField, label: string, unit: string, step: number, readOnly = false) => (
    <div key={key} className="flex flex-col gap-0.5">
      <label htmlFor={`${uid}-${key}`} className="whitespace-nowrap text-[11px] text-ink-soft">{label}{unit && <span className="text-ink-mute"> ({unit})</span>}</label>
      <input
        id={`${uid}-${key}`}
        type="number"
        inputMode="decimal"
        step={step}
        value={draft[key]}
        readOnly={readOnly}
        aria-invalid={!!errors[key]}
        onChange={(e) => onField(key, e.target.value)}
        className={input}
      />
      {errors[key] && <span role="alert" className="text-[11px] text-warn">{errors[key]}</span>}
    </div>
  );
  return (
    <section aria-label="Look and camera" className="flex flex-col gap-3">
      <div className="flex flex-col gap-1">
        <label htmlFor={`${uid}-look`} className="text-xs font-medium uppercase tracking-wide text-ink-soft">Look</label>
        <select
          id={`${uid}-look`}
          value={lookId ?? ''}
          onChange={(e) => onLook(e.target.value ? Number(e.target.value) : null)}
          className="w-full rounded-md border border-paper-line bg-paper-raised px-2 py-1.5 text-sm"
        >
          <option value="">Type an EI instead</option>
          {looks.map((l) => <option key={l.id} value={l.id}>{l.name}</option>)}
        </select>
        {lookId !== null && sheetLoading && <p className="text-[11px] text-ink-mute">Working out the look’s EI…</p>}
        {lookId !== null && sheet && !sheet.chain && <p className="text-[11px] text-warn">This look is seen by the eye and has no EI: type one.</p>}
        {fromLook && sheet?.chain && (
          <p className="text-[11px] leading-snug text-ink-mute" data-testid="plan-ei-source">
            Effective {formatEI(sheet.chain.effectiveEI)} from the look: box {sheet.chain.boxSpeed}, {sheet.chain.steps.map((s) => `${s.label.toLowerCase()} ${s.stopsLabel}`).slice(1).join(', ')} ({sheet.lightPath.medium}, {sheet.lightPath.light}).
          </p>
        )}
      </div>
      <div className="grid grid-cols-2 gap-2">
        {field('ei', 'Exposure index', 'EI', 1, fromLook)}
        {FIELDS.map((f) => field(f.key, f.label, f.unit, f.step))}
        {field('shadowDetailStops', 'Shadow detail', 'stops', 0.5)}
      </div>
      <p className="text-[11px] leading-snug text-ink-mute">
        Meter C = 250 lux·s is ISO 2720’s flat receptor (the app’s default); hemispherical meters read near {INCIDENT_C_HEMISPHERICAL}.
        Shadow detail: how far under the key the medium holds texture — {fromLook ? 'the look’s own setting; ' : ''}a classic negative about {CLASSIC_SHADOW_DETAIL_STOPS} stops, a modern one about {MODERN_SHADOW_DETAIL_STOPS} (the trade’s rule).
      </p>
    </section>
  );
}
