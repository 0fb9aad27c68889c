/**
 * Spectra: a regular shape plus sampled values. Values are immutable by convention: every function
 * here returns a new spectrum and never writes into its arguments.
 */
import { SpectralInputError } from './errors';
import { GRID_SHAPE, GRID_SIZE, MIN_COVERAGE_NM, interpolateAt, onWorkingGrid, wavelengthsOf, type Beyond } from './policy';
import { isGridShape } from './grid';
import type { Spectrum, SpectrumShape } from './types';

export type { Spectrum } from './types';

/** Wraps values (copied) as a spectrum on `shape` (default: the working grid). */
export function makeSpectrum(values: ArrayLike<number>, shape: SpectrumShape = GRID_SHAPE): Spectrum {
  const expected = Math.round((shape.endNm - shape.startNm) / shape.stepNm) + 1;
  if (values.length !== expected) throw new Error(`makeSpectrum: ${values.length} values for a shape of ${expected}`);
  return Object.freeze({ shape: Object.freeze({ ...shape }), values: Float64Array.from(values) });
}

/** A spectrum equal to `value` everywhere on the working grid. */
export function constantSpectrum(value: number): Spectrum {
  return makeSpectrum(new Float64Array(GRID_SIZE).fill(value));
}

/** Resamples onto `shape` (default: the working grid) by the policy in policy.ts. */
export function resample(s: Spectrum, shape: SpectrumShape = GRID_SHAPE): Spectrum {
  if (s.shape.startNm === shape.startNm && s.shape.endNm === shape.endNm && s.shape.stepNm === shape.stepNm) return s;
  return makeSpectrum(interpolateAt(wavelengthsOf(s.shape), s.values, wavelengthsOf(shape)), shape);
}

/** The spectrum on the working grid; resamples explicitly when it is elsewhere. */
export function onGrid(s: Spectrum): Spectrum {
  return isGridShape(s.shape) ? s : resample(s, GRID_SHAPE);
}

function requireSameShape(a: Spectrum, b: Spectrum): void {
  if (a.values.length !== b.values.length || a.shape.startNm !== b.shape.startNm || a.shape.stepNm !== b.shape.stepNm) {
    throw new Error('spectra on different grids: resample them explicitly first');
  }
}

/** Sample-by-sample product (filters stacking, light × gel, E·T·S). Same shape required. */
export function multiply(a: Spectrum, ...rest: Spectrum[]): Spectrum {
  const out = Float64Array.from(a.values);
  for (const b of rest) {
    requireSameShape(a, b);
    for (let i = 0; i < out.length; i++) out[i] *= b.values[i];
  }
  return makeSpectrum(out, a.shape);
}

/** The spectrum times a constant. */
export function scale(s: Spectrum, k: number): Spectrum {
  return makeSpectrum(s.values.map((v) => v * k), s.shape);
}

/** Applies `fn(value, nm)` to every sample. */
export function mapValues(s: Spectrum, fn: (value: number, nm: number) => number): Spectrum {
  const nm = wavelengthsOf(s.shape);
  return makeSpectrum(s.values.map((v, i) => fn(v, nm[i])), s.shape);
}

/** Scaled to a peak of 1 (policy for lights and media). Refuses an all-zero spectrum. */
export function normalisePeak(s: Spectrum, what = 'spectrum'): Spectrum {
  let max = 0;
  for (const v of s.values) if (v > max) max = v;
  if (!(max > 0)) throw new SpectralInputError(`the ${what} is zero everywhere in 350–900 nm`);
  // an overflowing value would turn every other into 0 and itself into NaN (null in JSON): refuse it instead
  if (!Number.isFinite(max)) throw new SpectralInputError(`the ${what} has values too large to compute with (beyond 1.8e308); check its unit or basis (log10 sensitivities lie around −3 to 3)`);
  return scale(s, 1 / max);
}

/** The value at `nm`, by the same interpolation policy. */
export function valueAt(s: Spectrum, nm: number): number {
  return interpolateAt(wavelengthsOf(s.shape), s.values, [nm])[0];
}

/** Plain `[nm, value]` pairs of a spectrum (for JSON). */
export function toPairs(s: Spectrum): [number, number][] {
  const nm = wavelengthsOf(s.shape);
  return Array.from(s.values, (v, i) => [nm[i], v]);
}

