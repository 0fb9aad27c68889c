/**
 * The tone look-up table for photos: linear sRGB → medium exposure m for one stack.
 *
 * Layout: Float32Array of size³ values, index ((ri·size) + gi)·size + bi, where node ri stands for
 * linear red ri / (size − 1) (likewise g, b), each 0..1. The value is the medium exposure m of the
 * estimated reflectance of that colour (linear, relative to white; 0.18 = middle grey; opened up by
 * the filter factor, so a neutral reads the same with or without filters). Apply with trilinear
 * interpolation over linear sRGB (`sampleToneLut`).
 *
 * Method: pixels have no spectrum, so each colour's reflectance is the trilinear blend of the
 * upsampling table's eight corner spectra (Jakob & Hanika 2019 nodes, see upsample-table.ts). That
 * blend reproduces the colour exactly (the node colours are bilinear in the cell) and m is linear in
 * the reflectance, so m is computed once per table node (a dot product with E·T·S) and interpolated.
 */
import type { Stack } from './compute';
import { GRID_SIZE } from './policy';
import { makeSpectrum, type Spectrum } from './spectrum';
import { sigmoidInto, T_GRID } from './upsample';
import { interpolateAtCell, locateCell, type TableCell, type UpsampleTable } from './upsample-table';

/** Default nodes per axis of the tone LUT. */
export const DEFAULT_LUT_SIZE = 33;

/** m (medium exposure, relative to white) at every node of the upsampling table for `stack`. */
export function nodeExposures(stack: Stack, table: UpsampleTable): Float64Array {
  const w = stack.mediumWeights;
  const cf = table.coefficients;
  const n = cf.length / 3;
  const out = new Float64Array(n);
  const t = T_GRID;
  const t2 = new Float64Array(GRID_SIZE);
  for (let i = 0; i < GRID_SIZE; i++) t2[i] = t[i] * t[i];
  for (let k = 0; k < n; k++) {
    const c0 = cf[3 * k];
    const c1 = cf[3 * k + 1];
    const c2 = cf[3 * k + 2];
    let m = 0;
    for (let i = 0; i < GRID_SIZE; i++) {
      const x = c0 * t2[i] + c1 * t[i] + c2;
      m += w[i] * (0.5 + (0.5 * x) / Math.sqrt(1 + x * x));
    }
    out[k] = m;
  }
  return out;
}

/**
 * Builds the tone LUT of `stack`: size³ medium exposures over linear sRGB (layout above).
 * Units: m, linear, 0.18 = middle grey. Source: the stack's E·T·S and the upsampling table.
 */
export function buildToneLut(stack: Stack, table: UpsampleTable, size: number = DEFAULT_LUT_SIZE): Float32Array {
  if (!Number.isInteger(size) || size < 2) throw new Error('buildToneLut: size must be an integer ≥ 2');
  const nodeM = nodeExposures(stack, table);
  const lut = new Float32Array(size * size * size);
  const cell: TableCell = { node: 0, fx: 0, fy: 0, fz: 0 };
  const d = size - 1;
  let k = 0;
  for (let ri = 0; ri < size; ri++) {
    for (let gi = 0; gi < size; gi++) {
      for (let bi = 0; bi < size; bi++) {
        locateCell(table, ri / d, gi / d, bi / d, cell);
        lut[k++] = interpolateAtCell(table, nodeM, 1, 0, cell);
      }
    }
  }
  return lut;
}

/** Trilinear lookup of a tone LUT at linear sRGB (r, g, b), each 0..1 (clamped) → m. */
export function sampleToneLut(lut: Float32Array, size: number, r: number, g: number, b: number): number {
  const d = size - 1;
  const f = (v: number) => (v < 0 ? 0 : v > 1 ? d : v * d);
  const x = f(r);
  const y = f(g);
  const z = f(b);
  const x0 = Math.min(Math.floor(x), d - 1);
  const y0 = Math.min(Math.floor(y), d - 1);
  const z0 = Math.min(Math.floor(z), d - 1);
  const fx = x - x0;
  const fy = y - y0;
  const fz = z - z0;
  const at = (i: number, j: number, k: number) => lut[(i * size + j) * size + k];
  const c00 = at(x0, y0, z0) * (1 - fz) + at(x0, y0, z0 + 1) * fz;
  const c01 = at(x0, y0 + 1, z0) * (1 - fz) + at(x0, y0 + 1, z0 + 1) * fz;
  const c10 = at(x0 + 1, y0, z0) * (1 - fz) + at(x0 + 1, y0, z0 + 1) * fz;
  const c11 = at(x0 + 1, y0 + 1, z0) * (1 - fz) + at(x0 + 1, y0 + 1, z0 + 1) * fz;
  return (c00 * (1 - fy) + c01 * fy) * (1 - fx) + (c10 * (1 - fy) + c11 * fy) * fx;
}

/**
 * The reflectance the tone LUT implies for linear sRGB `rgb` (0..1): the trilinear blend of the eight
 * corner spectra of its table cell. It reproduces the colour under D65 (for tests and inspection).
 */
export function blendedReflectance(table: UpsampleTable, rgb: readonly [number, number, number]): Spectrum {
  const cell = locateCell(table, rgb[0], rgb[1], rgb[2]);
  const R = table.resolution;
  const out = new Float64Array(GRID_SIZE);
  const corner = new Float64Array(GRID_SIZE);
  const cf = table.coefficients;
  for (let dz = 0; dz < 2; dz++) {
    for (let dy = 0; dy < 2; dy++) {
      for (let dx = 0; dx < 2; dx++) {
        const w = (dx ? cell.fx : 1 - cell.fx) * (dy ? cell.fy : 1 - cell.fy) * (dz ? cell.fz : 1 - cell.fz);
        if (w === 0) continue;
        const node = cell.node + dx + dy * R + dz * R * R;
        sigmoidInto(cf[3 * node], cf[3 * node + 1], cf[3 * node + 2], corner);
        for (let i = 0; i < GRID_SIZE; i++) out[i] += w * corner[i];
      }
    }
  }
  return makeSpectrum(out);
}
