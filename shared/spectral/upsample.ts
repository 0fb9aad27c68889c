/**
 * Spectra for colour values: a smooth reflectance in (0, 1) that reproduces an sRGB colour under D65.
 *
 * Method: W. Jakob and J. Hanika, "A Low-Dimensional Function Space for Efficient Spectral
 * Upsampling", Computer Graphics Forum 38(2), 2019. The reflectance is a sigmoid of a quadratic,
 *   ρ(λ) = ½ + x / (2√(1 + x²)),  x = c0·t² + c1·t + c2,  t = (λ − 380 nm) / 400 nm,
 * whose three coefficients are fitted per colour by Gauss–Newton on the CIELAB residual, tabulated once
 * over linear sRGB (upsample-table.ts) and looked up by trilinear interpolation; single colours get a
 * few more Newton steps so they reproduce exactly. Illuminant CIE D65 (table), observer CIE 1931 2°;
 * the target XYZ of a colour comes from culori (IEC 61966-2-1), so the round trip closes through it.
 */
import { GRID_NM } from './grid';
import { cieIlluminant } from './lights';
import { GRID_SIZE } from './policy';
import { makeSpectrum } from './spectrum';
import { tristimulusWeights } from './integrate';
import type { Spectrum, Xyz } from './types';
import { SRGB_WHITE } from './colour';

/** Three sigmoid-polynomial coefficients (c0 on t², c1 on t, c2 constant). */
export type Coefficients = [number, number, number];

/** t = (λ − 380) / 400 at each grid wavelength, and t². */
export const T_GRID: Float64Array = GRID_NM.map((nm) => (nm - 380) / 400);
const T2_GRID: Float64Array = T_GRID.map((t) => t * t);

/** The model's reflectance at one value of the polynomial x (0..1, exclusive). */
export function sigmoid(x: number): number {
  return 0.5 + x / (2 * Math.sqrt(1 + x * x));
}

/** The reflectance (0..1) of coefficients `c` on the grid. */
export function sigmoidReflectance(c: readonly number[]): Spectrum {
  const v = new Float64Array(GRID_SIZE);
  for (let i = 0; i < GRID_SIZE; i++) v[i] = sigmoid(c[0] * T2_GRID[i] + c[1] * T_GRID[i] + c[2]);
  return makeSpectrum(v);
}

/** Fills `out` (length 81) with the reflectance of (c0, c1, c2); allocation-free, for the LUT loop. */
export function sigmoidInto(c0: number, c1: number, c2: number, out: Float64Array): void {
  for (let i = 0; i < GRID_SIZE; i++) {
    const x = c0 * T2_GRID[i] + c1 * T_GRID[i] + c2;
    out[i] = 0.5 + x / (2 * Math.sqrt(1 + x * x));
  }
}

// D65 tristimulus weights (integrate.ts), XYZ 0..100 for ρ = 1.
const { x: WX, y: WY, z: WZ } = tristimulusWeights(cieIlluminant('D65'));

/** XYZ (0..100) under D65 of the model reflectance with coefficients `c`. */
export function xyzOfCoefficients(c: readonly number[]): Xyz {
  let x = 0;
  let y = 0;
  let z = 0;
  for (let i = 0; i < GRID_SIZE; i++) {
    const r = sigmoid(c[0] * T2_GRID[i] + c[1] * T_GRID[i] + c[2]);
    x += r * WX[i];
    y += r * WY[i];
    z += r * WZ[i];
  }
  return [x, y, z];
}

// CIELAB pieces for the fit's residual (hot loop; the same formula culori's lab65 carries).
const LAB_E = 216 / 24389;
const LAB_K = 24389 / 27;
const labF = (t: number) => (t > LAB_E ? Math.cbrt(t) : (LAB_K * t + 16) / 116);
const labDf = (t: number) => (t > LAB_E ? 1 / (3 * Math.cbrt(t) ** 2) : LAB_K / 116);
const XN = SRGB_WHITE[0];
const YN = SRGB_WHITE[1];
const ZN = SRGB_WHITE[2];

const scratch = new Float64Array(12);

/** Model XYZ and its Jacobian d(X,Y,Z)/d(c0,c1,c2) into `scratch` ([X,Y,Z, dX/dc0.., dY/dc0.., dZ/dc0..]). */
function evaluate(c0: number, c1: number, c2: number): void {
  scratch.fill(0);
  for (let i = 0; i < GRID_SIZE; i++) {
    const t = T_GRID[i];
    const t2 = T2_GRID[i];
    const x = c0 * t2 + c1 * t + c2;
    const s = 1 / Math.sqrt(1 + x * x);
    const r = 0.5 + 0.5 * x * s;
    const d = 0.5 * s * s * s;
    const wx = WX[i];
    const wy = WY[i];
    const wz = WZ[i];
    scratch[0] += r * wx;
    scratch[1] += r * wy;
    scratch[2] += r * wz;
    const dx = d * wx;
    const dy = d * wy;
    const dz = d * wz;
    scratch[3] += dx * t2;
    scratch[4] += dx * t;
    scratch[5] += dx;
    scratch[6] += dy * t2;
    scratch[7] += dy * t;
    scratch[8] += dy;
    scratch[9] += dz * t2;
    scratch[10] += dz * t;
    scratch[11] += dz;
  }
}