/** How values may range when read from pairs. */
export interface PairLimits {
  /** smallest allowed value (omit for none, e.g. log10 sensitivities) */
  min?: number;
  /** largest allowed value */
  max?: number;
  /** words for the quantity in messages, e.g. "transmittance" */
  quantity?: string;
  /** extra advice when a value exceeds `max` */
  overMaxHint?: string;
  /** beyond the data (policy.ts): held constant (default) or zero */
  beyond?: Beyond;
  /** the value beyond the data, overriding `beyond` (e.g. −∞ for log10 sensitivities) */
  outside?: number;
}

/**
 * Reads `[nm, value]` pairs at any spacing and in any order, checks them and puts them onto the working
 * grid by the policy (band-averaged where finer than the grid; beyond the data per `limits.beyond`). Throws SpectralInputError, with the path of the bad pair, for:
 * non-numbers, wavelengths ≤ 0, duplicate wavelengths, values outside `limits`, fewer than 3 points,
 * and data not covering at least 400–700 nm.
 */
export function spectrumFromPairs(pairs: unknown, limits: PairLimits = {}): Spectrum {
  const quantity = limits.quantity ?? 'value';
  if (!Array.isArray(pairs)) throw new SpectralInputError('expected a list of [nm, value] pairs');
  if (pairs.length < 3) throw new SpectralInputError(`needs at least 3 [nm, value] points, got ${pairs.length}`);
  const rows: [number, number, number][] = [];
  pairs.forEach((pair: unknown, i: number) => {
    if (!Array.isArray(pair) || pair.length !== 2) throw new SpectralInputError('each point must be a pair [nm, value]', [i]);
    const [nm, v] = pair as unknown[];
    if (typeof nm !== 'number' || !Number.isFinite(nm)) throw new SpectralInputError('the wavelength is not a number', [i, 0]);
    if (typeof v !== 'number' || !Number.isFinite(v)) throw new SpectralInputError(`the ${quantity} at ${nm} nm is not a number`, [i, 1]);
    if (nm <= 0) throw new SpectralInputError(`wavelength ${nm} nm is not positive`, [i, 0]);
    if (limits.min !== undefined && v < limits.min) {
      throw new SpectralInputError(
        limits.min === 0 ? `the ${quantity} at ${nm} nm is negative (${v})` : `the ${quantity} at ${nm} nm is below ${limits.min} (${v})`,
        [i, 1],
      );
    }
    if (limits.max !== undefined && v > limits.max) {
      throw new SpectralInputError(`the ${quantity} at ${nm} nm is above ${limits.max} (${v})${limits.overMaxHint ? `; ${limits.overMaxHint}` : ''}`, [i, 1]);
    }
    rows.push([nm, v, i]);
  });
  rows.sort((a, b) => a[0] - b[0]);
  for (let k = 1; k < rows.length; k++) {
    if (rows[k][0] === rows[k - 1][0]) throw new SpectralInputError(`wavelength ${rows[k][0]} nm appears twice`, [rows[k][2], 0]);
  }
  const first = rows[0][0];
  const last = rows[rows.length - 1][0];
  if (first > MIN_COVERAGE_NM[0] || last < MIN_COVERAGE_NM[1]) {
    throw new SpectralInputError(`the data cover ${first}–${last} nm; they must cover at least ${MIN_COVERAGE_NM[0]}–${MIN_COVERAGE_NM[1]} nm`);
  }
  const nm = rows.map((r) => r[0]);
  const values = rows.map((r) => r[1]);
  return makeSpectrum(onWorkingGrid(nm, values, limits.beyond ?? 'hold', limits.outside));
}

/**
 * Stored `[nm, value]` pairs (already checked and in the engine's basis, at any grid they were saved on)
 * onto the working grid by the policy, `beyond` their range as the kind of curve asks (policy.ts).
 */
export function spectrumFromStoredPairs(pairs: readonly (readonly [number, number])[], beyond: Beyond): Spectrum {
  return makeSpectrum(onWorkingGrid(pairs.map((p) => p[0]), pairs.map((p) => p[1]), beyond));
}
