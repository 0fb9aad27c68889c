/**
 * Applies a look's photo table (exposure-lut.ts, then tone-curve-table.ts) to raw pixels: one pass
 * over a Uint8 or Uint16 buffer, trilinear interpolation, allocation-free, in pixel ranges so a caller
 * can work in chunks and report progress.
 *
 * 8-bit input: trilinear interpolation is separable, so the red–green part is done once per plan for
 * all 256 × 256 code pairs at every blue node (a "partial" table, 65,536 × size entries); a pixel then
 * costs one interpolation along blue — the same trilinear result, at a fraction of the work.
 * 16-bit input: full trilinear per pixel, with the axis positions of all 65,536 codes precomputed.
 * (For whole photos at 8 bits the server computes each colour exactly instead: exact-lut.ts.)
 * Stops are carried in fixed point (1/STOPS_Q stop) and mapped to the output code by one table.
 * Output: grey codes, 0..255 (8-bit) or 0..65535 (16-bit), one channel.
 */
import type { ExposureLut } from './exposure-lut';
import { MAX_Q, MIN_STOPS, STOPS_Q, outputCodes, type OutputBits, type ToneCurveTable } from '../look/tone-curve-table';

export { STOPS_Q, type OutputBits } from '../look/tone-curve-table';

/** Grey codes out, one per pixel. */
export type GreyBuffer = Uint8Array | Uint8ClampedArray | Uint16Array;

/** A plan for 8-bit pixels (see the header). */
export interface LutPlan8 {
  readonly size: number;
  readonly bits: OutputBits;
  /** fixed-point stops at [(r << 8 | g) · size + blue node] */
  readonly partial: Uint16Array;
  /** per blue code: its lower node | (weight 0..256) << 8 */
  readonly blue: Int32Array;
  /** fixed-point stops → output code */
  readonly out: Uint8Array | Uint16Array;
}

/** Node index and fraction of each 8-bit code on an axis of `size` nodes. */
function axis8(size: number): { index: Int32Array; frac: Float64Array } {
  const index = new Int32Array(256);
  const frac = new Float64Array(256);
  const d = size - 1;
  for (let c = 0; c < 256; c++) {
    const p = (c * d) / 255;
    const i = Math.min(Math.floor(p), d - 1);
    index[c] = i;
    frac[c] = p - i;
  }
  return { index, frac };
}

/** Prepares a table for 8-bit sRGB pixels, with `bits` of output. Cost: 65,536 × size bilinear steps. */
export function planLut8(lut: ExposureLut, tone: ToneCurveTable, bits: OutputBits): LutPlan8 {
  const { size, stops: v } = lut;
  const { index, frac } = axis8(size);
  const sy = size;
  const sz = size * size;
  const partial = new Uint16Array(65536 * size);
  for (let r = 0; r < 256; r++) {
    const ri = index[r];
    const rf = frac[r];
    for (let g = 0; g < 256; g++) {
      const gi = index[g];
      const gf = frac[g];
      let o = ((r << 8) | g) * size;
      let p = gi * sy + ri;
      for (let b = 0; b < size; b++, o++, p += sz) {
        const c0 = v[p] + rf * (v[p + 1] - v[p]);
        const c1 = v[p + sy] + rf * (v[p + sy + 1] - v[p + sy]);
        const q = ((c0 + gf * (c1 - c0) - MIN_STOPS) * STOPS_Q + 0.5) | 0;
        partial[o] = q < 0 ? 0 : q > MAX_Q ? MAX_Q : q;
      }
    }
  }
  const blue = new Int32Array(256);
  for (let c = 0; c < 256; c++) blue[c] = index[c] | (Math.round(frac[c] * 256) << 8);
  return { size, bits, partial, blue, out: outputCodes(tone, bits) };
}

/**
 * Renders pixels [from, to) of 8-bit interleaved RGB(A) `src` (`channels` 3 or 4; alpha ignored) into
 * `dst` (one grey code per pixel, at the same pixel index). Refers to nothing outside its arguments.
 */
