import { describe, expect, it } from 'vitest';
import { coneIntensityCd, illuminanceLux, keyToFill, lampPlan, lampResult, pointSourceCheck, stopsVersus } from '../../../shared/tone/lamp-plan';
import { DEFAULT_INCIDENT_C, lightLevel } from '../../../shared/tone/light-level';

/** Shared default tolerance for this file (relative). */
const TOL = 1e-9;
const rel = (x: number, y: number) => Math.abs(x / y - 1);

/** Inverse-square law (photometry, any optics handbook): 1,000 cd at 2 m gives 1000 / 2² = 250 lux. */
const LUX_1000CD_2M = 250;
/** Inverse-square law: doubling the distance quarters the illuminance. */
const DOUBLE_DISTANCE_FACTOR = 1 / 4;
/** Cosine law (Lambert): cos 60° = 0.5, so light arriving 60° off the receptor's axis gives half. */
const COS_60 = 0.5;
/**
 * Uniform cone, I = Φ / (2π(1 − cos(α/2))), by hand: 10,000 lm over a 60° beam →
 * 2π(1 − cos 30°) = 2π · 0.1339746 = 0.8417872 sr → 11,879.49 cd.
 */
const CD_10000LM_60DEG = 11879.49;
const CONE_HAND_TOL = 1e-6;
/** Solid angle of a sphere is 4π sr (geometry): an isotropic source of Φ lm has I = Φ / 4π. */
const ISOTROPIC_FACTOR = 1 / (4 * Math.PI);
/** ISO 2720 incident metering, E = C·N²/(t·S) by hand: 250 · 2.8² · 48 / 100 = 940.8 lux (EI 100, T2.8, 1/48 s). */
const LUX_T28_EI100 = 940.8;
/** 1 fc = 10.7639 lux (definition: 1 lm/ft², 1 ft = 0.3048 m), to the figure's 6 significant digits. */
const LUX_PER_FC = 10.7639;
const FC_TOL = 1e-5;
/**
 * Lighting ratio (common practice: key side = key + fill, shadow side = fill): key 800 lux, fill 100 lux →
 * 900 / 100 = 9:1 = log2 9 = 3.17 stops; for 5 stops the fill may drop to 800 / 31 lux, so a fill at 2 m
 * may go back to 2 · √(100 · 31 / 800) = 3.937 m (inverse-square, by hand).
 */
const RATIO_9 = 9;
const FILL_MAX_M = 3.937004;
const FILL_MAX_TOL = 1e-6;
/** Thresholds of the trade (common practice, shared/tone/media-tone.ts): classic negative 4 stops, modern 5. */
const MODERN_STOPS = 5;
/** The five-times rule of photometry (common practice): a 1.2 m source is a point from 6 m. */
const SOFT_SIZE_M = 1.2;
const SOFT_MIN_M = 6;

describe('illuminance of a point source', () => {
  it('follows the inverse-square law: doubling the distance quarters the lux', () => {
    expect(rel(illuminanceLux(1000, 2), LUX_1000CD_2M)).toBeLessThan(TOL);
    expect(rel(illuminanceLux(1000, 4) / illuminanceLux(1000, 2), DOUBLE_DISTANCE_FACTOR)).toBeLessThan(TOL);
  });
  it('follows the cosine law: 60° off axis halves it', () => {
    expect(rel(illuminanceLux(1000, 2, 60) / illuminanceLux(1000, 2, 0), COS_60)).toBeLessThan(TOL);
  });
  it('refuses a grazing angle and non-positive distances', () => {
    expect(() => illuminanceLux(1000, 2, 90)).toThrow(RangeError);
    expect(() => illuminanceLux(1000, 0)).toThrow(RangeError);
  });
});

describe('intensity of a uniform cone', () => {
  it('matches the hand-computed value', () => {
    expect(rel(coneIntensityCd(10_000, 60), CD_10000LM_60DEG)).toBeLessThan(CONE_HAND_TOL);
  });
  it('spreads the flux over the whole sphere at 360°', () => {
    expect(rel(coneIntensityCd(1000, 360), 1000 * ISOTROPIC_FACTOR)).toBeLessThan(TOL);
  });
});

