import { describe, expect, it } from 'vitest';
import { describeRelativeLight, lightBudget } from '../../../shared/tone/light-budget';
import { eiChain } from '../../../shared/tone/ei-chain';
import { exposurePlan } from '../../../shared/tone/exposure-plan';
import { filterFactor, resolveFilter, resolveLight, resolveMedium } from '../../../shared/spectral/compute';

/** Shared default tolerance for this file (relative). */
const TOL = 1e-9;
const rel = (x: number, y: number) => Math.abs(x / y - 1);

/**
 * Optical density 0.3 passes 10^−0.3 of the light at every wavelength (definition of optical density,
 * ISO 5-1): factor 10^0.3 = 1.995, "one stop" in the trade's words (published fact: ND 0.3 = 1 stop).
 */
const ND03_FACTOR = 10 ** 0.3;
/** The trade's rounding of the same: an ND 0.3 needs twice the light. */
const ND03_TRADE_RATIO = 2;
/** The trade's "one stop" is 0.997 stop: 2 within this much (relative). */
const TRADE_TOL = 0.01;
/** Facts of the trade (common practice): box 250, rated −⅔, a 1⅔-stop filter under tungsten → EI 160 → 50. */
const BOX_SPEED = 250;
const RATING_STOPS = -0.667;
const FILTER_STOPS = 1.667;
/** 1 fc = 1 lm/ft², 1 ft = 0.3048 m (definition): 10.7639 lux, given to six figures (so compared within 1e-5). */
const LUX_PER_FC = 10.7639;
const LUX_PER_FC_FIGURES = 1e-5;
/** ISO 2720, E = C·N²/(t·S) by hand: 250 · 2.8² · 48 / 50 = 1881.6 lux at T2.8, 1/48 s, EI 50. */
const LUX_T28_EI50 = 1881.6;

/** Light ∝ 1/EI (ISO 2720): 250 / 50 = 5, as the meter is set. */
const TRADE_RATIO_250_TO_50 = 5;
/** Each EI label of the ISO third-stop series is within a sixth of a stop of the exact EI, so a ratio of two within a third. */
const LABEL_ROUNDING_STOPS = 1 / 3;

const camera = { tStop: 2.8, fps: 24, shutterAngle: 180 };

describe('lightBudget', () => {
  it('the ratio equals 2^(stops between the EI chains), the first look being 1', () => {
    const looks = [
      { boxSpeed: BOX_SPEED, ratingStops: 0, filterStops: 0 },
      { boxSpeed: BOX_SPEED, ratingStops: RATING_STOPS, filterStops: FILTER_STOPS },
      { boxSpeed: 80, ratingStops: 0.333, filterStops: 0.5 },
    ];
    const out = lightBudget(looks, camera);
    const chains = looks.map((l) => eiChain(l));
    // stops of each chain from a common origin: log2(box) + rating − filter
    const chainStops = looks.map((l, i) => Math.log2(l.boxSpeed) + chains[i].totalStops);
    out.forEach((b, i) => {
      // before the labels' rounding: exactly 2^(stops between the chains)
      expect(rel(b!.exactRelative, 2 ** (chainStops[0] - chainStops[i]))).toBeLessThan(TOL);
      // as the meter is set: the ratio of the effective EIs (the labels), within their rounding of the exact one
      expect(b!.effectiveEI).toBe(chains[i].effectiveEI);
      expect(rel(b!.relative, chains[0].effectiveEI / chains[i].effectiveEI)).toBeLessThan(TOL);
      expect(Math.abs(Math.log2(b!.relative / b!.exactRelative))).toBeLessThanOrEqual(LABEL_ROUNDING_STOPS);
      expect(Math.abs(b!.stops - Math.log2(b!.relative))).toBeLessThan(TOL);
    });
    expect(out[0]!.relative).toBe(1);
    // the trade's figures: 250 → 50 is five times the light (1⅔ + ⅔ stops, 2^2.333 = 5.04 before the labels)
    expect(rel(out[1]!.relative, TRADE_RATIO_250_TO_50)).toBeLessThan(TOL);
  });

  it('gives each look the light level of its exposure plan (ISO 2720), in lux and foot-candles', () => {
    const [, b] = lightBudget([{ boxSpeed: BOX_SPEED, ratingStops: 0, filterStops: 0 }, { boxSpeed: BOX_SPEED, ratingStops: RATING_STOPS, filterStops: FILTER_STOPS }], camera);
    const plan = exposurePlan({ boxSpeed: BOX_SPEED, ratingStops: RATING_STOPS, filterStops: FILTER_STOPS, ...camera });
    expect(b!.effectiveEI).toBe(50);
    expect(rel(b!.lux, LUX_T28_EI50)).toBeLessThan(TOL);
    expect(rel(b!.lux, plan.light.lux)).toBeLessThan(TOL);
    expect(rel(b!.lux / b!.footcandles, LUX_PER_FC)).toBeLessThan(LUX_PER_FC_FIGURES);
  });

  it('a look with an ND 0.3 on the same light and medium needs twice the light (ND 0.3 = 1 stop)', () => {
    const light = resolveLight({ id: 'tungsten-3200' });
    const medium = resolveMedium({ id: 'panchromatic' });
    const nd = filterFactor(light, [resolveFilter({ neutralDensity: 0.3 })], medium);
    expect(rel(nd.factor, ND03_FACTOR)).toBeLessThan(TOL);
    const [a, b] = lightBudget([
      { boxSpeed: BOX_SPEED, ratingStops: 0, filterStops: filterFactor(light, [], medium).stops },
      { boxSpeed: BOX_SPEED, ratingStops: 0, filterStops: nd.stops },
    ], camera);
    expect(a!.relative).toBe(1);
    // the meter's labels: 250 → 125, twice the light, and twice the lux
    expect(b!.effectiveEI).toBe(125);
    expect(rel(b!.relative, ND03_TRADE_RATIO)).toBeLessThan(TOL);
    expect(rel(b!.lux / a!.lux, b!.relative)).toBeLessThan(TOL);
    // before the labels: 10^0.3 = 1.995, the trade's "one stop" to 0.3 %
    expect(rel(b!.exactRelative, ND03_FACTOR)).toBeLessThan(TOL);
    expect(rel(b!.exactRelative, ND03_TRADE_RATIO)).toBeLessThan(TRADE_TOL);
  });

  it('answers null for a look without an EI and refuses a first look without one', () => {
    const out = lightBudget([{ boxSpeed: 100, ratingStops: 0, filterStops: 1 }, null], camera);
    expect(out[1]).toBeNull();
    expect(() => lightBudget([null, { boxSpeed: 100, ratingStops: 0, filterStops: 0 }], camera)).toThrow(RangeError);
    expect(() => lightBudget([], camera)).toThrow(RangeError);
  });

  it('says it in words', () => {
    expect(describeRelativeLight(4.6, 'Panchromatic, no filter')).toBe('needs 4.6× the light of Panchromatic, no filter');
    expect(describeRelativeLight(1, 'Panchromatic, no filter')).toBe('needs the same light as Panchromatic, no filter');
  });
});
