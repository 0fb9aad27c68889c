/**
 * Development: pushing (+ stops) or pulling (− stops) the negative.
 *
 * Model (Grisaille's own, a simple model of common practice): each stop of push multiplies the
 * straight-line gamma by `gammaFactorPerStop` (pulling divides it), moves the speed point by
 * `speedStopsPerStop` stops (a push gains only part of its nominal stop in true shadow speed; a pull
 * loses part of one), and adds `fogPerStop` density of fog per stop of push (none is taken away by a pull).
 */
import { type CharacteristicCurve, makeCurve, netDensity, solveIncreasing } from './characteristic-curve';
import { ISO6_SPEED_POINT_NET_DENSITY } from './iso-speed';

export interface DevelopmentModel {
  /** gamma multiplier per stop of push (> 1); a pull of p stops gives factor^p < 1 */
  gammaFactorPerStop: number;
  /** stops of real speed gained per stop of push (lost per stop of pull), 0..1 */
  speedStopsPerStop: number;
  /** extra base + fog density per stop of push */
  fogPerStop: number;
}

/**
 * Grisaille's default development model (assumption, common practice from memory: a one-stop push raises
 * contrast by about a fifth and gains about half a stop of shadow speed).
 */
export const DEFAULT_DEVELOPMENT_MODEL: DevelopmentModel = Object.freeze({
  gammaFactorPerStop: 1.2,
  speedStopsPerStop: 0.5,
  fogPerStop: 0.03,
});

/** The range of push/pull the model accepts, stops. */
export const DEVELOPMENT_STOPS_RANGE: readonly [number, number] = [-3, 3];

function checkStops(pushStops: number): void {
  if (!Number.isFinite(pushStops) || pushStops < DEVELOPMENT_STOPS_RANGE[0] || pushStops > DEVELOPMENT_STOPS_RANGE[1]) {
    throw new RangeError(`development must be between ${DEVELOPMENT_STOPS_RANGE[0]} and ${DEVELOPMENT_STOPS_RANGE[1]} stops`);
  }
}

/** Gamma multiplier for a push (+) or pull (−) of `pushStops` stops (dimensionless). */
export function developmentGammaFactor(pushStops: number, model: DevelopmentModel = DEFAULT_DEVELOPMENT_MODEL): number {
  checkStops(pushStops);
  return model.gammaFactorPerStop ** pushStops;
}

/** Real speed change of a push (+) or pull (−), in stops (+ = faster). */
export function developmentSpeedStops(pushStops: number, model: DevelopmentModel = DEFAULT_DEVELOPMENT_MODEL): number {
  checkStops(pushStops);
  return model.speedStopsPerStop * pushStops;
}

/**
 * The curve after a push (+) or pull (−) of `pushStops` stops from the normal development `normal`.
 * Gamma scales, fog rises with push, and the speed point (0.10 above base + fog) moves by exactly
 * developmentSpeedStops along log10 H (lux·s). pushStops = 0 returns the normal curve unchanged.
 */
export function developCurve(
  normal: CharacteristicCurve,
  pushStops: number,
  model: DevelopmentModel = DEFAULT_DEVELOPMENT_MODEL,
): CharacteristicCurve {
  checkStops(pushStops);
  if (pushStops === 0) return normal;
  const fog = normal.baseFog + model.fogPerStop * Math.max(0, pushStops);
  const dMax = Math.max(normal.dMax, fog + 1);
  const speedPoint = (c: CharacteristicCurve) => solveIncreasing((x) => netDensity(c, x), ISO6_SPEED_POINT_NET_DENSITY);
  const target = speedPoint(normal) - developmentSpeedStops(pushStops, model) * Math.log10(2);
  const raw = makeCurve({ ...normal, baseFog: fog, dMax, gamma: normal.gamma * developmentGammaFactor(pushStops, model) });
  return makeCurve({ ...raw, inertiaLogH: raw.inertiaLogH + (target - speedPoint(raw)) });
}
