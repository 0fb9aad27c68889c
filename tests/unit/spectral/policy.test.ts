import { describe, expect, it } from 'vitest';
import { GRID_NM } from '../../../shared/spectral/grid';
import {
  ESTIMATE_SHAPE,
  ESTIMATE_SIZE,
  ESTIMATE_STEP_NM,
  GRID_END_NM,
  GRID_SIZE,
  GRID_START_NM,
  GRID_STEP_NM,
  OBSERVER_RANGE_NM,
  estimateToGrid,
  interpolateAt,
  onWorkingGrid,
  spragueAt,
  weightsToEstimateGrid,
} from '../../../shared/spectral/policy';
import { integrate, integrationWeights, observerWeights } from '../../../shared/spectral/integrate';
import { cieIlluminant } from '../../../shared/spectral/lights';
import { CMF } from '../../../shared/spectral/cie';
import { flat, fromFn, random } from './fixtures';

/** Default tolerance: exact arithmetic up to rounding. */
const TOL = 1e-9;

describe('the numeric policy', () => {
  it('works on 350–900 nm at 1 nm, 551 samples (CIE 015:2018: summation at 1 nm; issue 11)', () => {
    expect([GRID_START_NM, GRID_END_NM, GRID_STEP_NM, GRID_SIZE]).toEqual([350, 900, 1, 551]);
    expect(GRID_NM[0]).toBe(350);
    expect(GRID_NM[550]).toBe(900);
    expect(GRID_NM[210]).toBe(560);
  });
  it('keeps the observer’s published range, 360–830 nm (CIE 015:2018), inside the grid', () => {
    expect(OBSERVER_RANGE_NM).toEqual([360, 830]);
  });
  it('tabulates estimates on 350–900 nm at 5 nm, 111 samples, carried to the grid linearly', () => {
    expect([ESTIMATE_SHAPE.startNm, ESTIMATE_SHAPE.endNm, ESTIMATE_STEP_NM, ESTIMATE_SIZE]).toEqual([350, 900, 5, 111]);
    const e = Float64Array.from({ length: ESTIMATE_SIZE }, (_, k) => (k % 3) + 0.1 * k);
    const g = estimateToGrid(e);
    expect(g).toHaveLength(GRID_SIZE);
    for (let k = 0; k < ESTIMATE_SIZE; k++) expect(g[k * 5]).toBe(e[k]); // exact at its nodes
    expect(Math.abs(g[7] - (e[1] + 0.4 * (e[2] - e[1])))).toBeLessThanOrEqual(TOL); // 357 nm, 2/5 of the way 355 → 360
  });
  it('carries weights to the estimate’s grid as the transpose of the interpolation: Σ w·(grid ρ) = Σ wₑ·ρₑ', () => {
    const next = random(11);
    const w = Float64Array.from({ length: GRID_SIZE }, () => next());
    const e = Float64Array.from({ length: ESTIMATE_SIZE }, () => next());
    const we = weightsToEstimateGrid(w);
    expect(we).toHaveLength(ESTIMATE_SIZE);
    const a = estimateToGrid(e).reduce((s, v, i) => s + v * w[i], 0);
    const b = e.reduce((s, v, k) => s + v * we[k], 0);
    expect(Math.abs(a - b)).toBeLessThanOrEqual(TOL);
  });
  it('band-integrates data finer than the grid: a narrow line keeps its energy and its centre', () => {
    // 0.1 nm data: a 0.5 nm wide line of height 10 at `centre` on a floor of 1 (expected by conservation of
    // energy and of the centroid under the grid's tent functions: the definition of the band integration)
    for (const centre of [550, 546.5, 612.3]) {
      const nm: number[] = [];
      const v: number[] = [];
      for (let k = 0; k <= 5000; k++) {
        const x = Math.round((400 + k / 10) * 10) / 10;
        nm.push(x);
        v.push(Math.abs(x - centre) <= 0.25 + 1e-9 ? 10 : 1);
      }
      const g = onWorkingGrid(nm, v, 'hold');
      const excess = v.reduce((s, x) => s + (x - 1), 0) * 0.1; // ∫ (data − floor) dλ
      let energy = 0;
      let moment = 0;
      for (let i = 0; i < g.length; i++) {
        energy += (g[i] - 1) * GRID_STEP_NM;
        moment += (g[i] - 1) * GRID_STEP_NM * (350 + i * GRID_STEP_NM);
      }
      const centroid = v.reduce((s, x, k) => s + (x - 1) * nm[k], 0) * 0.1 / excess;
      expect(Math.abs(energy - excess)).toBeLessThanOrEqual(TOL);
      expect(Math.abs(moment / energy - centroid)).toBeLessThanOrEqual(TOL);
      // far from the line the floor is untouched
      expect(g[Math.round(centre) - 350 - 3]).toBeCloseTo(1, 12);
    }
    // a line midway between two grid wavelengths is shared equally between them
    const g = onWorkingGrid([546.3, 546.4, 546.5, 546.6, 546.7], [0, 0, 1, 0, 0], 'zero');
    expect(Math.abs(g[196] - g[197])).toBeLessThanOrEqual(TOL);
  });
  it('beyond the data: holds the ends (lights, filters, reflectances) or gives zero (media)', () => {
    const hold = onWorkingGrid([400, 500, 700], [1, 3, 2], 'hold');
    const zero = onWorkingGrid([400, 500, 700], [1, 3, 2], 'zero');
    expect([hold[0], hold[49], hold[50], hold[350], hold[351], hold[550]]).toEqual([1, 1, 1, 2, 2, 2]);
    expect([zero[0], zero[49], zero[50], zero[350], zero[351], zero[550]]).toEqual([0, 0, 1, 2, 0, 0]);
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
  it('integrates by the trapezoid rule at 1 nm, exact for piecewise-linear spectra: ∫ 1 and ∫ of a ramp', () => {
    // weights in nm: ∫ 1 dλ over 350–900 nm = 550 nm (549 inner samples × 1 nm + 2 ends × ½ nm)
    expect(Math.abs(integrate(flat(1)) - 550)).toBeLessThanOrEqual(TOL);
    const ramp = fromFn((nm) => (nm - 350) / 550); // ∫ = 550 / 2
    expect(Math.abs(integrate(ramp) - 275)).toBeLessThanOrEqual(TOL);
    const w = integrationWeights(flat(2));
    expect(Math.abs(w.reduce((a, b) => a + b, 0) - 1100)).toBeLessThanOrEqual(TOL);
    expect([w[0], w[1], w[549], w[550]]).toEqual([1, 2, 2, 1]); // half weight at the two ends only
  });
  it('observer weights of a light are its plain 1 nm summation (CIE 015:2018; x̄ȳz̄ are zero at the grid’s ends)', () => {
    const e = cieIlluminant('D65');
    const w = observerWeights(e);
    const cmf = [CMF.x, CMF.y, CMF.z];
    w.forEach((wc, c) => {
      const plain = Array.from(e.values).reduce((a, v, i) => a + v * cmf[c].values[i] * GRID_STEP_NM, 0);
      expect(Math.abs(wc.reduce((a, b) => a + b, 0) - plain)).toBeLessThanOrEqual(TOL);
      wc.forEach((v, i) => expect(v).toBe(e.values[i] * cmf[c].values[i] * GRID_STEP_NM));
    });
  });
});
