/**
 * Integration on the working grid: summation of products at 5 nm (CIE 015:2018 §7; policy.ts).
 */
import { CMF } from './cie';
import { onGrid, type Spectrum } from './spectrum';

/** Σ a·b over the grid (both on the grid). */
export function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

/** Σ a·b·c over the grid. */
export function dot3(a: ArrayLike<number>, b: ArrayLike<number>, c: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i] * c[i];
  return s;
}

/** XYZ tristimulus values, Y = 100 for the perfect reflecting diffuser under the light. */
export type Xyz = [number, number, number];

/**
 * Per-sample weights k·E·x̄, k·E·ȳ, k·E·z̄ of a light (k = 100 / Σ E·ȳ, CIE 015:2018 §7.1), so that
 * X = Σ ρ·wx for a reflectance ρ on the grid. Precompute once per light.
 */
export function tristimulusWeights(light: Spectrum): { x: Float64Array; y: Float64Array; z: Float64Array } {
  const e = onGrid(light).values;
  const k = 100 / dot(e, CMF.y.values);
  const w = (c: Float64Array) => c.map((v, i) => k * v * e[i]);
  return { x: w(CMF.x.values), y: w(CMF.y.values), z: w(CMF.z.values) };
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
  let x = 0;
  let y = 0;
  let z = 0;
  for (let i = 0; i < w.x.length; i++) {
    x += w.x[i];
    y += w.y[i];
    z += w.z[i];
  }
  return [x, y, z];
}
