/**
 * THE numeric policy of the spectral engine, written once.
 *
 * Standards followed: CIE 015:2018 "Colorimetry", 4th ed., §7 (tristimulus values by summation at a
 * 5 nm interval over 380–780 nm; data at other spacings interpolated) and CIE 167:2005 "Recommended
 * practice for tabulating spectral data for use in colour computations" (linear interpolation inside
 * the measured range; beyond it, hold the nearest measured value constant rather than extrapolate).
 *
 * - Working grid: 380–780 nm at 5 nm, 81 samples. Every spectrum the engine computes with lives on it.
 * - Inside a data set's range: linear interpolation between the two neighbouring samples.
 * - Outside it: the end value held constant (constant extrapolation).
 * - Integration: plain summation of products on the grid (Δλ = 5 nm cancels in every ratio we use).
 * - Normalisation: XYZ so that Y = 100 for the perfect reflecting diffuser under the same light
 *   (CIE 015 §7.1, k = 100 / Σ E·ȳ); lights to a peak of 1 inside the grid (relative power has no
 *   absolute scale, and every result is a ratio); media to a peak of 1 (relative sensitivity);
 *   filters, reflectances and the observer are left as they are (they are absolute fractions).
 * - A spectrum on another grid is resampled explicitly with `resample` below, never silently.
 */
import type { SpectrumShape } from './spectrum';

/** First wavelength of the working grid, nm (CIE 015:2018 §7.2). */
export const GRID_START_NM = 380;
/** Last wavelength of the working grid, nm. */
export const GRID_END_NM = 780;
/** Working interval, nm. */
export const GRID_STEP_NM = 5;
/** Number of samples on the working grid (81). */
export const GRID_SIZE = Math.round((GRID_END_NM - GRID_START_NM) / GRID_STEP_NM) + 1;
/** The working grid as a shape. */
export const GRID_SHAPE: SpectrumShape = Object.freeze({ startNm: GRID_START_NM, endNm: GRID_END_NM, stepNm: GRID_STEP_NM });
/** Measured data must cover at least this range, nm (the visible core of the grid). */
export const MIN_COVERAGE_NM: readonly [number, number] = [400, 700];

/**
 * Samples (nm ascending, values) at each wavelength of `targetNm` by the policy: linear interpolation
 * inside [nm[0], nm[last]], the end value held constant outside. Units of the values are kept.
 * Preconditions (checked by the callers that read user data): nm strictly ascending, same length ≥ 1.
 */
export function interpolateAt(nm: ArrayLike<number>, values: ArrayLike<number>, targetNm: ArrayLike<number>): Float64Array {
  const out = new Float64Array(targetNm.length);
  const n = nm.length;
  let j = 0;
  for (let i = 0; i < targetNm.length; i++) {
    const x = targetNm[i];
    if (x <= nm[0]) {
      out[i] = values[0];
      continue;
    }
    if (x >= nm[n - 1]) {
      out[i] = values[n - 1];
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
