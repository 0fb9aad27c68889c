/**
 * ISO speed of a black-and-white pictorial negative, after ISO 6:1993.
 *
 * Point M: the exposure Hm (lux·s) at which density is 0.10 above base + fog.
 * Point N: 1.30 log10-exposure units beyond M; the development is the standard one when the density
 * at N is 0.80 (± 0.05) higher than at M. The arithmetic speed is then S = 0.8 / Hm, given as the
 * nearest label of the third-stop series.
 */
import { type CharacteristicCurve, type CurveShape, curveThroughPoint, density, makeCurve, netDensity, solveIncreasing } from './characteristic-curve';
import { roundToIsoSeries } from './iso-series';

/** ISO 6:1993: net density of the speed point M. */
export const ISO6_SPEED_POINT_NET_DENSITY = 0.1;
/** ISO 6:1993: log10 exposure interval from M to N. */
export const ISO6_LOG_H_INTERVAL = 1.3;
/** ISO 6:1993: density rise from M to N under the standard development. */
export const ISO6_DENSITY_RISE = 0.8;
/** ISO 6:1993: allowed deviation of that rise. */
export const ISO6_DENSITY_RISE_TOLERANCE = 0.05;
/** ISO 6:1993: the constant in S = 0.8 / Hm (lux·s). */
export const ISO6_SPEED_CONSTANT = 0.8;

export interface IsoSpeedResult {
  /** log10 Hm, lux·s */
  logHm: number;
  /** Hm, lux·s */
  hmLuxSeconds: number;
  /** arithmetic speed 0.8 / Hm, unrounded */
  speed: number;
  /** the speed rounded to the ISO third-stop series */
  nominalSpeed: number;
  /** density at N minus density at M */
  densityRise: number;
  /** true when densityRise is 0.80 ± 0.05, i.e. the development meets the ISO 6 condition */
  contrastMet: boolean;
}

/**
 * ISO 6:1993 speed of any monotonic curve given as a function: `densityAt(logH)` → total density,
 * with logH = log10 exposure in lux·s, and the curve's base + fog density. Numeric (bisection).
 * Throws a RangeError when the curve never reaches 0.10 above base + fog in 1e-12..1e8 lux·s.
 */
export function isoSpeed(densityAt: (logH: number) => number, baseFog: number): IsoSpeedResult {
  const logHm = solveIncreasing(densityAt, baseFog + ISO6_SPEED_POINT_NET_DENSITY);
  if (!Number.isFinite(logHm)) throw new RangeError('the curve never reaches 0.10 above base + fog');
  const hm = 10 ** logHm;
  const densityRise = densityAt(logHm + ISO6_LOG_H_INTERVAL) - densityAt(logHm);
  const speed = ISO6_SPEED_CONSTANT / hm;
  return {
    logHm,
    hmLuxSeconds: hm,
    speed,
    nominalSpeed: roundToIsoSeries(speed),
    densityRise,
    contrastMet: Math.abs(densityRise - ISO6_DENSITY_RISE) <= ISO6_DENSITY_RISE_TOLERANCE + 1e-12,
  };
}

/** ISO 6:1993 speed of a modelled characteristic curve (see isoSpeed). */
export function isoSpeedOfCurve(c: CharacteristicCurve): IsoSpeedResult {
  return isoSpeed((x) => density(c, x), c.baseFog);
}

/** The ISO 6 density rise M → N of a curve shape at straight-line slope `gamma` (position-independent). */
function densityRiseAt(shape: CurveShape, gamma: number): number {
  const c = makeCurve({ ...shape, gamma, inertiaLogH: 0 });
  const xm = solveIncreasing((x) => netDensity(c, x), ISO6_SPEED_POINT_NET_DENSITY);
  return netDensity(c, xm + ISO6_LOG_H_INTERVAL) - ISO6_SPEED_POINT_NET_DENSITY;
}

/**
 * The straight-line gamma at which a curve of this shape meets the ISO 6 contrast condition exactly
 * (rise 0.80 over 1.30 log units from the speed point). Density per log10 exposure. Bisection.
 */
export function isoContrastGamma(shape: CurveShape): number {
  if (!(shape.dMax - shape.baseFog > ISO6_SPEED_POINT_NET_DENSITY + ISO6_DENSITY_RISE)) {
    throw new RangeError('the curve range is too short for the ISO 6 contrast condition');
  }
  return solveIncreasing((g) => densityRiseAt(shape, g), ISO6_DENSITY_RISE, 0.05, 20);
}

/**
 * A curve of the given shape developed to the ISO 6 contrast and placed so that its ISO speed is
 * `speed` exactly (Hm = 0.8 / speed lux·s). Used for each medium's normal development at box speed.
 */
export function curveForIsoSpeed(shape: CurveShape, speed: number): CharacteristicCurve {
  if (!(speed > 0)) throw new RangeError('speed must be positive');
  const gamma = isoContrastGamma(shape);
  return curveThroughPoint(shape, gamma, Math.log10(ISO6_SPEED_CONSTANT / speed), ISO6_SPEED_POINT_NET_DENSITY);
}
