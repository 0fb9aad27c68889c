/**
 * Spectra for colour values: the smoothest reflectance in (0, 1) with a given colour.
 *
 * Method: S. A. Burns, "Numerical methods for smoothest reflectance reconstruction", Color Research &
 * Application 45(1), 2020 — the least hyperbolic tangent slope squared (LHTSS) reconstruction:
 *   ρ(λ) = (1 + tanh z(λ)) / 2,  minimise Σ (z(λᵢ₊₁) − z(λᵢ))²  subject to  A·ρ = XYZ,
 * on the estimate's grid (350–900 nm at 5 nm, policy.ts), with A the CIE 1931 2° tristimulus weights of D65
 * (the eye's integration rule, integrate.ts, carried to that grid) and XYZ the colour under D65 (Y = 100
 * for white). Where the eye sees nothing (below 360 and above 830 nm) the slope term alone decides, so
 * the reflectance continues flat: the estimate is defined there, and the metamer ranges say how little
 * is known of it. ρ stays strictly inside (0, 1) and
 * reproduces the colour; the tanh keeps the reconstruction flat where the eye gives no information
 * rather than bending it toward 0 or 1 (measured on published reflectances against the sigmoid-of-a-
 * quadratic it replaces: README, "How sure is a grey").
 * A tiny ridge ε·Σ z² (ε = RIDGE) keeps the problem strictly convex in z when the colour constraint is
 * inactive (a grey); it moves the solution by far less than the round-trip tolerance.
 *
 * Solver: Newton's method on the Lagrange conditions, each step solving the bordered tridiagonal system
 * by a Schur complement on the 3 multipliers (the Hessian in z is tridiagonal), with a halving line
 * search on the residual; O(n) per step, so a whole table of colours is built in seconds.
 */
import { ESTIMATE_SIZE } from './policy';
import type { Xyz } from './types';

/** Ridge weight on Σ z² (dimensionless, against the slope term). */
export const RIDGE = 1e-6;

/** The colour rows: three arrays of ESTIMATE_SIZE weights on the estimate's grid (X, Y, Z of ρ = Σ ρᵢ·rowᵢ). */
export type ColourRows = readonly [Float64Array, Float64Array, Float64Array];

/** A solve's state, reusable as the start of a neighbouring colour's solve. */
export interface LhtssState {
  z: Float64Array;
  lambda: Float64Array;
}

/** Outcome of one solve. */
export interface LhtssResult {
  /** reflectance 0..1 on the estimate's grid */
  reflectance: Float64Array;
  state: LhtssState;
  /** |A·ρ − XYZ| at the end (XYZ units, Y = 100 for white) */
  residual: number;
  iterations: number;
  converged: boolean;
}

const n = ESTIMATE_SIZE;
// scratch (allocation-free hot loop)
const rho = new Float64Array(n);
const d1 = new Float64Array(n);
const d2 = new Float64Array(n);
const g = new Float64Array(n);
const f1 = new Float64Array(n);
const diag = new Float64Array(n);
const cp = new Float64Array(n);
const u = new Float64Array(n);
const v = [new Float64Array(n), new Float64Array(n), new Float64Array(n)];
const zTry = new Float64Array(n);
const lTry = new Float64Array(3);
const f2 = new Float64Array(3);
const S = new Float64Array(9);
const rhs = new Float64Array(3);
const dl = new Float64Array(3);
const dz = new Float64Array(n);
const jr = [new Float64Array(n), new Float64Array(n), new Float64Array(n)];

/** ‖F‖² of the Lagrange conditions at (z, λ); fills rho, d1, g, f1, f2. */
function residualAt(rows: ColourRows, xyz: Xyz, z: Float64Array, lambda: ArrayLike<number>): number {
  for (let i = 0; i < n; i++) {
    const t = Math.tanh(z[i]);
    rho[i] = 0.5 + 0.5 * t;
    d1[i] = 0.5 * (1 - t * t);
    d2[i] = -t * (1 - t * t);
    g[i] = lambda[0] * rows[0][i] + lambda[1] * rows[1][i] + lambda[2] * rows[2][i];
  }
  let s = 0;
  for (let i = 0; i < n; i++) {
    // (DᵀD z)ᵢ for the first-difference operator D, plus the ridge
    let h = RIDGE * z[i];
    if (i > 0) h += z[i] - z[i - 1];
    if (i < n - 1) h += z[i] - z[i + 1];
    f1[i] = h + d1[i] * g[i];
    s += f1[i] * f1[i];
  }
  for (let r = 0; r < 3; r++) {
    let c = -xyz[r];
    for (let i = 0; i < n; i++) c += rows[r][i] * rho[i];
    f2[r] = c;
    s += c * c;
  }
  return s;
}

/** Solves the tridiagonal system (off-diagonals −1, diagonal `diag`) for `rhs` into `out` (Thomas; factor in cp). */
function factor(): boolean {
  let b = diag[0];
  if (!(Math.abs(b) > 1e-14)) return false;
  cp[0] = -1 / b;
  for (let i = 1; i < n; i++) {
    b = diag[i] + cp[i - 1];
    if (!(Math.abs(b) > 1e-14)) return false;
    cp[i] = -1 / b;
  }
  return true;
}
function solveFactored(rhs: ArrayLike<number>, out: Float64Array): void {
  // forward: out holds d'
  out[0] = rhs[0] / diag[0];
  for (let i = 1; i < n; i++) out[i] = (rhs[i] + out[i - 1]) / (diag[i] + cp[i - 1]);
  for (let i = n - 2; i >= 0; i--) out[i] -= cp[i] * out[i + 1];
}

