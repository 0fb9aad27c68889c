import { describe, expect, it } from 'vitest';
import { GRID_NM } from '../../../shared/spectral/grid';
import { GRID_END_NM, GRID_SIZE, GRID_START_NM, GRID_STEP_NM, interpolateAt, spragueAt } from '../../../shared/spectral/policy';
import { integrate, integrationWeights, observerWeights } from '../../../shared/spectral/integrate';
import { cieIlluminant } from '../../../shared/spectral/lights';
import { CMF } from '../../../shared/spectral/cie';
import { flat, fromFn } from './fixtures';

/** Default tolerance: exact arithmetic up to rounding. */
const TOL = 1e-9;

describe('the numeric policy', () => {
  it('works on 380–780 nm at 5 nm, 81 samples (CIE 015:2018)', () => {
    expect([GRID_START_NM, GRID_END_NM, GRID_STEP_NM, GRID_SIZE]).toEqual([380, 780, 5, 81]);
    expect(GRID_NM[80]).toBe(780);
  });
  it('interpolates linearly inside and holds the ends constant outside', () => {
    const v = interpolateAt([400, 500, 600], [1, 3, 2], [300, 400, 450, 550, 600, 700]);
    expect(Array.from(v)).toEqual([1, 1, 2, 2.5, 2, 2]);
  });
  it('Sprague interpolation reproduces a polynomial of degree 4 between interior samples', () => {
    const p = (x: number) => 1 + 0.1 * x - 0.02 * x ** 2 + 0.003 * x ** 3 - 1e-4 * x ** 4;
    const values = Array.from({ length: 12 }, (_, i) => p(i));
    for (const x of [2.3, 4.5, 6.9]) expect(Math.abs(spragueAt(0, 1, values, x) - p(x))).toBeLessThanOrEqual(1e-9);
    expect(spragueAt(0, 1, values, 5)).toBeCloseTo(values[5], 12);
  });
  it('integrates piecewise-linear spectra exactly: ∫ 1 over the grid and ∫ of a ramp', () => {
    // weights are on the scale of 5 nm samples: ∫ 1 dλ over 400 nm = 80 samples
    expect(Math.abs(integrate(flat(1)) - 80)).toBeLessThanOrEqual(TOL);
    const ramp = fromFn((nm) => (nm - 380) / 400);
    expect(Math.abs(integrate(ramp) - 40)).toBeLessThanOrEqual(TOL);
    const w = integrationWeights(flat(2));
    expect(Math.abs(w.reduce((a, b) => a + b, 0) - 160)).toBeLessThanOrEqual(TOL);
  });
  it('observer weights of a light sum to its plain 5 nm summation (CIE 015:2018)', () => {
    const e = cieIlluminant('D65');
    const w = observerWeights(e);
    const cmf = [CMF.x, CMF.y, CMF.z];
    w.forEach((wc, c) => {
      const plain = Array.from(e.values).reduce((a, v, i) => a + v * cmf[c].values[i], 0);
      expect(Math.abs(wc.reduce((a, b) => a + b, 0) - plain)).toBeLessThanOrEqual(TOL);
    });
  });
});
