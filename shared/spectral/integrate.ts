/**
 * Integration on the working grid, by the rule written in policy.ts: every integral is the sum over the
 * 1 nm working grid (350–900 nm) times the step, with half weight at the two ends (the trapezoid rule), of
 * the spectra as the policy put them there; the CIE observer is Sprague-interpolated to 1 nm (cie.ts) and
 * zero outside 360–830 nm. CIE 015:2018 names 1 nm summation as the reference. It reduces to one weight
 * per grid sample and light path (in the manner of the ASTM E308 weighting tables), so a surface costs
 * one dot product per quantity.
 */
import { CMF } from './cie';
import { GRID_SIZE, GRID_STEP_NM } from './policy';
import { onGrid } from './spectrum';
import type { Spectrum, Xyz } from './types';

/** Σ a·b over the grid (both on the grid). */
export function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

/** The trapezoid weights of the working grid, nm (the step, halved at both ends). */
const STEP_WEIGHTS = Float64Array.from({ length: GRID_SIZE }, (_, i) => (i === 0 || i === GRID_SIZE - 1 ? 0.5 : 1) * GRID_STEP_NM);

/**
 * Integration weights W (on the grid) of the product of `factors` (grid spectra): ∫ ρ·Πf dλ = Σ ρᵢ·Wᵢ for
 * any reflectance ρ on the grid. Units: those of Πf times nm.
 */
export function integrationWeights(...factors: Spectrum[]): Float64Array {
  const w = Float64Array.from(STEP_WEIGHTS);
  for (const f of factors) {
    const v = onGrid(f).values;
    for (let i = 0; i < GRID_SIZE; i++) w[i] *= v[i];
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

/** Un-normalised observer weights of a spectral power E for x̄, ȳ, z̄ (∫ ρ·E·x̄ dλ = Σ ρᵢ·wxᵢ). */
export function observerWeights(power: Spectrum): [Float64Array, Float64Array, Float64Array] {
  return [integrationWeights(power, CMF.x), integrationWeights(power, CMF.y), integrationWeights(power, CMF.z)];
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
