/**
 * THE numeric policy of the spectral engine, written once.
 *
 * Standards followed: CIE 015:2018 "Colorimetry", 4th ed. (tristimulus values from spectral data at a
 * 5 nm interval over 380–780 nm; data at other spacings interpolated) and CIE 167:2005 "Recommended
 * practice for tabulating spectral data for use in colour computations" (interpolate tabulated data;
 * beyond the measured range hold the nearest measured value constant rather than extrapolate).
 *
 * - Working grid: 380–780 nm at 5 nm, 81 samples. Every spectrum the engine computes with lives on it.
 * - Inside a data set's range: linear interpolation between the two neighbouring samples. Measured
 *   data arrive at any, often uneven, spacing; linear interpolation never overshoots or invents
 *   structure. (The smooth, uniformly tabulated CIE observer alone is interpolated by Sprague's
 *   formula, see Integration.)
 * - Outside it: the end value held constant (constant extrapolation).
 * - Integration: the integral over 380–780 nm of the spectra as interpolated above (linear between
 *   samples), evaluated on a 1 nm sub-grid; the CIE observer, a smooth published function, is
 *   interpolated there by Sprague's fifth-order formula (CIE 167:2005 recommends it for uniformly
 *   tabulated data). Tristimulus weights are then normalised per channel to the plain 5 nm summation
 *   (CIE 015:2018), so the perfect white gives the CIE white points. See integrate.ts.
 * - Normalisation: XYZ so that Y = 100 for the perfect reflecting diffuser under the same light
 *   (CIE 015:2018, k = 100 / ∫ E·ȳ); lights to a peak of 1 inside the grid (relative power has no
 *   absolute scale, and every result is a ratio); media to a peak of 1 (relative sensitivity);
 *   filters, reflectances and the observer are left as they are (they are absolute fractions).
 * - A spectrum on another grid is resampled explicitly (`resample` in spectrum.ts, by `interpolateAt`
 *   below), never silently.
 */
import type { SpectrumShape } from './types';

/** First wavelength of the working grid, nm (CIE 015:2018). */
export const GRID_START_NM = 380;
/** Last wavelength of the working grid, nm. */
export const GRID_END_NM = 780;
/** Working interval, nm. */
export const GRID_STEP_NM = 5;
/** Number of samples on the working grid (81). */
export const GRID_SIZE = Math.round((GRID_END_NM - GRID_START_NM) / GRID_STEP_NM) + 1;
/** The working grid as a shape. */
export const GRID_SHAPE: SpectrumShape = Object.freeze({ startNm: GRID_START_NM, endNm: GRID_END_NM, stepNm: GRID_STEP_NM });
/** Step of the integration sub-grid, nm. */
export const INTEGRATION_STEP_NM = 1;
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
