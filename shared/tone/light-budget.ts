/**
 * The light budget between looks: how much light each look needs against the first one, and the incident
 * level it needs at one camera setting. Composition of the EI chain (ei-chain.ts) and the ISO 2720 light
 * level (light-level.ts) through exposurePlan (exposure-plan.ts), the same functions the bench and the
 * exposure sheet use, so a look's figures here are its sheet's figures.
 *
 * `relative` is the ratio of the looks' effective EIs as the meter is set to them (the ISO third-stop
 * labels, as on the sheet, where its cost "needs 3.2× the light of the unfiltered one" is worked out the
 * same way), so at one camera it is exactly the ratio of the lux and foot-candles the gaffer lights to.
 * `exactRelative` is the same ratio before the labels' rounding: exactly 2^(stops between the chains),
 * exactEI = box speed · 2^(rating − filter stops); the two differ by at most the labels' rounding
 * (a sixth of a stop each way).
 */
import { exposurePlan, type CameraSettings } from './exposure-plan';
import { describeLightCost, lightCost } from './light-level';

/** A look's EI chain inputs: box speed (ISO arithmetic), rating / development (stops) and every filter of its path (stops lost). */
export interface LightBudgetChainInput {
  boxSpeed: number;
  ratingStops: number;
  /** filter factor of all the look's filters (gels and lens) for its own light and medium, stops */
  filterStops: number;
}

export interface LightBudgetEntry {
  /** effective EI on the ISO third-stop series */
  effectiveEI: number;
  /** effective EI before rounding: boxSpeed · 2^(ratingStops − filterStops) */
  exactEI: number;
  /** incident light needed at the camera setting and the labelled EI (ISO 2720), lux */
  lux: number;
  /** the same in foot-candles (1 fc = 10.7639 lux) */
  footcandles: number;
  /** light needed relative to the first look at the meter's labels: firstEffectiveEI / effectiveEI (2 = twice the light) */
  relative: number;
  /** the same in stops, log2(relative) (+ = more light than the first) */
  stops: number;
  /** the ratio before the labels' rounding: firstExactEI / exactEI = 2^(stops between the chains) */
  exactRelative: number;
}

/**
 * The light budget of looks at one camera setting (T-stop, fps, shutter angle, meter constant C in lux·s).
 * `null` entries are looks without an exposure index (the eye) and answer `null`; the first look must
 * have one (it is the reference). Throws RangeError when the list is empty or the first look has no EI.
 * Units: EI ISO arithmetic, lux, foot-candles; relative dimensionless (ratio of light), stops log2.
 * Source: ISO 2720 incident metering E = C·N²/(t·S); light ∝ 1/EI (lightCost, as the sheet's cost).
 */
export function lightBudget(looks: readonly (LightBudgetChainInput | null)[], camera: CameraSettings): (LightBudgetEntry | null)[] {
  if (!looks.length) throw new RangeError('at least one look is needed');
  const plans = looks.map((l) => (l ? exposurePlan({ ...l, ...camera }) : null));
  const first = plans[0];
  if (!first) throw new RangeError('the first look has no exposure index: it is the reference');
  const exactOf = (p: NonNullable<typeof first>) => p.chain.steps[p.chain.steps.length - 1].exactEI;
  return plans.map((p) => {
    if (!p) return null;
    const exactEI = exactOf(p);
    const { ratio, stops } = lightCost(p.chain.effectiveEI, first.chain.effectiveEI);
    return { effectiveEI: p.chain.effectiveEI, exactEI, lux: p.light.lux, footcandles: p.light.footcandles, relative: ratio, stops, exactRelative: exactOf(first) / exactEI };
  });
}

/** "needs 4.6× the light of Panchromatic, no filter" (two figures; "the same light as" within 0.5 %). */
export function describeRelativeLight(relative: number, referenceName: string): string {
  return describeLightCost(relative, referenceName);
}

/** The same words without the reference, for a page that sets its name apart: "needs 4.6× the light of". */
export function relativeLightPhrase(relative: number): string {
  return describeLightCost(relative, '').trimEnd();
}

/** A relative light as the chart labels it, two figures: "4.6×", "1×", "15×", "0.31×". */
export function formatRelative(relative: number): string {
  if (!(relative > 0)) throw new RangeError('relative must be positive');
  return `${relative >= 10 ? relative.toFixed(0) : Number(relative.toPrecision(2))}×`;
}