/** Lab of XYZ against the sRGB white, and dLab/dXYZ (diagonal f' terms), for the residual. */
function labOf(x: number, y: number, z: number, out: Float64Array): void {
  const fx = labF(x / XN);
  const fy = labF(y / YN);
  const fz = labF(z / ZN);
  out[0] = 116 * fy - 16;
  out[1] = 500 * (fx - fy);
  out[2] = 200 * (fy - fz);
  out[3] = labDf(x / XN) / XN;
  out[4] = labDf(y / YN) / YN;
  out[5] = labDf(z / ZN) / ZN;
}

const labNow = new Float64Array(6);
const labTarget = new Float64Array(6);

/** Options of the per-colour fit. */
export interface FitOptions {
  /** at most this many Gauss–Newton steps (default 30) */
  maxIterations?: number;
  /** stop when the CIELAB residual is below this (ΔE*ab, default 1e-6) */
  tolerance?: number;
}

/**
 * Fits coefficients so the model reproduces `targetXyz` (XYZ 0..100 under D65) by Gauss–Newton on the
 * CIELAB residual with step halving, starting from `start` (default flat 0.5). Returns the
 * coefficients and the final residual (ΔE*ab). Colours on the edge of the reflectance gamut (pure
 * black, pure white) are approached as closely as `maxIterations` allows.
 */
export function fitCoefficients(targetXyz: Xyz, start: readonly number[] = [0, 0, 0], options: FitOptions = {}): { coefficients: Coefficients; residual: number } {
  const maxIterations = options.maxIterations ?? 30;
  const tolerance = options.tolerance ?? 1e-6;
  labOf(targetXyz[0], targetXyz[1], targetXyz[2], labTarget);
  let c0 = start[0];
  let c1 = start[1];
  let c2 = start[2];
  const residualAt = (a: number, b: number, c: number): number => {
    evaluate(a, b, c);
    labOf(scratch[0], scratch[1], scratch[2], labNow);
    return Math.hypot(labNow[0] - labTarget[0], labNow[1] - labTarget[1], labNow[2] - labTarget[2]);
  };
  let r = residualAt(c0, c1, c2);
  for (let it = 0; it < maxIterations && r > tolerance; it++) {
    // J = dLab/dXYZ · dXYZ/dc ; L = 116 fy − 16, a = 500 (fx − fy), b = 200 (fy − fz)
    const gx = labNow[3];
    const gy = labNow[4];
    const gz = labNow[5];
    const j = new Float64Array(9);
    for (let k = 0; k < 3; k++) {
      const dfx = gx * scratch[3 + k];
      const dfy = gy * scratch[6 + k];
      const dfz = gz * scratch[9 + k];
      j[k] = 116 * dfy;
      j[3 + k] = 500 * (dfx - dfy);
      j[6 + k] = 200 * (dfy - dfz);
    }
    const res0 = labNow[0] - labTarget[0];
    const res1 = labNow[1] - labTarget[1];
    const res2 = labNow[2] - labTarget[2];
    const step = solve3(j, -res0, -res1, -res2);
    if (!step) break;
    let lambda = 1;
    let accepted = false;
    for (let h = 0; h < 12; h++) {
      const n0 = c0 + lambda * step[0];
      const n1 = c1 + lambda * step[1];
      const n2 = c2 + lambda * step[2];
      const rn = residualAt(n0, n1, n2);
      if (rn < r) {
        c0 = n0;
        c1 = n1;
        c2 = n2;
        r = rn;
        accepted = true;
        break;
      }
      lambda /= 2;
    }
    if (!accepted) {
      residualAt(c0, c1, c2);
      break;
    }
  }
  return { coefficients: [c0, c1, c2], residual: r };
}

/** Solves the 3×3 system m·x = (a, b, c) by Cramer's rule; null when singular. */
function solve3(m: Float64Array, a: number, b: number, c: number): [number, number, number] | null {
  const det =
    m[0] * (m[4] * m[8] - m[5] * m[7]) - m[1] * (m[3] * m[8] - m[5] * m[6]) + m[2] * (m[3] * m[7] - m[4] * m[6]);
  if (!Number.isFinite(det) || Math.abs(det) < 1e-300) return null;
  const x0 = a * (m[4] * m[8] - m[5] * m[7]) - m[1] * (b * m[8] - m[5] * c) + m[2] * (b * m[7] - m[4] * c);
  const x1 = m[0] * (b * m[8] - m[5] * c) - a * (m[3] * m[8] - m[5] * m[6]) + m[2] * (m[3] * c - b * m[6]);
  const x2 = m[0] * (m[4] * c - b * m[7]) - m[1] * (m[3] * c - b * m[6]) + a * (m[3] * m[7] - m[4] * m[6]);
  return [x0 / det, x1 / det, x2 / det];
}
