/**
 * How sure is a grey: the range of medium exposures a colour can give when only its colour is known.
 *
 * A colour value fixes three numbers (CIE XYZ under D65), not a spectrum: every reflectance ρ with the
 * same XYZ (a metamer) looks the same to the eye, yet a film or sensor behind filters can see them very
 * differently. For a light path with medium weights w (m = Σ wᵢ·ρᵢ, integration.ts):
 *
 * - possible range: the least and greatest m over all reflectances 0 ≤ ρ(λ) ≤ 1 on the estimate's grid
 *   (350–900 nm at 5 nm, carried to the working grid by linear interpolation, policy.ts) with the colour's
 *   XYZ under D65 (the eye's own integration rule) — two linear programs, solved by
 *   the bounded simplex of bounded-simplex.ts. This is one channel of the metamer mismatch body:
 *   A. D. Logvinenko, B. Funt and C. Godau, "Metamer mismatching", IEEE Transactions on Image Processing
 *   23(1), 2014; one-channel extremes by linear programming as in P. Centore, "A linear programming
 *   approach to metamer mismatching", Color Research & Application, 2017 (the method, here in our own code).
 * - plausible range: the same programs over smooth reflectances only, as real surfaces are: ρ piecewise
 *   linear between knots PLAUSIBLE_KNOT_NM apart, each knot's value in [0, 1] (so ρ stays in [0, 1]).
 *   The knot spacing was chosen on published measured reflectances (README, "How sure is a grey"):
 *   the truth of those surfaces falls inside it in most cases while it is clearly narrower than the
 *   possible range. When no smooth reflectance has the colour (very saturated colours), the spacing is
 *   halved until one does (ending at the grid itself, i.e. the possible range); `plausibleKnotNm` says
 *   which spacing answered. Beyond the eye's 360–830 nm the colour says nothing, so a medium that sees
 *   the near infrared gets wide ranges there: that is what is not known.
 *
 * Values are medium exposures m (relative to white, 0.18 = middle grey), the scale of `exposure` in
 * compute.ts; callers turn them into stops.
 */
import { boundedExtremes, type BoundedSolution } from './bounded-simplex';
import { tristimulusWeights } from './integrate';
import { cieIlluminant } from './lights';
import { ESTIMATE_SHAPE, ESTIMATE_SIZE, ESTIMATE_STEP_NM, GRID_SIZE, wavelengthsOf, weightsToEstimateGrid } from './policy';
import type { Xyz } from './types';

/** Knot spacing of the plausible (smooth) reflectances, nm. */
export const PLAUSIBLE_KNOT_NM = 60;

/** The exposure range of one colour through one light path. */
export interface ExposureRange {
  /** least and greatest m over every reflectance 0..1 with the colour (relative to white) */
  possible: [number, number];
  /** the same over smooth reflectances */
  plausible: [number, number];
  /** the knot spacing the plausible range was found with, nm (ESTIMATE_STEP_NM when only the possible set had the colour) */
  plausibleKnotNm: number;
  /** the reflectances on the estimate's grid (ESTIMATE_NM) that reach the possible range's ends (when asked for) */
  extremes?: { low: Float64Array; high: Float64Array };
}

/** Wavelengths of the grid the programs range over (the estimate's grid, 350–900 nm at 5 nm), nm. */
export const ESTIMATE_NM: Float64Array = wavelengthsOf(ESTIMATE_SHAPE);

// The colour constraints: XYZ under D65 with the eye's integration weights (integrate.ts), on the working
// grid for `xyzD65` and carried to the estimate's grid for the programs (rows X, Y, Z).
const D65 = tristimulusWeights(cieIlluminant('D65'));
const EYE_ROWS = new Float64Array(3 * ESTIMATE_SIZE);
EYE_ROWS.set(weightsToEstimateGrid(D65.x), 0);
EYE_ROWS.set(weightsToEstimateGrid(D65.y), ESTIMATE_SIZE);
EYE_ROWS.set(weightsToEstimateGrid(D65.z), 2 * ESTIMATE_SIZE);

