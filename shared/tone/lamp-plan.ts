/**
 * The lamp plan: lamps by intensity and distance against the incident level a look needs (ISO 2720, from
 * light-level.ts), and the key-to-fill ratio against the medium's shadow-detail threshold.
 *
 * Photometry of a point source: E = I · cos θ / d² (inverse-square and cosine laws), I in candela, d in
 * metres, θ the angle of incidence at the subject, E in lux. A point-source model is good to about 1 %
 * once the distance is at least five times the source's largest dimension (the photometric "five-times
 * rule", common practice); closer than that a broad source (a soft box, a book light, a large frame) falls
 * off more slowly than inverse-square and the figures below read too high.
 *
 * A lamp given by lumens and beam angle is modelled as a uniform cone: I = Φ / (2π (1 − cos(α / 2))),
 * the flux spread evenly over the solid angle of a cone of full angle α. A model: real beams peak in the
 * middle and fall off towards the edge, so a measured candela figure is better when there is one.
 */
import { lightLevel, luxToFootcandles, type LightLevel } from './light-level';

/** The photometric five-times rule (common practice): a source is a point once d ≥ 5 × its size. */
export const POINT_SOURCE_DISTANCE_RATIO = 5;

/**
 * Luminous intensity, cd, of `lumens` (lm) spread evenly over a cone of full angle `beamAngleDeg` (°,
 * 0 < α ≤ 360): I = Φ / (2π (1 − cos(α/2))). A uniform-cone model, not a real lamp's beam.
 */
export function coneIntensityCd(lumens: number, beamAngleDeg: number): number {
  if (!(lumens > 0)) throw new RangeError('lumens must be positive');
  if (!(beamAngleDeg > 0 && beamAngleDeg <= 360)) throw new RangeError('beam angle must be in (0, 360] degrees');
  const halfRad = (beamAngleDeg * Math.PI) / 360;
  return lumens / (2 * Math.PI * (1 - Math.cos(halfRad)));
}

/**
 * Illuminance, lux, of a point source of `intensityCd` (cd) at `distanceM` (m), arriving `angleDeg`
 * (°, 0 ≤ θ < 90) off the receptor's axis: E = I · cos θ / d² (inverse-square and cosine laws).
 */
export function illuminanceLux(intensityCd: number, distanceM: number, angleDeg = 0): number {
  if (!(intensityCd > 0)) throw new RangeError('intensity must be positive');
  if (!(distanceM > 0)) throw new RangeError('distance must be positive');
  if (!(angleDeg >= 0 && angleDeg < 90)) throw new RangeError('angle must be in [0, 90) degrees');
  return (intensityCd * Math.cos((angleDeg * Math.PI) / 180)) / (distanceM * distanceM);
}

/** Stops of `lux` against `neededLux`: log2(lux / needed); + is more light than needed. */
export function stopsVersus(lux: number, neededLux: number): number {
  if (!(lux > 0) || !(neededLux > 0)) throw new RangeError('illuminances must be positive');
  return Math.log2(lux / neededLux);
}

export interface PointSourceCheck {
  /** the source's largest dimension as given, m; null when not given */
  sizeM: number | null;
  /** the nearest distance the inverse-square figure holds at (5 × size), m; null when the size is unknown */
  minDistanceM: number | null;
  /** true: far enough; false: too close, the figure reads high; null: size not given */
  ok: boolean | null;
  note: string;
}

const m = (v: number) => `${Number(v.toPrecision(3))} m`;

/** Whether a lamp of size `sizeM` (m, optional) at `distanceM` (m) is far enough to be a point source (five-times rule). */
export function pointSourceCheck(distanceM: number, sizeM?: number | null): PointSourceCheck {
  if (sizeM === undefined || sizeM === null) {
    return {
      sizeM: null,
      minDistanceM: null,
      ok: null,
      note: `Size not given: the figure assumes the source is no larger than ${m(distanceM / POINT_SOURCE_DISTANCE_RATIO)} (a fifth of its distance).`,
    };
  }
  const min = sizeM * POINT_SOURCE_DISTANCE_RATIO;
  const ok = distanceM >= min;
  return {
    sizeM,
    minDistanceM: min,
    ok,
    note: ok
      ? `Far enough to count as a point source (${m(distanceM)} ≥ 5 × ${m(sizeM)}).`
      : `Too close for the point-source model: ${m(distanceM)} is under 5 × its ${m(sizeM)} size (${m(min)}); a broad source gives less than this figure there (it falls off more slowly than inverse-square). Meter it.`,
  };
}

export interface LampSpec {
  name: string;
  /** luminous intensity on the beam axis, cd */
  intensityCd?: number;
  /** luminous flux, lm (with beamAngleDeg, instead of intensityCd) */
  lumens?: number;
  /** full beam angle, ° (with lumens) */
  beamAngleDeg?: number;
  /** lamp to subject, m */
  distanceM: number;
  /** angle of incidence at the subject, off the meter's axis, °; default 0 */
  angleDeg?: number;
  /** the source's largest dimension (lens, reflector, soft box face), m */
  sizeM?: number;
  /** this lamp is the key or the fill of the key-to-fill ratio */
  role?: 'key' | 'fill';
}

