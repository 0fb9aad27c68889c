import { useEffect, useId, useState } from 'react';
import { lightLevelTable, type CameraSettings, type ExposurePlan } from '../../../../shared/tone/exposure-plan';
import { formatFootcandles, formatLux, formatSeconds, formatStopsLabel, formatTStop } from '../../../../shared/tone/exposure-format';
import { DEFAULT_INCIDENT_C, INCIDENT_C_FLAT, INCIDENT_C_HEMISPHERICAL } from '../../../../shared/tone/light-level';
import { SHORT_CAUTION } from '../../../../shared/schemas/sheet';
import { toneSettingsSchema } from '../../../../shared/schemas/exposure';

export interface LightLevelPanelProps {
  plan: ExposurePlan;
  camera: Required<CameraSettings>;
  /** called with a valid camera after each edit; without it the fields are read-only */
  onCameraChange?: (camera: Required<CameraSettings>) => void;
}

type Key = keyof Required<CameraSettings>;
const FIELDS: { key: Key; label: string; unit: string; title: string; step: number }[] = [
  { key: 'tStop', label: 'T-stop', unit: '', title: 'T-stop', step: 0.1 },
  { key: 'fps', label: 'Frame rate', unit: 'fps', title: 'frames per second', step: 1 },
  { key: 'shutterAngle', label: 'Shutter', unit: '°', title: 'shutter angle, degrees', step: 1 },
  { key: 'calibrationConstant', label: 'Meter C', unit: 'lux·s', title: 'incident-meter calibration constant C, lux·s (ISO 2720)', step: 1 },
];
const camShape = toneSettingsSchema.pick({ tStop: true, fps: true, shutterAngle: true, calibrationConstant: true });

/**
 * The incident light the set needs at the effective EI (ISO 2720, E = C·N²/(t·S)), in foot-candles and lux,
 * with the T-stop, frame rate, shutter angle and meter constant shown and settable, what the filter costs in
 * light against the unfiltered look, a few common T-stops, and the short cautions.
 */