const onEstimateGrid = new WeakMap<Float64Array, Float64Array>();
/** A light path's medium weights (working grid) carried to the estimate's grid, once per weights array. */
export function estimateWeights(weights: Float64Array): Float64Array {
  let w = onEstimateGrid.get(weights);
  if (!w) onEstimateGrid.set(weights, (w = weightsToEstimateGrid(weights)));
  return w;
}

/** XYZ under D65 (Y = 100 for the perfect white) of a reflectance on the working grid: the colour a range is for. */
export function xyzD65(reflectance: ArrayLike<number>): Xyz {
  let x = 0;
  let y = 0;
  let z = 0;
  for (let i = 0; i < GRID_SIZE; i++) {
    x += reflectance[i] * D65.x[i];
    y += reflectance[i] * D65.y[i];
    z += reflectance[i] * D65.z[i];
  }
  return [x, y, z];
}

/** A smooth basis: hat functions on knots `knotNm` apart across the estimate's grid (grid × knots, row-major). */
interface Basis {
  knotNm: number;
  knots: number;
  /** ESTIMATE_SIZE × knots */
  hat: Float64Array;
  /** EYE_ROWS · hat, 3 × knots */
  rows: Float64Array;
}

const bases = new Map<number, Basis>();
function basis(knotNm: number): Basis {
  let b = bases.get(knotNm);
  if (b) return b;
  const start = ESTIMATE_NM[0];
  const end = ESTIMATE_NM[ESTIMATE_SIZE - 1];
  const knots = Math.ceil((end - start) / knotNm - 1e-9) + 1;
  const hat = new Float64Array(ESTIMATE_SIZE * knots);
  for (let i = 0; i < ESTIMATE_SIZE; i++) {
    for (let k = 0; k < knots; k++) {
      const at = Math.min(end, start + k * knotNm);
      const prev = k > 0 ? Math.min(end, start + (k - 1) * knotNm) : at;
      const next = k < knots - 1 ? Math.min(end, start + (k + 1) * knotNm) : at;
      const nm = ESTIMATE_NM[i];
      let v = 0;
      if (nm === at) v = 1;
      else if (nm < at && nm > prev) v = (nm - prev) / (at - prev);
      else if (nm > at && nm < next) v = (next - nm) / (next - at);
      hat[i * knots + k] = v;
    }
  }
  const rows = new Float64Array(3 * knots);
  for (let r = 0; r < 3; r++) {
    for (let k = 0; k < knots; k++) {
      let s = 0;
      for (let i = 0; i < ESTIMATE_SIZE; i++) s += EYE_ROWS[r * ESTIMATE_SIZE + i] * hat[i * knots + k];
      rows[r * knots + k] = s;
    }
  }
  b = { knotNm, knots, hat, rows };
  bases.set(knotNm, b);
  return b;
}

/**
 * The plausible program's matrices for a knot spacing (nm), for checking the programs elsewhere (copies; the
 * solver keeps its own): `hat` (ESTIMATE_SIZE × knots, row-major) turns knot values into a reflectance on the
 * estimate's grid, ρ = hat · k; `rows` (3 × knots) = the D65 XYZ rows on that grid times `hat`, so the smooth
 * program is min / max (hatᵀ·wₑ)ᵀk subject to rows · k = XYZ, 0 ≤ k ≤ 1, with wₑ = `estimateWeights(w)`.
 */
export function plausibleProgram(knotNm: number = PLAUSIBLE_KNOT_NM): { knotNm: number; knots: number; hat: Float64Array; rows: Float64Array } {
  const b = basis(knotNm);
  return { knotNm, knots: b.knots, hat: Float64Array.from(b.hat), rows: Float64Array.from(b.rows) };
}