export interface LampResult {
  name: string;
  role: 'key' | 'fill' | null;
  intensityCd: number;
  /** 'given' (candela) or 'cone' (lumens and beam angle through the uniform-cone model) */
  intensityFrom: 'given' | 'cone';
  distanceM: number;
  angleDeg: number;
  lux: number;
  fc: number;
  /** log2(lux / needed lux) */
  stopsVsNeeded: number;
  pointSource: PointSourceCheck;
}

/** The lighting ratio: key side (key + fill) against shadow side (fill only). */
export interface KeyToFill {
  keyName: string;
  fillName: string;
  keyLux: number;
  fillLux: number;
  /** (key + fill) / fill */
  ratio: number;
  /** log2(ratio) */
  stops: number;
  /** the medium's shadow-detail threshold, stops under the key */
  thresholdStops: number;
  /** true when the shadow side falls further under the key than the medium holds detail */
  exceeds: boolean;
  /** the farthest the fill can stand (same angle) and keep the shadow side within the threshold, m */
  fillMaxDistanceM: number;
}

/**
 * The key-to-fill ratio in stops, log2((K + F) / F) (lux of key and fill at the subject; the key side
 * gets both, the shadow side the fill only — the trade's lighting ratio), against `thresholdStops`, and
 * the fill distance that meets it: F' = K / (2^T − 1), d' = d · √(F / F') by the inverse-square law.
 */
export function keyToFill(key: LampResult, fill: LampResult, thresholdStops: number): KeyToFill {
  if (!(thresholdStops > 0)) throw new RangeError('threshold must be positive');
  const ratio = (key.lux + fill.lux) / fill.lux;
  const stops = Math.log2(ratio);
  const fillNeeded = key.lux / (2 ** thresholdStops - 1);
  return {
    keyName: key.name,
    fillName: fill.name,
    keyLux: key.lux,
    fillLux: fill.lux,
    ratio,
    stops,
    thresholdStops,
    exceeds: stops > thresholdStops,
    fillMaxDistanceM: fill.distanceM * Math.sqrt(fill.lux / fillNeeded),
  };
}

export interface LampPlanInput {
  ei: number;
  tStop: number;
  fps: number;
  shutterAngle: number;
  /** incident-meter constant C, lux·s; default the app's (light-level.ts) */
  meterConstant?: number;
  lamps: LampSpec[];
  /** stops under the key where the medium loses shadow detail */
  shadowDetailStops: number;
}

export interface LampPlan {
  needed: LightLevel;
  lamps: LampResult[];
  totalLux: number;
  totalFc: number;
  stopsVsNeeded: number;
  keyToFill: KeyToFill | null;
}

/** One lamp's contribution at the subject. */
export function lampResult(spec: LampSpec, neededLux: number): LampResult {
  const fromCone = spec.intensityCd === undefined;
  const intensityCd = fromCone ? coneIntensityCd(spec.lumens ?? NaN, spec.beamAngleDeg ?? NaN) : spec.intensityCd!;
  const angleDeg = spec.angleDeg ?? 0;
  const lux = illuminanceLux(intensityCd, spec.distanceM, angleDeg);
  return {
    name: spec.name,
    role: spec.role ?? null,
    intensityCd,
    intensityFrom: fromCone ? 'cone' : 'given',
    distanceM: spec.distanceM,
    angleDeg,
    lux,
    fc: luxToFootcandles(lux),
    stopsVsNeeded: stopsVersus(lux, neededLux),
    pointSource: pointSourceCheck(spec.distanceM, spec.sizeM),
  };
}

/**
 * The whole plan: the level needed (ISO 2720 through lightLevel), each lamp's lux, fc and stops against
 * it, the total (illuminances add), and the key-to-fill ratio when one lamp is the key and one the fill.
 */
export function lampPlan(input: LampPlanInput): LampPlan {
  const needed = lightLevel({ ei: input.ei, tStop: input.tStop, fps: input.fps, shutterAngle: input.shutterAngle, calibrationConstant: input.meterConstant });
  const lamps = input.lamps.map((l) => lampResult(l, needed.lux));
  const totalLux = lamps.reduce((s, l) => s + l.lux, 0);
  const key = lamps.find((l) => l.role === 'key');
  const fill = lamps.find((l) => l.role === 'fill');
  return {
    needed,
    lamps,
    totalLux,
    totalFc: luxToFootcandles(totalLux),
    stopsVsNeeded: stopsVersus(totalLux, needed.lux),
    keyToFill: key && fill ? keyToFill(key, fill, input.shadowDetailStops) : null,
  };
}
