/**
 * The lamp plan as typed: text fields for every number, turned into a request and checked with the same
 * schema the server uses (shared/schemas/light-plan.ts), errors keyed by field path ("lamps.1.distanceM").
 */
import { lightPlanRequestSchema, type LightPlanRequest } from '../../../../shared/schemas/light-plan';
import { DEFAULT_CAMERA } from '../../../../shared/schemas/exposure';
import { DEFAULT_INCIDENT_C } from '../../../../shared/tone/light-level';
import { MODERN_SHADOW_DETAIL_STOPS } from '../../../../shared/tone/media-tone';

export type LampOutput = 'cd' | 'lm';

export interface LampDraft {
  /** a stable row id (React key; key and fill point at it) */
  id: number;
  name: string;
  output: LampOutput;
  intensityCd: string;
  lumens: string;
  beamAngleDeg: string;
  distanceM: string;
  angleDeg: string;
  sizeM: string;
}

export interface PlanDraft {
  ei: string;
  tStop: string;
  fps: string;
  shutterAngle: string;
  meterConstant: string;
  shadowDetailStops: string;
  lamps: LampDraft[];
  keyId: number | null;
  fillId: number | null;
}

export type CameraField = 'ei' | 'tStop' | 'fps' | 'shutterAngle' | 'meterConstant' | 'shadowDetailStops';

let nextId = 1;
export function newLamp(over: Partial<Omit<LampDraft, 'id'>> = {}): LampDraft {
  return { id: nextId++, name: '', output: 'cd', intensityCd: '', lumens: '', beamAngleDeg: '', distanceM: '', angleDeg: '0', sizeM: '', ...over };
}

/**
 * An example to start from (invented figures, not any product's): a hard key of 12,000 cd at 3 m, 30° off
 * the meter's axis, and a soft fill of 5,000 lm over a 90° beam at 5 m, its 1.2 m face too large to be a
 * point source that close.
 */
export function initialDraft(): PlanDraft {
  const key = newLamp({ name: 'Key', intensityCd: '12000', distanceM: '3', angleDeg: '30', sizeM: '0.3' });
  const fill = newLamp({ name: 'Fill', output: 'lm', lumens: '5000', beamAngleDeg: '90', distanceM: '5', angleDeg: '0', sizeM: '1.2' });
  return {
    ei: '250',
    tStop: String(DEFAULT_CAMERA.tStop),
    fps: String(DEFAULT_CAMERA.fps),
    shutterAngle: String(DEFAULT_CAMERA.shutterAngle),
    meterConstant: String(DEFAULT_INCIDENT_C),
    shadowDetailStops: String(MODERN_SHADOW_DETAIL_STOPS),
    lamps: [key, fill],
    keyId: key.id,
    fillId: fill.id,
  };
}

const num = (s: string): number | undefined => (s.trim() === '' ? undefined : Number(s));

/** The request the draft stands for (unchecked). */
export function draftToInput(d: PlanDraft): unknown {
  return {
    ei: num(d.ei),
    tStop: num(d.tStop),
    fps: num(d.fps),
    shutterAngle: num(d.shutterAngle),
    meterConstant: num(d.meterConstant),
    shadowDetailStops: num(d.shadowDetailStops),
    lamps: d.lamps.map((l) => ({
      name: l.name,
      ...(l.output === 'cd' ? { intensityCd: num(l.intensityCd) } : { lumens: num(l.lumens), beamAngleDeg: num(l.beamAngleDeg) }),
      distanceM: num(l.distanceM),
      angleDeg: num(l.angleDeg),
      sizeM: num(l.sizeM),
      role: l.id === d.keyId ? 'key' : l.id === d.fillId ? 'fill' : undefined,
    })),
  };
}

export interface CheckedDraft {
  request: LightPlanRequest | null;
  /** messages by field path: "tStop", "lamps.0.distanceM", "lamps" */
  errors: Record<string, string>;
}

/** The draft checked with the server's schema. */
export function checkDraft(d: PlanDraft): CheckedDraft {
  const parsed = lightPlanRequestSchema.safeParse(draftToInput(d));
  if (parsed.success) return { request: parsed.data, errors: {} };
  const errors: Record<string, string> = {};
  for (const i of parsed.error.issues) errors[i.path.map(String).join('.') || 'lamps'] ??= i.message;
  return { request: null, errors };
}
