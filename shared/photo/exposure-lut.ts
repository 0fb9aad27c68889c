/**
 * The photo look-up table, 3-D part: an sRGB colour → its tone in stops on the look's medium
 * (DESIGN.md §3, Photos). The 1-D part (tone-curve-table.ts) then maps stops to the output grey; the
 * two together are the look's table from a colour to its grey.
 *
 * Why stops and not the grey itself: the engine's exposure changes by orders of magnitude across the
 * cube, and the log of it interpolates far more evenly than the exposure or the toned grey (measured:
 * with 65³ nodes every pixel of the cube's interior lands within 0.5/255 of the exact computation,
 * where a table of greys misses by up to 0.6/255).
 *
 * Nodes: `size` per axis, node i at the sRGB-encoded value i / (size − 1), i.e. at the linear value
 * srgbDecode(i / (size − 1)) (IEC 61966-2-1): dense in the shadows, and a pixel's code value indexes
 * the table directly (the browser samples it as a 3-D texture).
 * Values: stops = log2(m / 0.18) of the medium exposure m (before key placement), floored at
 * FLOOR_STOPS (−20) so black stays finite.
 * Layout: index (b·size + g)·size + r, red fastest (the layout of a WebGL 3-D texture, x = red).
 */
import { FLOOR_STOPS } from '../spectral/limits';

/** The 3-D table (layout and units in the header). */
export interface ExposureLut {
  readonly size: number;
  /** stops from middle grey at each node, ≥ FLOOR_STOPS */
  readonly stops: Float32Array;
}

/** Nodes per axis in the browser's live preview (33³ = 35,937 nodes, DESIGN.md §3's minimum). */
export const PREVIEW_LUT_SIZE = 33;
/** Nodes per axis for full-resolution renders (65³; see the header for why). */
export const RENDER_LUT_SIZE = 65;

/** The sRGB-encoded value (0..1) of node i on an axis of `size` nodes. */
export function lutNodeEncoded(i: number, size: number): number {
  return i / (size - 1);
}

/**
 * Builds the table by evaluating every node: `stopsAt(rLin, gLin, bLin)` gets the node's linear sRGB
 * values (0..1) and answers its stops; `linear(v)` decodes an encoded value (pass IEC 61966-2-1's).
 */
export function buildExposureLut(
  size: number,
  linear: (encoded: number) => number,
  stopsAt: (rLin: number, gLin: number, bLin: number) => number,
): ExposureLut {
  if (!Number.isInteger(size) || size < 2 || size > 129) throw new Error('buildExposureLut: size must be an integer 2..129');
  const lin = Float64Array.from({ length: size }, (_, i) => linear(lutNodeEncoded(i, size)));
  const stops = new Float32Array(size * size * size);
  let k = 0;
  for (let b = 0; b < size; b++) {
    for (let g = 0; g < size; g++) {
      for (let r = 0; r < size; r++, k++) {
        const s = stopsAt(lin[r], lin[g], lin[b]);
        stops[k] = s > FLOOR_STOPS ? s : FLOOR_STOPS;
      }
    }
  }
  return { size, stops };
}

/** Trilinear lookup at sRGB-encoded (r, g, b), each 0..1 (clamped) → stops. */
export function sampleExposureLut(lut: ExposureLut, r: number, g: number, b: number): number {
  const { size, stops: v } = lut;
  const d = size - 1;
  const pos = (x: number) => (x <= 0 ? 0 : x >= 1 ? d : x * d);
  const x = pos(r);
  const y = pos(g);
  const z = pos(b);
  const x0 = x >= d ? d - 1 : Math.floor(x);
  const y0 = y >= d ? d - 1 : Math.floor(y);
  const z0 = z >= d ? d - 1 : Math.floor(z);
  const fx = x - x0;
  const fy = y - y0;
  const fz = z - z0;
  const sy = size;
  const sz = size * size;
  const p = z0 * sz + y0 * sy + x0;
  const c00 = v[p] + fx * (v[p + 1] - v[p]);
  const c10 = v[p + sy] + fx * (v[p + sy + 1] - v[p + sy]);
  const c01 = v[p + sz] + fx * (v[p + sz + 1] - v[p + sz]);
  const c11 = v[p + sz + sy] + fx * (v[p + sz + sy + 1] - v[p + sz + sy]);
  const c0 = c00 + fy * (c10 - c00);
  const c1 = c01 + fy * (c11 - c01);
  return c0 + fz * (c1 - c0);
}
