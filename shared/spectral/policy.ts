/**
 * THE numeric policy of the spectral engine, written once.
 *
 * Standards followed: CIE 015:2018 "Colorimetry", 4th ed. (tristimulus values by summation at 1 nm over the
 * range of the data, 5 nm an acceptable approximation for smooth data), and CIE 167:2005 "Recommended practice
 * for tabulating spectral data for use in colour computations" (interpolate tabulated data; beyond the
 * measured range hold the nearest measured value constant rather than extrapolate).
 *
 * - Working grid: 350–900 nm at 1 nm, 551 samples. Every spectrum the engine computes with lives on it, so
 *   lamp lines, narrow filter notches and the structure of 1 nm spectrometer data are all kept, and the
 *   near ultraviolet and infrared that emulsions and tungsten reach are inside it.
 * - Inside a data set's range: linear interpolation between the two neighbouring samples (measured data
 *   arrive at any, often uneven, spacing; linear interpolation never overshoots or invents structure).
 *   Data finer than the grid are band-integrated into it (each datum shared between its two neighbouring
 *   grid wavelengths by the grid's tent functions), so a 0.1 nm spectrometer export keeps the energy and
 *   the centre of every line.
 *   (The smooth, uniformly tabulated CIE observer alone is interpolated by Sprague's formula.)
 * - Beyond a data set's range, by the kind of curve (`Beyond`):
 *     lights, filters, reflectances: the end value held constant (CIE 167 practice: the nearest
 *       measured value is the best guess, and a lamp or a gel does not stop at the end of a table);
 *     media: zero. A sensitivity curve ends where the maker stopped measuring a response, usually
 *       because there was none left; holding its last value would give a red-blind emulsion sensitivity
 *       out to 900 nm. Data that end while still high should be extended by whoever has them.
 *     the CIE observer: zero outside its published 360–830 nm (the eye sees nothing there).
 * - Integration: every integral is a sum over the working grid times its 1 nm step (trapezoid ends),
 *   so every light path reduces to 551 weights and a surface costs one dot product per quantity.
 * - Normalisation: XYZ so that Y = 100 for the perfect reflecting diffuser under the same light
 *   (CIE 015:2018, k = 100 / ∫ E·ȳ); lights to a peak of 1 inside the grid (relative power has no
 *   absolute scale, and every result is a ratio); media to a peak of 1 (relative sensitivity);
 *   filters, reflectances and the observer are left as they are (they are absolute fractions).
 * - The estimate's grid: 350–900 nm at 5 nm (111 samples). Estimated reflectances (colour values have no
 *   spectrum; estimate.ts) are smooth, so they are solved and tabulated on it and carried to the working
 *   grid by linear interpolation (`estimateToGrid`); the metamer programs range over reflectances on it.
 * - A spectrum on another grid is resampled explicitly (`resample` in spectrum.ts, by `interpolateAt`
 *   below), never silently.
 */
import type { SpectrumShape } from './types';

/** First wavelength of the working grid, nm. */
export const GRID_START_NM = 350;
/** Last wavelength of the working grid, nm. */
export const GRID_END_NM = 900;
/** Working interval, nm (CIE 015:2018's summation interval). */
export const GRID_STEP_NM = 1;
/** Number of samples on the working grid (551). */
export const GRID_SIZE = Math.round((GRID_END_NM - GRID_START_NM) / GRID_STEP_NM) + 1;
/** The working grid as a shape. */
export const GRID_SHAPE: SpectrumShape = Object.freeze({ startNm: GRID_START_NM, endNm: GRID_END_NM, stepNm: GRID_STEP_NM });
/** Measured data must cover at least this range, nm (the visible core). */
export const MIN_COVERAGE_NM: readonly [number, number] = [400, 700];
/** The published range of the CIE 1931 observer, nm: the eye's values are zero outside it. */
export const OBSERVER_RANGE_NM: readonly [number, number] = [360, 830];