export function LightLevelPanel({ plan, camera, onCameraChange }: LightLevelPanelProps) {
  const uid = useId();
  const [draft, setDraft] = useState<Record<Key, string>>(() => toDraft(camera));
  const [errors, setErrors] = useState<Partial<Record<Key, string>>>({});
  useEffect(() => setDraft((d) => (sameCamera(d, camera) ? d : toDraft(camera))), [camera]);

  function edit(key: Key, text: string) {
    const next = { ...draft, [key]: text };
    setDraft(next);
    const parsed = camShape.safeParse(Object.fromEntries(Object.entries(next).map(([k, v]) => [k, v.trim() === '' ? undefined : Number(v)])));
    if (!parsed.success) {
      const e: Partial<Record<Key, string>> = {};
      for (const i of parsed.error.issues) e[i.path[0] as Key] ??= i.message;
      return setErrors(e);
    }
    setErrors({});
    onCameraChange?.(parsed.data);
  }

  const rows = lightLevelTable(plan.chain.effectiveEI, camera);
  const hasOwn = rows.some((r) => Math.abs(r.tStop - camera.tStop) < 1e-9);
  const table = hasOwn ? rows : [...rows, ...lightLevelTable(plan.chain.effectiveEI, camera, [camera.tStop])].sort((a, b) => a.tStop - b.tStop);
  const filtered = plan.cost.ratio > 1.005;

  return (
    <section aria-label="Light level">
      <h3 className="mb-2 text-xs font-medium uppercase tracking-wide text-ink-soft">Light level</h3>
      <div className="grid grid-cols-4 gap-2">
        {FIELDS.map((f) => (
          <div key={f.key} className="flex flex-col gap-0.5">
            <label htmlFor={`${uid}-${f.key}`} title={f.title} className="whitespace-nowrap text-[11px] text-ink-soft">{f.label}{f.unit && <span className="text-ink-mute"> ({f.unit})</span>}</label>
            <input
              id={`${uid}-${f.key}`}
              type="number"
              inputMode="decimal"
              step={f.step}
              value={draft[f.key]}
              readOnly={!onCameraChange}
              aria-invalid={!!errors[f.key]}
              onChange={(e) => edit(f.key, e.target.value)}
              className="w-full rounded-md border border-paper-line bg-paper-raised px-2 py-1 text-sm aria-[invalid=true]:border-warn read-only:bg-paper-sunk"
            />
            {errors[f.key] && <span role="alert" className="text-[11px] text-warn">{errors[f.key]}</span>}
          </div>
        ))}
      </div>
      <p className="mt-1 text-[11px] text-ink-mute">
        {formatSeconds(plan.light.exposureSeconds)} exposure. C = {INCIDENT_C_FLAT} lux·s is ISO 2720’s flat-receptor constant{camera.calibrationConstant === DEFAULT_INCIDENT_C ? ' (in use)' : ''}; hemispherical meters read near {INCIDENT_C_HEMISPHERICAL}.
      </p>

      <div className="mt-3 grid grid-cols-2 gap-2">
        <p className="rounded-md bg-ink px-3 py-2 text-paper">
          <span className="block text-xs opacity-80">Incident light at {formatTStop(camera.tStop)}, EI {plan.chain.effectiveEI}</span>
          <span className="text-2xl font-semibold tabular-nums" data-testid="light-fc">{formatFootcandles(plan.light.footcandles)}</span>
        </p>
        <p className="rounded-md border border-paper-line px-3 py-2">
          <span className="block text-xs text-ink-mute">the same in lux</span>
          <span className="text-2xl font-semibold tabular-nums" data-testid="light-lux">{formatLux(plan.light.lux)}</span>
        </p>
      </div>
      <p className={`mt-2 rounded-md px-3 py-2 text-sm ${filtered ? 'bg-warn-soft' : 'bg-paper-sunk'}`} data-testid="light-cost">
        {filtered ? (
          <>This look <strong>{plan.cost.text}</strong> ({formatStopsLabel(plan.cost.stops)}): {formatFootcandles(plan.light.footcandles)} instead of {formatFootcandles(plan.unfilteredLight.footcandles)}.</>
        ) : (
          <>This look {plan.cost.text}.</>
        )}
      </p>

      <table className="mt-3 w-full text-sm">
        <caption className="mb-1 text-left text-[11px] text-ink-mute">At EI {plan.chain.effectiveEI}, {camera.fps} fps, {camera.shutterAngle}°</caption>
        <thead className="text-left text-[11px] uppercase tracking-wide text-ink-mute">
          <tr><th className="font-medium">T-stop</th><th className="text-right font-medium">fc</th><th className="text-right font-medium">lux</th></tr>
        </thead>
        <tbody>
          {table.map((r) => (
            <tr key={r.tStop} className={Math.abs(r.tStop - camera.tStop) < 1e-9 ? 'font-semibold' : ''}>
              <td>{formatTStop(r.tStop)}</td>
              <td className="text-right">{formatFootcandles(r.footcandles)}</td>
              <td className="text-right">{formatLux(r.lux)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-3 border-l-2 border-warn pl-2 text-[11px] leading-snug text-ink-soft" data-testid="light-caution">
        <strong className="text-warn">Caution.</strong> {SHORT_CAUTION}
      </p>
    </section>
  );
}

function toDraft(c: Required<CameraSettings>): Record<Key, string> {
  return { tStop: String(c.tStop), fps: String(c.fps), shutterAngle: String(c.shutterAngle), calibrationConstant: String(c.calibrationConstant) };
}
function sameCamera(d: Record<Key, string>, c: Required<CameraSettings>): boolean {
  return (Object.keys(d) as Key[]).every((k) => Number(d[k]) === c[k]);
}
