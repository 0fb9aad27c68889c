/**
 * The look's answer for every 8-bit colour: 2²⁴ output codes, index r << 16 | g << 8 | b (16 MB at 8-bit
 * output, 32 MB at 16-bit). Each entry is exactly what `applyLut8` (apply-lut.ts) gives that colour —
 * trilinear interpolation of the 3-D table, then the tone curve — so a whole photo then costs one
 * table read per pixel, and the table is filled before the photo is even decoded (it depends on the
 * look only). Rows of red fill independently, so two threads can share the work.
 * Both functions refer to nothing outside their arguments: the server also runs them in a worker.
 */
import type { ExposureLut } from './exposure-lut';
import { MAX_Q, MIN_STOPS, outputCodes, STOPS_Q, type GreyBuffer, type OutputBits } from './apply-lut';
import type { ToneCurveTable } from './tone-curve-table';

/** What filling a range of red rows needs (typed arrays may live in shared memory). */
export interface FullLutFill {
  /** the 2²⁴ codes being filled */
  codes: Uint8Array | Uint16Array;
  /** the 3-D table's stops (exposure-lut.ts layout) and its nodes per axis */
  stops: Float32Array;
  size: number;
  /** fixed-point stops → output code (apply-lut.ts outputCodes) */
  out: Uint8Array | Uint16Array;
  minStops: number;
  q: number;
  maxQ: number;
  /** red codes [rFrom, rTo) */
  rFrom: number;
  rTo: number;
}

/** The fill job of a whole table for a look (codes allocated by the caller, e.g. in shared memory). */
export function fullLutFill(codes: Uint8Array | Uint16Array, lut: ExposureLut, tone: ToneCurveTable, bits: OutputBits, rFrom = 0, rTo = 256): FullLutFill {
  return { codes, stops: lut.stops, size: lut.size, out: outputCodes(tone, bits), minStops: MIN_STOPS, q: STOPS_Q, maxQ: MAX_Q, rFrom, rTo };
}

/**
 * Fills red rows [rFrom, rTo): for each (r, g) the bilinear red–green step at every blue node, then
 * every blue code by one interpolation along blue (fixed point as applyLut8: weights in 1/256).
 */
export function fillFullLut(f: FullLutFill): void {
  const { codes, stops: v, size, out, minStops, q: Q, maxQ } = f;
  const d = size - 1;
  const index = new Int32Array(256);
  const frac = new Float64Array(256);
  const bw = new Int32Array(256);
  // blue codes [first[k], first[k + 1]) lie in node interval k
  const first = new Int32Array(size);
  for (let c = 255; c >= 0; c--) {
    const p = (c * d) / 255;
    const i = Math.min(Math.floor(p), d - 1);
    index[c] = i;
    frac[c] = p - i;
    bw[c] = Math.round((p - i) * 256);
    first[i] = c;
  }
  first[d] = 256;
  const sy = size;
  const sz = size * size;
  const row = new Int32Array(size);
  for (let r = f.rFrom; r < f.rTo; r++) {
    const ri = index[r];
    const rf = frac[r];
    for (let g = 0; g < 256; g++) {
      const gi = index[g];
      const gf = frac[g];
      for (let b = 0, p = gi * sy + ri; b < size; b++, p += sz) {
        const c0 = v[p] + rf * (v[p + 1] - v[p]);
        const c1 = v[p + sy] + rf * (v[p + sy + 1] - v[p + sy]);
        const qv = ((c0 + gf * (c1 - c0) - minStops) * Q + 0.5) | 0;
        row[b] = qv < 0 ? 0 : qv > maxQ ? maxQ : qv;
      }
      const base = (r << 16) | (g << 8);
      for (let k = 0; k < d; k++) {
        const p0 = row[k];
        const dp = row[k + 1] - p0;
        for (let b = first[k], end = first[k + 1]; b < end; b++) codes[base | b] = out[p0 + ((dp * bw[b] + 128) >> 8)];
      }
    }
  }
}

/** Renders pixels [from, to) of 8-bit interleaved RGB(A) `src` into `dst` with a full table: one read a pixel. */
export function applyFullLut(codes: Uint8Array | Uint16Array, src: ArrayLike<number>, channels: number, dst: GreyBuffer, from: number, to: number): void {
  for (let j = from, i = from * channels; j < to; j++, i += channels) dst[j] = codes[(src[i] << 16) | (src[i + 1] << 8) | src[i + 2]];
}