/** Interval of the estimate's grid, nm. */
export const ESTIMATE_STEP_NM = 5;
/** The estimate's grid as a shape (350–900 nm at 5 nm). */
export const ESTIMATE_SHAPE: SpectrumShape = Object.freeze({ startNm: GRID_START_NM, endNm: GRID_END_NM, stepNm: ESTIMATE_STEP_NM });
/** Number of samples on the estimate's grid (111). */
export const ESTIMATE_SIZE = Math.round((GRID_END_NM - GRID_START_NM) / ESTIMATE_STEP_NM) + 1;

/** What a curve does beyond its data: held constant (lights, filters, reflectances) or zero (media). */
export type Beyond = 'hold' | 'zero';

/**
 * Samples (nm ascending, values) at each wavelength of `targetNm` by the policy: linear interpolation
 * inside [nm[0], nm[last]]; outside, the end value held constant ('hold') or the number `outside`.
 * Units of the values are kept. Preconditions (checked by the callers that read user data): nm strictly
 * ascending, same length ≥ 1.
 */
export function interpolateAt(nm: ArrayLike<number>, values: ArrayLike<number>, targetNm: ArrayLike<number>, outside: number | 'hold' = 'hold'): Float64Array {
  const out = new Float64Array(targetNm.length);
  const n = nm.length;
  let j = 0;
  for (let i = 0; i < targetNm.length; i++) {
    const x = targetNm[i];
    if (x <= nm[0]) {
      out[i] = x < nm[0] && outside !== 'hold' ? outside : values[0];
      continue;
    }
    if (x >= nm[n - 1]) {
      out[i] = x > nm[n - 1] && outside !== 'hold' ? outside : values[n - 1];
      continue;
    }
    if (nm[j] > x) j = 0;
    while (j < n - 2 && nm[j + 1] < x) j++;
    const x0 = nm[j];
    const x1 = nm[j + 1];
    const f = (x - x0) / (x1 - x0);
    out[i] = values[j] + f * (values[j + 1] - values[j]);
  }
  return out;
}

/** The wavelengths, nm, of a regular shape (start, start + step, … end). */
export function wavelengthsOf(shape: SpectrumShape): Float64Array {
  const n = Math.round((shape.endNm - shape.startNm) / shape.stepNm) + 1;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = shape.startNm + i * shape.stepNm;
  return out;
}

/**
 * Sprague's fifth-order interpolation (CIE 167:2005) of uniformly tabulated `values` (first at
 * `startNm`, spacing `stepNm`) at `nm`; the end samples are repeated beyond the table. Used for the
 * CIE observer only (measured data are interpolated linearly).
 */
export function spragueAt(startNm: number, stepNm: number, values: ArrayLike<number>, nm: number): number {
  const n = values.length;
  const t = (nm - startNm) / stepNm;
  const i = Math.max(0, Math.min(n - 2, Math.floor(t)));
  const f = Math.max(0, Math.min(1, t - i));
  const p = (k: number) => values[Math.max(0, Math.min(n - 1, k))];
  const p0 = p(i - 2);
  const p1 = p(i - 1);
  const p2 = p(i);
  const p3 = p(i + 1);
  const p4 = p(i + 2);
  const p5 = p(i + 3);
  const a1 = (2 * p0 - 16 * p1 + 16 * p3 - 2 * p4) / 24;
  const a2 = (-p0 + 16 * p1 - 30 * p2 + 16 * p3 - p4) / 24;
  const a3 = (-9 * p0 + 39 * p1 - 70 * p2 + 66 * p3 - 33 * p4 + 7 * p5) / 24;
  const a4 = (13 * p0 - 64 * p1 + 126 * p2 - 124 * p3 + 61 * p4 - 12 * p5) / 24;
  const a5 = (-5 * p0 + 25 * p1 - 50 * p2 + 50 * p3 - 25 * p4 + 5 * p5) / 24;
  return p2 + f * (a1 + f * (a2 + f * (a3 + f * (a4 + f * a5))));
}