describe('the level needed and the plan', () => {
  const camera = { ei: 100, tStop: 2.8, fps: 24, shutterAngle: 180 };
  it('needs the ISO 2720 level of the app’s light-level function', () => {
    const p = lampPlan({ ...camera, lamps: [{ name: 'Key', intensityCd: 4000, distanceM: 2 }], shadowDetailStops: MODERN_STOPS });
    const level = lightLevel(camera);
    expect(p.needed.lux).toBe(level.lux);
    expect(p.needed.calibrationConstant).toBe(DEFAULT_INCIDENT_C);
    expect(rel(p.needed.lux, LUX_T28_EI100)).toBeLessThan(TOL);
    expect(rel(p.lamps[0].stopsVsNeeded, Math.log2(1000 / LUX_T28_EI100))).toBeLessThan(TOL);
  });
  it('gives foot-candles at 1 fc = 10.7639 lux', () => {
    const p = lampPlan({ ...camera, lamps: [{ name: 'Key', intensityCd: 4000, distanceM: 2 }], shadowDetailStops: MODERN_STOPS });
    expect(rel(p.lamps[0].fc * LUX_PER_FC, p.lamps[0].lux)).toBeLessThan(FC_TOL);
    expect(rel(p.needed.footcandles * LUX_PER_FC, p.needed.lux)).toBeLessThan(FC_TOL);
    expect(rel(p.totalFc * LUX_PER_FC, p.totalLux)).toBeLessThan(FC_TOL);
  });
  it('adds the lamps and compares the total with the need in stops', () => {
    const p = lampPlan({
      ...camera,
      lamps: [{ name: 'Key', intensityCd: 3200, distanceM: 2, role: 'key' }, { name: 'Fill', intensityCd: 400, distanceM: 2, role: 'fill' }],
      shadowDetailStops: MODERN_STOPS,
    });
    expect(rel(p.totalLux, 900)).toBeLessThan(TOL);
    expect(rel(p.stopsVsNeeded, stopsVersus(900, LUX_T28_EI100))).toBeLessThan(TOL);
    expect(p.keyToFill?.ratio).toBeCloseTo(RATIO_9, 12);
  });
});

describe('key-to-fill', () => {
  const key = lampResult({ name: 'Key', intensityCd: 3200, distanceM: 2 }, 100);
  const fill = lampResult({ name: 'Fill', intensityCd: 400, distanceM: 2 }, 100);
  it('reads (key + fill) / fill in stops and where the fill may stand for the threshold', () => {
    const k = keyToFill(key, fill, MODERN_STOPS);
    expect(rel(k.ratio, RATIO_9)).toBeLessThan(TOL);
    expect(rel(k.stops, Math.log2(RATIO_9))).toBeLessThan(TOL);
    expect(k.exceeds).toBe(false);
    expect(Math.abs(k.fillMaxDistanceM - FILL_MAX_M)).toBeLessThan(FILL_MAX_TOL);
  });
  it('says the fill must come closer when the ratio passes the threshold', () => {
    const far = lampResult({ name: 'Fill', intensityCd: 400, distanceM: 6 }, 100);
    const k = keyToFill(key, far, MODERN_STOPS);
    expect(k.exceeds).toBe(true);
    expect(k.fillMaxDistanceM).toBeLessThan(6);
    // at that distance the ratio is exactly the threshold
    const moved = lampResult({ name: 'Fill', intensityCd: 400, distanceM: k.fillMaxDistanceM }, 100);
    expect(Math.abs(keyToFill(key, moved, MODERN_STOPS).stops - MODERN_STOPS)).toBeLessThan(FILL_MAX_TOL);
  });
});

describe('the point-source model', () => {
  it('breaks down closer than five times the source’s size', () => {
    expect(pointSourceCheck(5, SOFT_SIZE_M).ok).toBe(false);
    expect(pointSourceCheck(SOFT_MIN_M, SOFT_SIZE_M).ok).toBe(true);
    expect(pointSourceCheck(SOFT_MIN_M, SOFT_SIZE_M).minDistanceM).toBeCloseTo(SOFT_MIN_M, 12);
    expect(pointSourceCheck(5).ok).toBeNull();
  });
});
