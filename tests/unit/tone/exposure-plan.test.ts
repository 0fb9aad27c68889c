import { describe, expect, it } from 'vitest';
import { COMMON_T_STOPS, exposurePlan, lightLevelTable, toneMediumIdOfRef } from '../../../shared/tone/exposure-plan';
import { asciiFractions, formatFactor, formatFootcandles, formatLux, formatSeconds, formatStopsLabel } from '../../../shared/tone/exposure-format';
import { toneSettingsSchema } from '../../../shared/schemas/exposure';
import { mediumToneDefaults } from '../../../shared/tone/media-tone';

/** Shared default tolerance for this file (relative). */
const TOL = 1e-9;
const rel = (x: number, y: number) => Math.abs(x / y - 1);

// Facts of the trade (common practice): box 250, rated −⅔ → 160; the filter under tungsten costs 1⅔ stops → 50.
const BOX_SPEED = 250;
const RATING_STOPS = -0.667;
const TUNGSTEN_FILTER_STOPS = 1.667;
const RATED_EI = 160;
const TUNGSTEN_EI = 50;
/** Light scales as 1/EI (ISO 2720): 160 / 50 = 3.2 (arithmetic). */
const COST_RATIO = 3.2;
/** ISO 2720, E = C·N²/(t·S) by hand: 250 · 2.8² · 48 / 50 = 1881.6 lux at T2.8, 1/48 s, EI 50. */
const LUX_T28_EI50 = 1881.6;
/** The same at the unfiltered EI 160: 250 · 2.8² · 48 / 160 = 588 lux. */
const LUX_T28_EI160 = 588;
/** 1 fc = 1 lm/ft² with 1 ft = 0.3048 m (definition). */
const LUX_PER_FC = 1 / 0.3048 ** 2;

const camera = { tStop: 2.8, fps: 24, shutterAngle: 180 };

describe('exposurePlan', () => {
  it('gives the chain, the light with and without the filter, and the cost in light', () => {
    const p = exposurePlan({ boxSpeed: BOX_SPEED, ratingStops: RATING_STOPS, filterStops: TUNGSTEN_FILTER_STOPS, ...camera });
    expect(p.chain.unfilteredEI).toBe(RATED_EI);
    expect(p.chain.effectiveEI).toBe(TUNGSTEN_EI);
    expect(rel(p.light.lux, LUX_T28_EI50)).toBeLessThan(TOL);
    expect(rel(p.unfilteredLight.lux, LUX_T28_EI160)).toBeLessThan(TOL);
    expect(rel(p.light.footcandles * LUX_PER_FC, p.light.lux)).toBeLessThan(TOL);
    expect(rel(p.cost.ratio, COST_RATIO)).toBeLessThan(TOL);
    expect(p.cost.text).toBe('needs 3.2× the light of the unfiltered one');
  });

  it('lists light levels for the common T-stops: each full stop doubles the light (N² law, ISO 2720)', () => {
    const rows = lightLevelTable(TUNGSTEN_EI, camera);
    expect(rows.map((r) => r.tStop)).toEqual([...COMMON_T_STOPS]);
    const at28 = rows.find((r) => r.tStop === 2.8)!;
    expect(rel(at28.lux, LUX_T28_EI50)).toBeLessThan(TOL);
    for (const r of rows) expect(rel(r.lux / at28.lux, (r.tStop / 2.8) ** 2)).toBeLessThan(TOL);
  });

  it('uses a settable meter constant: E scales with C (ISO 2720)', () => {
    const a = exposurePlan({ boxSpeed: 100, ratingStops: 0, filterStops: 0, ...camera });
    const b = exposurePlan({ boxSpeed: 100, ratingStops: 0, filterStops: 0, ...camera, calibrationConstant: 330 });
    expect(rel(b.light.lux / a.light.lux, 330 / 250)).toBeLessThan(TOL);
  });
});

describe('tone settings for exposure', () => {
  it('default to T2.8, 24 fps, 180° and C = 250 (common practice; ISO 2720 flat receptor)', () => {
    const t = toneSettingsSchema.parse({});
    expect([t.tStop, t.fps, t.shutterAngle, t.calibrationConstant, t.boxSpeed]).toEqual([2.8, 24, 180, 250, null]);
    expect(toneSettingsSchema.safeParse({ shutterAngle: 400 }).success).toBe(false);
  });

  it('map a look’s medium to the tone model’s id', () => {
    for (const id of ['panchromatic', 'orthochromatic', 'blue-sensitive', 'silicon-ir-cut']) {
      expect(mediumToneDefaults(toneMediumIdOfRef({ source: { id } })).known).toBe(true);
    }
    expect(toneMediumIdOfRef({ curveId: 7 })).toBe('curve.7');
    expect(toneMediumIdOfRef({ source: {} })).toBe('custom');
  });
});

describe('exposure figures in words', () => {
  it('carry units and trade thirds', () => {
    expect(formatStopsLabel(-0.667)).toBe('−⅔ stop');
    expect(formatStopsLabel(1.667)).toBe('+1⅔ stops');
    expect(formatStopsLabel(1)).toBe('+1 stop');
    expect(formatStopsLabel(0)).toBe('0 stops');
    expect(formatSeconds(1 / 48)).toBe('1/48 s');
    expect(formatFootcandles(87.4)).toBe('87 fc');
    expect(formatFootcandles(4.24)).toBe('4.2 fc');
    expect(formatLux(1881.6)).toBe('1,882 lux');
    expect(formatFactor(3.114)).toBe('×3.1');
    expect(asciiFractions('−1⅔ stops, ⅔ stop')).toBe('−1 2/3 stops, 2/3 stop');
  });
});