/**
 * Data (nm ascending, values) onto the working grid by the policy: linearly interpolated where the data are
 * as coarse as the grid or coarser; where they are finer (any spacing under a step), band-integrated into
 * it — each datum, weighted by the width it stands for, is shared between its two neighbouring grid
 * wavelengths in proportion to its distance from them (the grid's tent functions), and each grid sample is
 * the tent-weighted mean of the data near it. That keeps a narrow line's energy and its centre (a line at
 * 546.5 nm lands half on 546 and half on 547). Beyond the data: `beyond` ('hold' or 'zero'), or the number
 * `outside` when given (e.g. −∞ for log10 sensitivities, so they become zero).
 */
export function onWorkingGrid(nm: ArrayLike<number>, values: ArrayLike<number>, beyond: Beyond, outside?: number): Float64Array {
  const fill = outside ?? (beyond === 'zero' ? 0 : 'hold');
  const out = interpolateAt(nm, values, wavelengthsOf(GRID_SHAPE), fill);
  const n = nm.length;
  let finer = false;
  for (let k = 1; k < n && !finer; k++) if (nm[k] - nm[k - 1] < GRID_STEP_NM) finer = true;
  if (!finer) return out;
  const sum = new Float64Array(GRID_SIZE);
  const weight = new Float64Array(GRID_SIZE);
  for (let k = 0; k < n; k++) {
    const width = ((k < n - 1 ? nm[k + 1] : nm[k]) - (k > 0 ? nm[k - 1] : nm[k])) / 2 || GRID_STEP_NM;
    const t = (nm[k] - GRID_START_NM) / GRID_STEP_NM;
    const i = Math.floor(t);
    const f = t - i;
    for (const [j, share] of [[i, 1 - f], [i + 1, f]] as const) {
      if (j < 0 || j >= GRID_SIZE || share === 0) continue;
      sum[j] += values[k] * width * share;
      weight[j] += width * share;
    }
  }
  const first = nm[0];
  const last = nm[n - 1];
  for (let i = 0; i < GRID_SIZE; i++) {
    const x = GRID_START_NM + i * GRID_STEP_NM;
    if (x >= first && x <= last && weight[i] > 0) out[i] = sum[i] / weight[i];
  }
  return out;
}

// each working-grid sample's lower estimate-grid node and its fraction towards the next (linear interpolation)
const E_NODE = new Int32Array(GRID_SIZE);
const E_FRAC = new Float64Array(GRID_SIZE);
for (let i = 0; i < GRID_SIZE; i++) {
  const t = (i * GRID_STEP_NM) / ESTIMATE_STEP_NM;
  const k = Math.min(Math.floor(t), ESTIMATE_SIZE - 2);
  E_NODE[i] = k;
  E_FRAC[i] = t - k;
}

/** The estimate's grid values (ESTIMATE_SIZE) → the working grid, by linear interpolation (exact at its nodes). */
export function estimateToGrid(values: ArrayLike<number>, out: Float64Array = new Float64Array(GRID_SIZE)): Float64Array {
  for (let i = 0; i < GRID_SIZE; i++) {
    const k = E_NODE[i];
    const f = E_FRAC[i];
    out[i] = values[k] + f * (values[k + 1] - values[k]);
  }
  return out;
}

/**
 * Working-grid weights w (m = Σ wᵢ·ρᵢ) → weights on the estimate's grid, so that Σ w·(estimateToGrid ρₑ) =
 * Σ wₑ·ρₑ exactly (the transpose of the interpolation).
 */
export function weightsToEstimateGrid(weights: ArrayLike<number>): Float64Array {
  const out = new Float64Array(ESTIMATE_SIZE);
  for (let i = 0; i < GRID_SIZE; i++) {
    const k = E_NODE[i];
    const f = E_FRAC[i];
    out[k] += weights[i] * (1 - f);
    out[k + 1] += weights[i] * f;
  }
  return out;
}