function project(b: Basis, weights: ArrayLike<number>): Float64Array {
  const out = new Float64Array(b.knots);
  for (let i = 0; i < ESTIMATE_SIZE; i++) {
    const w = weights[i];
    if (w === 0) continue;
    for (let k = 0; k < b.knots; k++) out[k] += w * b.hat[i * b.knots + k];
  }
  return out;
}

const projected = new WeakMap<ArrayLike<number>, Map<number, Float64Array>>();
function projectedWeights(b: Basis, weights: Float64Array): Float64Array {
  let byKnot = projected.get(weights);
  if (!byKnot) projected.set(weights, (byKnot = new Map()));
  let p = byKnot.get(b.knotNm);
  if (!p) byKnot.set(b.knotNm, (p = project(b, estimateWeights(weights))));
  return p;
}

function plausibleRangeSmooth(xyz: Xyz, weights: Float64Array): { range: [number, number]; knotNm: number } | null {
  for (let knotNm = PLAUSIBLE_KNOT_NM; knotNm > ESTIMATE_STEP_NM; knotNm /= 2) {
    const b = basis(knotNm);
    const r = boundedExtremes({ a: b.rows, rows: 3, n: b.knots, b: xyz }, projectedWeights(b, weights));
    if (r) return { range: [r.min.value, r.max.value], knotNm };
  }
  return null;
}

/** The plausible range alone (m, relative to white) and the knot spacing that answered; null when no reflectance has the colour. */
export function plausibleRange(xyz: Xyz, weights: Float64Array): { range: [number, number]; knotNm: number } | null {
  for (let knotNm = PLAUSIBLE_KNOT_NM; knotNm > ESTIMATE_STEP_NM; knotNm /= 2) {
    const b = basis(knotNm);
    const r = boundedExtremes({ a: b.rows, rows: 3, n: b.knots, b: xyz }, projectedWeights(b, weights));
    if (r) return { range: [r.min.value, r.max.value], knotNm };
  }
  const r = boundedExtremes({ a: EYE_ROWS, rows: 3, n: ESTIMATE_SIZE, b: xyz }, estimateWeights(weights));
  return r ? { range: [r.min.value, r.max.value], knotNm: ESTIMATE_STEP_NM } : null;
}

/**
 * The possible and plausible exposure ranges of the colour `xyz` (XYZ under D65, Y = 100 for white) through
 * a light path with medium weights `weights` (m = Σ wᵢ·ρᵢ on the grid). Pass `extremes` to get the two
 * reflectances reaching the possible range's ends. A colour no reflectance 0..1 can have (outside the
 * object-colour solid) gets a zero-width range at `fallback` (the estimate's exposure), since there is
 * nothing to range over.
 */
export function exposureRange(xyz: Xyz, weights: Float64Array, fallback: number, options: { extremes?: boolean } = {}): ExposureRange {
  const r = boundedExtremes({ a: EYE_ROWS, rows: 3, n: ESTIMATE_SIZE, b: xyz }, estimateWeights(weights));
  if (!r) return { possible: [fallback, fallback], plausible: [fallback, fallback], plausibleKnotNm: ESTIMATE_STEP_NM };
  const possible: [number, number] = [Math.min(r.min.value, fallback), Math.max(r.max.value, fallback)];
  const p = plausibleRangeSmooth(xyz, weights);
  // the smooth set lies inside the possible one; rounding aside, keep it so, and keep the estimate in both
  const plausible: [number, number] = p
    ? [Math.max(possible[0], Math.min(p.range[0], fallback)), Math.min(possible[1], Math.max(p.range[1], fallback))]
    : possible;
  const out: ExposureRange = { possible, plausible, plausibleKnotNm: p ? p.knotNm : ESTIMATE_STEP_NM };
  if (options.extremes) out.extremes = { low: r.min.x, high: r.max.x };
  return out;
}

export type { BoundedSolution };
