import { describe, expect, it } from 'vitest';
import {
  DEFAULT_INCIDENT_C,
  INCIDENT_C_FLAT,
  INCIDENT_C_HEMISPHERICAL,
  LUX_PER_FOOTCANDLE,
  footcandlesToLux,
  incidentLux,
  lightLevel,
  luxToFootcandles,
  shutterTimeSeconds,
} from '../../../shared/tone/light-level';

/** Shared default tolerance for this file (relative). */
const TOL = 1e-9;
/** Definition: 1 foot-candle = 1 lm/ft² = 10.764 lux (1 ft = 0.3048 m exactly). */
const LUX_PER_FC = 10.764;
const LUX_PER_FC_TOL = 5e-4; // the definition's value is 10.7639…, quoted to three decimals
/** Common practice (from memory): about 100 fc for T2.8 at 1/48 s and EI 100 … */
const RULE_FC = 100;
/** … within a third of a stop. */
const RULE_TOL_STOPS = 1 / 3;
/** Common practice: a 180° shutter at 24 fps exposes 1/48 s. */
const SECONDS_180_AT_24 = 1 / 48;
/** ISO 2720: C = 240…400 for a flat receptor, 320…540 for a hemispherical one (lux, lux·s). */
const ISO2720_FLAT_RANGE = [240, 400];
const ISO2720_HEMI_RANGE = [320, 540];
/** ISO 2720 equation E = C·N²/(t·S) by hand: 250 · 2.8² · 48 / 100 = 940.8 lux. */
const HAND_LUX = 940.8;

describe('ISO 2720 incident-light equation', () => {
  it('1 fc = 10.764 lux (definition)', () => {
    expect(Math.abs(LUX_PER_FOOTCANDLE - LUX_PER_FC)).toBeLessThan(LUX_PER_FC_TOL);
    expect(Math.abs(footcandlesToLux(1) / LUX_PER_FOOTCANDLE - 1)).toBeLessThan(TOL);
    expect(Math.abs(luxToFootcandles(LUX_PER_FOOTCANDLE) - 1)).toBeLessThan(TOL);
  });

  it('a 180° shutter at 24 fps is 1/48 s (common practice)', () => {
    expect(Math.abs(shutterTimeSeconds(24, 180) / SECONDS_180_AT_24 - 1)).toBeLessThan(TOL);
    expect(() => shutterTimeSeconds(-1, 180)).toThrow(RangeError);
    expect(() => shutterTimeSeconds(24, 400)).toThrow(RangeError);
  });

  it('follows E = C·N²/(t·S) (ISO 2720)', () => {
    expect(Math.abs(incidentLux(100, 2.8, 1 / 48, 250) / HAND_LUX - 1)).toBeLessThan(TOL);
    // one stop of T-stop needs twice the light; twice the EI half the light
    expect(incidentLux(100, 4, 1 / 48) / incidentLux(100, 2.8284271247, 1 / 48)).toBeCloseTo(2, 6);
    expect(incidentLux(200, 2.8, 1 / 48) / incidentLux(100, 2.8, 1 / 48)).toBeCloseTo(0.5, 12);
  });

  it('uses constants inside the ISO 2720 ranges, flat receptor by default', () => {
    expect(DEFAULT_INCIDENT_C).toBe(INCIDENT_C_FLAT);
    expect(INCIDENT_C_FLAT).toBeGreaterThanOrEqual(ISO2720_FLAT_RANGE[0]);
    expect(INCIDENT_C_FLAT).toBeLessThanOrEqual(ISO2720_FLAT_RANGE[1]);
    expect(INCIDENT_C_HEMISPHERICAL).toBeGreaterThanOrEqual(ISO2720_HEMI_RANGE[0]);
    expect(INCIDENT_C_HEMISPHERICAL).toBeLessThanOrEqual(ISO2720_HEMI_RANGE[1]);
  });

  it('gives about 100 fc for T2.8, 24 fps 180°, EI 100, within ⅓ stop (common practice, from memory)', () => {
    for (const c of [INCIDENT_C_FLAT, INCIDENT_C_HEMISPHERICAL]) {
      const l = lightLevel({ ei: 100, tStop: 2.8, fps: 24, shutterAngle: 180, calibrationConstant: c });
      expect(Math.abs(Math.log2(l.footcandles / RULE_FC))).toBeLessThanOrEqual(RULE_TOL_STOPS);
      expect(Math.abs(l.lux / l.footcandles / LUX_PER_FOOTCANDLE - 1)).toBeLessThan(TOL);
      expect(l.calibrationConstant).toBe(c);
    }
  });
});