export function applyLut8(plan: LutPlan8, src: ArrayLike<number>, channels: number, dst: GreyBuffer, from: number, to: number): void {
  const { partial, blue, out, size } = plan;
  let j = from;
  let i = from * channels;
  // two pixels a step: their loads overlap (about a tenth faster, measured)
  for (; j + 1 < to; j += 2, i += 2 * channels) {
    const i2 = i + channels;
    const w = blue[src[i + 2]];
    const w2 = blue[src[i2 + 2]];
    const o = ((src[i] << 8) | src[i + 1]) * size + (w & 255);
    const o2 = ((src[i2] << 8) | src[i2 + 1]) * size + (w2 & 255);
    const p0 = partial[o];
    const q0 = partial[o2];
    dst[j] = out[p0 + (((partial[o + 1] - p0) * (w >> 8) + 128) >> 8)];
    dst[j + 1] = out[q0 + (((partial[o2 + 1] - q0) * (w2 >> 8) + 128) >> 8)];
  }
  for (; j < to; j++, i += channels) {
    const w = blue[src[i + 2]];
    const o = ((src[i] << 8) | src[i + 1]) * size + (w & 255);
    const p0 = partial[o];
    dst[j] = out[p0 + (((partial[o + 1] - p0) * (w >> 8) + 128) >> 8)];
  }
}

/** A plan for 16-bit pixels (see the header). */
export interface LutPlan16 {
  readonly size: number;
  readonly bits: OutputBits;
  readonly stops: Float32Array;
  /** lower node of each 16-bit code */
  readonly index: Int32Array;
  /** fraction towards the next node of each 16-bit code */
  readonly frac: Float32Array;
  readonly out: Uint8Array | Uint16Array;
  /** the fixed point, carried so applyLut16 refers to nothing outside its arguments (it also runs in a worker) */
  readonly minStops: number;
  readonly q: number;
  readonly maxQ: number;
}

/** Prepares a table for 16-bit sRGB pixels, with `bits` of output. */
export function planLut16(lut: ExposureLut, tone: ToneCurveTable, bits: OutputBits): LutPlan16 {
  const d = lut.size - 1;
  const index = new Int32Array(65536);
  const frac = new Float32Array(65536);
  for (let c = 0; c < 65536; c++) {
    const p = (c * d) / 65535;
    const i = Math.min(Math.floor(p), d - 1);
    index[c] = i;
    frac[c] = p - i;
  }
  return { size: lut.size, bits, stops: lut.stops, index, frac, out: outputCodes(tone, bits), minStops: MIN_STOPS, q: STOPS_Q, maxQ: MAX_Q };
}

/** Renders pixels [from, to) of 16-bit interleaved RGB(A) `src` into `dst` (one grey code per pixel); self-contained too. */
export function applyLut16(plan: LutPlan16, src: ArrayLike<number>, channels: number, dst: GreyBuffer, from: number, to: number): void {
  const { stops: v, index, frac, out, size, minStops, q: Q, maxQ } = plan;
  const sy = size;
  const sz = size * size;
  for (let j = from, i = from * channels; j < to; j++, i += channels) {
    const r = src[i];
    const g = src[i + 1];
    const b = src[i + 2];
    const fx = frac[r];
    const fy = frac[g];
    const fz = frac[b];
    const p = index[b] * sz + index[g] * sy + index[r];
    const c00 = v[p] + fx * (v[p + 1] - v[p]);
    const c10 = v[p + sy] + fx * (v[p + sy + 1] - v[p + sy]);
    const c01 = v[p + sz] + fx * (v[p + sz + 1] - v[p + sz]);
    const c11 = v[p + sz + sy] + fx * (v[p + sz + sy + 1] - v[p + sz + sy]);
    const c0 = c00 + fy * (c10 - c00);
    const c1 = c01 + fy * (c11 - c01);
    const q = ((c0 + fz * (c1 - c0) - minStops) * Q + 0.5) | 0;
    dst[j] = out[q < 0 ? 0 : q > maxQ ? maxQ : q];
  }
}
