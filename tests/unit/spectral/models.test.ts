import { describe, expect, it } from 'vitest';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { bandPass, longPass, neutralDensity, notch, shortPass, stackFilters } from '../../../shared/spectral/filters';
import { GRID_NM } from '../../../shared/spectral/grid';
import { blackbody, C2_M_K, daylight, daylightChromaticity, illuminantA, lightThroughGel, planck, whiteLed } from '../../../shared/spectral/lights';
import { eyeMedium, mediumFromModel } from '../../../shared/spectral/media';
import { valueAt } from '../../../shared/spectral/spectrum';

/** Default tolerance of this file. */
const TOL = 1e-9;
/** Wien's displacement law: λmax·T = c2 / 4.965114 (physics; follows from Planck's law). */
const WIEN_M_K = C2_M_K / 4.965114231744276;
/** CIE 015:2018 chromaticity of D65 (from memory): x 0.3127, y 0.3290, to 4 decimals. */
const D65_XY = [0.3127, 0.329];
/** The daylight-locus formula and the tabulated D65 differ by about 1e-4 in y (looser, for that reason). */
const TOL_XY = 2e-4;
/**
 * Illuminant A at 350 nm relative to 900 nm, from its defining formula (CIE 015:2018: a Planckian
 * radiator at 2848 K with c2 = 1.435e-2 m·K), (900/350)^5 · (e^(c2/(900 nm·T)) − 1) / (e^(c2/(350 nm·T)) − 1).
 */
const A_350_OVER_900 = (900 / 350) ** 5 * (Math.expm1(1.435e-2 / (900e-9 * 2848)) / Math.expm1(1.435e-2 / (350e-9 * 2848))); // ≈ 0.01692

describe('lights', () => {
  it('a blackbody peaks where Wien says (5000 K → 579.6 nm)', () => {
    const t = 5000;
    const peakNm = (WIEN_M_K / t) * 1e9;
    // the peak of the continuous curve: compare neighbouring values around it
    expect(planck(peakNm, t)).toBeGreaterThan(planck(peakNm - 1, t));
    expect(planck(peakNm, t)).toBeGreaterThan(planck(peakNm + 1, t));
    expect(Math.max(...blackbody(t).values)).toBe(1);
  });
  it('daylight chromaticity at 6504 K is that of D65 (CIE 015:2018)', () => {
    const { x, y } = daylightChromaticity(6504);
    expect(Math.abs(x - D65_XY[0])).toBeLessThan(TOL_XY);
    expect(Math.abs(y - D65_XY[1])).toBeLessThan(TOL_XY);
  });
  it('refuses daylight outside 4000–25000 K and blackbodies outside 1000–25000 K', () => {
    expect(() => daylight(3000)).toThrow(SpectralInputError);
    expect(() => daylight(30000)).toThrow(/4000–25000 K/);
    expect(() => blackbody(500)).toThrow(SpectralInputError);
  });
  it('illuminant A by formula is normalised to a peak of 1 and rises across the whole grid', () => {
    const a = illuminantA();
    // Wien: a 2848 K radiator peaks near 1017 nm, beyond the grid, so the peak is at its end (900 nm)
    expect(a.values[GRID_NM.length - 1]).toBe(1);
    for (let i = 1; i < GRID_NM.length; i++) expect(a.values[i]).toBeGreaterThan(a.values[i - 1]);
    expect(Math.abs(a.values[0] - A_350_OVER_900)).toBeLessThan(TOL);
  });
  it('the LED model has its blue emitter and phosphor band', () => {
    const led = whiteLed({ emitterNm: 450, emitterWidthNm: 22, phosphorNm: 572, phosphorWidthNm: 135, phosphorRatio: 0.6 });
    expect(valueAt(led, 450)).toBe(1);
    expect(valueAt(led, 490)).toBeLessThan(valueAt(led, 572));
  });
  it('light × gel multiplies and renormalises', () => {
    const gel = longPass({ cutOnNm: 550 });
    const lit = lightThroughGel(blackbody(3200), gel);
    expect(Math.max(...lit.values)).toBeCloseTo(1, 12);
    expect(valueAt(lit, 400)).toBeLessThan(1e-3);
  });
});

describe('parametric filters', () => {
  it('long-pass: half the peak at the cut-on, 10 % → 90 % over the slope width', () => {
    const f = longPass({ cutOnNm: 550, slopeNm: 20, peak: 0.9 });
    expect(Math.abs(valueAt(f, 550) - 0.45)).toBeLessThanOrEqual(TOL);
    expect(Math.abs(valueAt(f, 540) - 0.09)).toBeLessThanOrEqual(TOL);
    expect(Math.abs(valueAt(f, 560) - 0.81)).toBeLessThanOrEqual(TOL);
  });
  it('short-pass mirrors it', () => {
    const f = shortPass({ cutOffNm: 550, slopeNm: 20 });
    expect(Math.abs(valueAt(f, 540) - 0.9)).toBeLessThanOrEqual(TOL);
  });
  it('band-pass and notch are complements', () => {
    const b = bandPass({ centreNm: 530, widthNm: 60 });
    const n = notch({ centreNm: 530, widthNm: 60 });
    for (let i = 0; i < GRID_NM.length; i++) expect(Math.abs(b.values[i] + n.values[i] - 1)).toBeLessThanOrEqual(TOL);
    expect(valueAt(b, 530)).toBeGreaterThan(0.99);
  });
  it('neutral density: T = 10^−D everywhere; filters stack by multiplication', () => {
    expect(neutralDensity(0.3).values[10]).toBeCloseTo(10 ** -0.3, 12);
    expect(stackFilters([neutralDensity(0.3), neutralDensity(0.3)]).values[40]).toBeCloseTo(10 ** -0.6, 12);
    expect(stackFilters([]).values[40]).toBe(1);
  });
});

describe('media', () => {
  it('the parametric model is on an energy basis with a peak of 1; quantum lobes are × λ', () => {
    const e = mediumFromModel({ basis: 'energy', lobes: [{ centreNm: 500, widthNm: 1000, weight: 1 }] });
    const q = mediumFromModel({ basis: 'quantum', lobes: [{ centreNm: 500, widthNm: 1e6, weight: 1 }] });
    expect(Math.max(...e.values)).toBe(1);
    // flat quantum efficiency → energy sensitivity ∝ λ, peak at the grid's end (900 nm)
    expect(Math.abs(q.values[0] - 350 / 900)).toBeLessThan(1e-6);
    expect(Math.abs(q.values[GRID_NM.length - 1] - 1)).toBeLessThan(1e-6);
  });
  it('the eye is ȳ with its peak at 555 nm', () => {
    const y = eyeMedium();
    expect(valueAt(y, 555)).toBe(1);
  });
});
