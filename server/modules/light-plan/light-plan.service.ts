import { DEFAULT_PLAN_SHADOW_DETAIL_STOPS, type LightPlanRequest, type LightPlanResponse } from '../../../shared/schemas/light-plan';
import { SHEET_CAUTIONS } from '../../../shared/schemas/sheet';
import { lampPlan, POINT_SOURCE_DISTANCE_RATIO } from '../../../shared/tone/lamp-plan';
import { DEFAULT_INCIDENT_C, DEFAULT_INCIDENT_C_NOTE } from '../../../shared/tone/light-level';

/**
 * Very bright at the subject: over 10,000 lux, the level of bright daylight (common figure, not a limit
 * from a standard); the plan then says so beside the cautions.
 */
export const VERY_BRIGHT_LUX = 10_000;

/** What the figures assume, in plain words (answered with every plan). */
export const LIGHT_PLAN_MODEL: readonly string[] = Object.freeze([
  'Each lamp is a point source aimed at the subject: E = I·cos θ / d² (inverse-square and cosine laws), θ the angle off the meter’s axis. Illuminances of several lamps add.',
  `The point-source figure holds once the lamp is at least ${POINT_SOURCE_DISTANCE_RATIO} times its own size away (the five-times rule); nearer, a broad, even source gives less light than the figure.`,
  'A lamp given by lumens and beam angle is modelled as a uniform cone, I = Φ / (2π(1 − cos(α/2))). Real beams peak in the middle and fall off at the edge: prefer a measured candela figure.',
  'Level needed: ISO 2720 incident metering, E = C·N² / (t·EI), t = shutter angle / (360 · fps). 1 fc = 10.7639 lux.',
  'Key-to-fill: the key side gets key and fill, the shadow side the fill only; ratio = (key + fill) / fill, in stops log2 of it.',
]);

const fmt = (v: number, d = 1) => Number(v.toFixed(d)).toString();

/** POST /api/light-plan: the plan of shared/tone/lamp-plan.ts with its notes, warnings and cautions. Input checked by the schema. */
export function computeLightPlan(req: LightPlanRequest): LightPlanResponse {
  const shadowDetailStops = req.shadowDetailStops ?? DEFAULT_PLAN_SHADOW_DETAIL_STOPS;
  const plan = lampPlan({ ...req, shadowDetailStops });
  const c = plan.needed.calibrationConstant;
  const warnings: string[] = [];
  for (const l of plan.lamps) {
    if (l.pointSource.ok === false) warnings.push(`${l.name}: ${l.pointSource.note}`);
  }
  const coned = plan.lamps.filter((l) => l.intensityFrom === 'cone').map((l) => l.name);
  if (coned.length) warnings.push(`${coned.join(', ')}: intensity from lumens and beam angle (uniform-cone model); the middle of a real beam is brighter, its edge dimmer.`);
  const unsized = plan.lamps.filter((l) => l.pointSource.ok === null).map((l) => l.name);
  if (unsized.length) warnings.push(`${unsized.join(', ')}: no size given; each figure assumes the source is no larger than a fifth of its distance.`);
  if (plan.totalLux > VERY_BRIGHT_LUX) {
    warnings.push(`The subject gets ${Math.round(plan.totalLux).toLocaleString('en-GB')} lux, more than bright daylight: expect heat and glare; keep the units off performers’ eyes and give breaks from the light.`);
  }
  const k = plan.keyToFill;
  return {
    ei: req.ei,
    tStop: req.tStop,
    fps: req.fps,
    shutterAngle: req.shutterAngle,
    exposureSeconds: plan.needed.exposureSeconds,
    meterConstant: c,
    meterNote: req.meterConstant === undefined || c === DEFAULT_INCIDENT_C ? DEFAULT_INCIDENT_C_NOTE : `incident-light constant C = ${c} lux·s as given (E in lux)`,
    neededLux: plan.needed.lux,
    neededFc: plan.needed.footcandles,
    lamps: plan.lamps,
    totalLux: plan.totalLux,
    totalFc: plan.totalFc,
    stopsVsNeeded: plan.stopsVsNeeded,
    shadowDetailStops,
    keyToFill: k && {
      ...k,
      text: k.exceeds
        ? `Key-to-fill ${fmt(k.ratio)}:1 (${fmt(k.stops)} stops) is past the medium’s ${fmt(shadowDetailStops)} stops of shadow detail: bring ${k.fillName} to ${fmt(k.fillMaxDistanceM, 2)} m or closer, or dim the key.`
        : `Key-to-fill ${fmt(k.ratio)}:1 (${fmt(k.stops)} stops), within the medium’s ${fmt(shadowDetailStops)} stops of shadow detail.`,
    },
    model: LIGHT_PLAN_MODEL,
    warnings,
    cautions: SHEET_CAUTIONS,
  };
}
