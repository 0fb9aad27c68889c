/**
 * Integration on the working grid, by the rule written in policy.ts: every integral over 380–780 nm
 * is the integral of the spectra as the policy interpolates them (linear between the 5 nm samples),
 * evaluated on a 1 nm sub-grid, with the CIE observer (a smooth published function) interpolated by
 * Sprague's formula. It reduces to 81 weights per light path (in the manner of the ASTM E308
 * weighting tables), so a surface costs one dot product per quantity.
 */
import { CMF_TABLE } from './cie';
import { GRID_NM } from './grid';
import { GRID_SIZE, GRID_START_NM, GRID_STEP_NM, INTEGRATION_STEP_NM, interpolateAt, spragueAt } from './policy';
import { onGrid } from './spectrum';
import type { Spectrum, Xyz } from './types';

/** Σ a·b over the grid (both on the grid). */
export function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

const FINE_N = Math.round((GRID_NM[GRID_SIZE - 1] - GRID_START_NM) / INTEGRATION_STEP_NM) + 1;
/** The 1 nm integration sub-grid, nm. */
const FINE_NM = Float64Array.from({ length: FINE_N }, (_, k) => GRID_START_NM + k * INTEGRATION_STEP_NM);
// hat-function projection of each fine point onto its two grid neighbours, and trapezoid end weights
const FINE_I = new Int32Array(FINE_N);
const FINE_F = new Float64Array(FINE_N);
const FINE_W = new Float64Array(FINE_N);
for (let k = 0; k < FINE_N; k++) {
  const t = (FINE_NM[k] - GRID_START_NM) / GRID_STEP_NM;
  const i = Math.min(Math.floor(t), GRID_SIZE - 2);
  FINE_I[k] = i;
  FINE_F[k] = t - i;
  FINE_W[k] = ((k === 0 || k === FINE_N - 1) ? 0.5 : 1) * (INTEGRATION_STEP_NM / GRID_STEP_NM);
}
/** x̄, ȳ, z̄ on the sub-grid (Sprague interpolation of the full 360–830 nm table). */
const FINE_CMF = (['x', 'y', 'z'] as const).map((c) => Float64Array.from(FINE_NM, (nm) => spragueAt(CMF_TABLE.startNm, CMF_TABLE.stepNm, CMF_TABLE.values[c], nm)));

/**
 * Integration weights W (81, on the grid) of the product of `factors` (grid spectra, interpolated
 * linearly per policy): ∫ ρ·Πf dλ = Σ ρᵢ·Wᵢ for any reflectance ρ on the grid. Scaled so W sums to
 * the plain 5 nm sum for smooth factors (units: those of Πf, per 5 nm sample).
 */
export function integrationWeights(...factors: Spectrum[]): Float64Array {
  return project(factors.map((f) => interpolateAt(GRID_NM, onGrid(f).values, FINE_NM)));
}

function project(fineFactors: Float64Array[], extra?: Float64Array): Float64Array {
  const w = new Float64Array(GRID_SIZE);
  for (let k = 0; k < FINE_N; k++) {
    let p = FINE_W[k];
    for (const f of fineFactors) p *= f[k];
    if (extra) p *= extra[k];
    const i = FINE_I[k];
    w[i] += (1 - FINE_F[k]) * p;
    w[i + 1] += FINE_F[k] * p;
  }
  return w;
}

/** ∫ Πf dλ (the sum of `integrationWeights`), for filter factors and normalisations. */
export function integrate(...factors: Spectrum[]): number {
  const w = integrationWeights(...factors);
  let s = 0;
  for (const v of w) s += v;
  return s;
}

/**
 * Un-normalised observer weights of a spectral power E for x̄, ȳ, z̄ (∫ ρ·E·x̄ = Σ ρᵢ·wxᵢ, on the
 * scale of the plain 5 nm sum). Each channel is normalised to the plain 5 nm summation of E·x̄
 * (CIE 015:2018), so the perfect white gives the CIE white points, while a structured reflectance is
 * integrated as the policy interpolates it.
 */
export function observerWeights(power: Spectrum): [Float64Array, Float64Array, Float64Array] {
  const e = onGrid(power).values;
  const fineE = interpolateAt(GRID_NM, e, FINE_NM);
  const grid = [CMF_TABLE.onGrid.x, CMF_TABLE.onGrid.y, CMF_TABLE.onGrid.z];
  const [x, y, z] = FINE_CMF.map((c, ch) => {
    const wc = project([fineE], c);
    const target = dot(e, grid[ch]);
    let s = 0;
    for (const v of wc) s += v;
    return s > 0 ? wc.map((v) => (v * target) / s) : wc;
  });
  return [x, y, z];
}

/**
 * Per-sample weights of a light for X, Y, Z (X = Σ ρᵢ·wxᵢ), with Y = 100 for the perfect white
 * (k = 100 / ∫ E·ȳ, CIE 015:2018). Precompute once per light.
 */
export function tristimulusWeights(light: Spectrum): { x: Float64Array; y: Float64Array; z: Float64Array } {
  const w = observerWeights(light);
  const k = 100 / w[1].reduce((a, b) => a + b, 0);
  const [x, y, z] = w.map((wc) => wc.map((v) => v * k));
  return { x, y, z };
}

/** XYZ (Y = 100 for white) of reflectance `r` under `light` with the CIE 1931 2° observer. */
export function xyzOfReflectance(r: Spectrum, light: Spectrum): Xyz {
  const w = tristimulusWeights(light);
  const v = onGrid(r).values;
  return [dot(v, w.x), dot(v, w.y), dot(v, w.z)];
}

/** The white point of a light: XYZ of the perfect reflecting diffuser, Y = 100. */
export function whitePoint(light: Spectrum): Xyz {
  const w = tristimulusWeights(light);
  const sum = (a: Float64Array) => a.reduce((s, v) => s + v, 0);
  return [sum(w.x), sum(w.y), sum(w.z)];
}