/**
 * The LHTSS reflectance of `xyz` (XYZ under the light the rows are for, Y = 100 for white). Starts from
 * `start` (a neighbouring colour's state) or from ρ = ½. Colours outside what reflectances 0..1 can make
 * do not converge (`converged` false).
 */
export function lhtss(rows: ColourRows, xyz: Xyz, start?: LhtssState, maxIterations = 60, tolerance = 1e-9): LhtssResult {
  const z = start ? Float64Array.from(start.z) : new Float64Array(n);
  const lambda = start ? Float64Array.from(start.lambda) : new Float64Array(3);
  let fNorm = residualAt(rows, xyz, z, lambda);
  const scale = Math.max(1, Math.abs(xyz[0]) + Math.abs(xyz[1]) + Math.abs(xyz[2]));
  let it = 0;
  let converged = false;
  for (; it < maxIterations; it++) {
    let c2 = 0;
    for (let r = 0; r < 3; r++) c2 += f2[r] * f2[r];
    let s1 = 0;
    for (let i = 0; i < n; i++) s1 += f1[i] * f1[i];
    if (Math.sqrt(c2) < tolerance * scale && Math.sqrt(s1) < 1e-7) {
      converged = true;
      break;
    }
    // K = DᵀD + ridge + diag(d2·g): tridiagonal
    let damping = 0;
    let ok = false;
    for (let attempt = 0; attempt < 6 && !ok; attempt++) {
      for (let i = 0; i < n; i++) diag[i] = (i > 0 ? 1 : 0) + (i < n - 1 ? 1 : 0) + RIDGE + d2[i] * g[i] + damping;
      ok = factor();
      damping = damping ? damping * 10 : 1e-6;
    }
    if (!ok) break;
    // u = K⁻¹ f1; V_r = K⁻¹ (d1 ∘ row_r); S = J V; dλ = S⁻¹ (f2 − J u); dz = −u − V dλ
    solveFactored(f1, u);
    for (let r = 0; r < 3; r++) {
      const j = jr[r];
      const row = rows[r];
      for (let i = 0; i < n; i++) j[i] = d1[i] * row[i];
      solveFactored(j, v[r]);
    }
    for (let r = 0; r < 3; r++) {
      const j = jr[r];
      let ju = 0;
      let s0 = 0;
      let s1 = 0;
      let s2 = 0;
      for (let i = 0; i < n; i++) {
        const ji = j[i];
        ju += ji * u[i];
        s0 += ji * v[0][i];
        s1 += ji * v[1][i];
        s2 += ji * v[2][i];
      }
      rhs[r] = f2[r] - ju;
      S[r * 3] = s0;
      S[r * 3 + 1] = s1;
      S[r * 3 + 2] = s2;
    }
    if (!solve3(S, rhs, dl)) break;
    for (let i = 0; i < n; i++) dz[i] = -u[i] - (v[0][i] * dl[0] + v[1][i] * dl[1] + v[2][i] * dl[2]);
    // halving line search on ‖F‖²
    let t = 1;
    let accepted = false;
    for (let h = 0; h < 30; h++) {
      for (let i = 0; i < n; i++) zTry[i] = z[i] + t * dz[i];
      for (let r = 0; r < 3; r++) lTry[r] = lambda[r] + t * dl[r];
      const fTry = residualAt(rows, xyz, zTry, lTry);
      if (fTry < fNorm || h === 29) {
        z.set(zTry);
        lambda.set(lTry);
        accepted = fTry < fNorm;
        fNorm = fTry;
        break;
      }
      t /= 2;
    }
    if (!accepted) {
      residualAt(rows, xyz, z, lambda);
      break;
    }
  }
  let c2 = 0;
  for (let r = 0; r < 3; r++) c2 += f2[r] * f2[r];
  return { reflectance: Float64Array.from(rho), state: { z, lambda }, residual: Math.sqrt(c2), iterations: it, converged };
}

/** Solves the 3×3 system m·x = b (Cramer); false when singular. */
function solve3(m: Float64Array, b: Float64Array, x: Float64Array): boolean {
  const det = m[0] * (m[4] * m[8] - m[5] * m[7]) - m[1] * (m[3] * m[8] - m[5] * m[6]) + m[2] * (m[3] * m[7] - m[4] * m[6]);
  if (!Number.isFinite(det) || Math.abs(det) < 1e-300) return false;
  x[0] = (b[0] * (m[4] * m[8] - m[5] * m[7]) - m[1] * (b[1] * m[8] - m[5] * b[2]) + m[2] * (b[1] * m[7] - m[4] * b[2])) / det;
  x[1] = (m[0] * (b[1] * m[8] - m[5] * b[2]) - b[0] * (m[3] * m[8] - m[5] * m[6]) + m[2] * (m[3] * b[2] - b[1] * m[6])) / det;
  x[2] = (m[0] * (m[4] * b[2] - b[1] * m[7]) - m[1] * (m[3] * b[2] - b[1] * m[6]) + b[0] * (m[3] * m[7] - m[4] * m[6])) / det;
  return true;
}
