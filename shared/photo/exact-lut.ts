/**
 * The table of every 8-bit colour for whole-photo renders, filled lazily and exactly: 2²⁴ entries, index
 * r << 16 | g << 8 | b, each computed the first time a pixel of that colour is met, by the engine's
 * per-pixel computation itself (look-photo-model.ts `pixelStops`: the colour's cell in the upsampling
 * table, the trilinear blend of the node exposures, log2 from middle grey, floored), then the tone
 * curve through the look's output codes (shared/look/tone-curve-table.ts `codeOfStops`: 1/STOPS_Q stop,
 * < 0.02/255 of grey), the same rounding a swatch's grey goes through.
 * So no 3-D table of nodes stands between a pixel and the engine (no interpolation error anywhere
 * in the cube, black and saturated edges included), and only the colours the photo holds are
 * computed (the 24-megapixel benchmark still life holds about 40,000 of 16.8 million).
 * Entries carry a flag bit above the code (bit 8 for 8-bit output, bit 16 for 16-bit); 0 = not yet.
 * Two threads may fill it at once (shared memory): both write the same value, so a race is harmless.
 * `applyExactLut` refers to nothing outside its arguments but `exactCode` (the server also runs both in
 * a worker, from their source text), so the cell location of shared/spectral/upsample-table.ts
 * `locateCell` and `interpolateAtCell` is written out in `exactCode`; tests/unit/photo/exact-lut.test.ts
 * checks it against those functions.
 * Small images skip the table: `applyExactSparse` keeps the colours met in a sparse table of 4³-colour
 * blocks (the same `exactCode` for each), since allocating and touching 32–64 MB costs more than their
 * whole pass; and `exactCode` computes the look's exposure at the nodes of each colour's cell as it meets
 * them (`ExactColours.nodes`), where computing all 98,304 first would cost more than sharp's whole
 * greyscale of such a photo. The full table fills every node first (`filledColours`), so the worker
 * computes none.
 */
import { FLOOR_STOPS, MIDDLE_GREY } from '../spectral/limits';
import { srgbDecode } from '../tone/print';
import { MAX_Q, MIN_STOPS, STOPS_Q, outputCodes, type OutputBits, type ToneCurveTable } from '../look/tone-curve-table';
import type { GreyBuffer } from './apply-lut';
import type { PhotoToneModel } from './look-photo-model';
import { fillNodeExposures, type LazyNodeExposures } from '../spectral/node-spectra';

/** What the lazy exact table needs (typed arrays may live in shared memory). */
export interface ExactLut {
  /** flag | code per colour (Uint16 for 8-bit output, Uint32 for 16-bit), zeroed at first */
  codes: Uint16Array | Uint32Array;
  /** the flag bit (256 or 65536) */
  flag: number;
  /** linear sRGB value of each 8-bit code (IEC 61966-2-1) */
  lin: Float64Array;
  /** the upsampling table's resolution R and z nodes, and the look's exposure m at each of its nodes */
  resolution: number;
  zNodes: Float32Array;
  nodeM: Float64Array;
  /**
   * while not null and not complete, `nodeM[k]` is valid only where `done[k]` is set, and `exactCode`
   * computes the nodes of a colour's cell as it meets them (small images: only the nodes their colours
   * touch); null for the full table (every node filled first, nothing more for a worker to compute)
   */
  nodes: LazyNodeExposures | null;
  /**
   * fixed-point stops → output code (the look's codes, tone-curve-table.ts outputCodes); null while only a
   * few colours are computed (small images: a few thousand of the 32,769 codes are needed, and making them
   * all costs about as much as the look's whole tone table), each colour's code then computed from `tone`
   * with outputCodes's own operations (the same code)
   */
  out: Uint8Array | Uint16Array | null;
  /** the look's tone curve (outputCodes's input) */
  tone: ToneCurveTable;
  /** the largest output code (255 or 65535) */
  top: number;
  minStops: number;
  q: number;
  maxQ: number;
  floorStops: number;
  middleGrey: number;
}

/** What the computation of one colour needs (a lazy table without its 2²⁴ entries). */
export type ExactColours = Omit<ExactLut, 'codes'>;

/** A lazy exact table for a look and output depth (`codes`: 2²⁴ zeroed entries from the caller, e.g. in shared memory). */
export function exactLut(codes: Uint16Array | Uint32Array, model: PhotoToneModel, bits: OutputBits): ExactLut {
  if (codes.length !== 1 << 24) throw new Error('exactLut: codes must hold 2^24 entries');
  return { codes, ...filledColours(exactColours(model, bits)) };
}

/**
 * The same computation with every node's exposure filled in (the nodes met so far kept: they are the
 * same bits), for the full table: its colours may be computed in a worker, which gets `nodeM` only.
 */
export function filledColours(c: ExactColours): ExactColours {
  if (c.nodes) fillNodeExposures(c.nodes);
  return { ...c, nodes: null, out: c.out ?? outputCodes(c.tone, c.top === 255 ? 8 : 16) };
}

/** The per-colour computation of a look and output depth, without a table (small images: applyExactSparse). */
export function exactColours(model: PhotoToneModel, bits: OutputBits): ExactColours {
  const lin = new Float64Array(256);
  for (let c = 0; c < 256; c++) lin[c] = srgbDecode(c / 255);
  return {
    flag: bits === 8 ? 256 : 65536,
    lin,
    resolution: model.upsample.resolution,
    zNodes: model.upsample.zNodes,
    // the model's lazily computed exposures when it has them (photoToneModel's do), else all of them
    nodeM: model.nodes ? model.nodes.values : model.nodeM,
    nodes: model.nodes ?? null,
    // made when a full table needs them (filledColours); a small render computes the few it needs
    out: null,
    tone: model.tone,
    top: bits === 8 ? 255 : 65535,
    minStops: MIN_STOPS,
    q: STOPS_Q,
    maxQ: MAX_Q,
    floorStops: FLOOR_STOPS,
    middleGrey: MIDDLE_GREY,
  };
}

/**
 * The flagged code (flag | output code) of one colour, key r << 16 | g << 8 | b, computed as
 * look-photo-model.ts pixelStops does: shared by the full table (applyExactLut) and the sparse one
 * (applyExactSparse), so both give the same code for a colour. Refers to nothing outside its arguments.
 */
export function exactCode(t: ExactColours, key: number): number {
  const { lin, resolution: R, zNodes: zn, nodeM: vals } = t;
  const r = lin[key >> 16];
  const g = lin[(key >> 8) & 255];
  const b = lin[key & 255];
  let l: number;
  let z: number;
  let u: number;
  let v: number;
  if (r >= g && r >= b) {
    l = 0;
    z = r;
    u = g;
    v = b;
  } else if (g >= b) {
    l = 1;
    z = g;
    u = b;
    v = r;
  } else {
    l = 2;
    z = b;
    u = r;
    v = g;
  }
  const x = z > 0 ? u / z : 0;
  const y = z > 0 ? v / z : 0;
  let lo = 0;
  let hi = R - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (zn[mid] <= z) lo = mid;
    else hi = mid;
  }
  const zi = Math.min(lo, R - 2);
  const xs = x * (R - 1);
  const ys = y * (R - 1);
  const xi = Math.min(Math.floor(xs), R - 2);
  const yi = Math.min(Math.floor(ys), R - 2);
  const fx = xs - xi;
  const fy = ys - yi;
  const fz = Math.min(1, Math.max(0, (z - zn[zi]) / (zn[zi + 1] - zn[zi])));
  const p = ((l * R + zi) * R + yi) * R + xi;
  const sy = R;
  const sz = R * R;
  const lazy = t.nodes;
  if (lazy && !lazy.complete) {
    // the cell's corner nodes not computed yet, each as node-spectra.ts lazyNodeExposure computes it (the
    // same sum in the same order); a z plane's corners four at once when two or more of them are missing
    // (those already done computed again: the same bits), their four chains of additions overlapping as
    // in node-spectra.ts nodeExposures (two nodes in four chains cost less than two in one chain each).
    // Two render workers may fill the same nodes (shared memory): both write the same bits, and a node's
    // flag is stored (Atomics) after its value and read before it, so a flag seen set means its value is there.
    // `seen` is this thread's own copy of the flags it has read set or set itself (never shared), so a node
    // costs one shared-memory read per thread, not one per colour that touches it (Atomics.load is not cheap).
    const { done, seen, reflectances: refl, weights: w, size: S } = lazy;
    for (let dz = 0; dz < 2; dz++) {
      const q = p + dz * sz;
      if (seen[q] & seen[q + 1] & seen[q + sy] & seen[q + sy + 1]) continue;
      let missing = 0;
      for (let c = 0; c < 4; c++) {
        const k = q + (c & 1) + (c & 2 ? sy : 0);
        if (seen[k]) continue;
        if (Atomics.load(done, k)) seen[k] = 1;
        else missing++;
      }
      if (missing > 1) {
        const o0 = q * S;
        const o1 = o0 + S;
        const o2 = (q + sy) * S;
        const o3 = o2 + S;
        let m0 = 0;
        let m1 = 0;
        let m2 = 0;
        let m3 = 0;
        for (let i = 0; i < S; i++) {
          const wi = w[i];
          m0 += wi * refl[o0 + i];
          m1 += wi * refl[o1 + i];
          m2 += wi * refl[o2 + i];
          m3 += wi * refl[o3 + i];
        }
        vals[q] = m0;
        vals[q + 1] = m1;
        vals[q + sy] = m2;
        vals[q + sy + 1] = m3;
        Atomics.store(done, q, 1);
        Atomics.store(done, q + 1, 1);
        Atomics.store(done, q + sy, 1);
        Atomics.store(done, q + sy + 1, 1);
        seen[q] = 1;
        seen[q + 1] = 1;
        seen[q + sy] = 1;
        seen[q + sy + 1] = 1;
        continue;
      }
      if (missing === 0) continue;
      for (let c = 0; c < 4; c++) {
        const k = q + (c & 1) + (c & 2 ? sy : 0);
        if (seen[k]) continue;
        const o = k * S;
        let m = 0;
        for (let i = 0; i < S; i++) m += w[i] * refl[o + i];
        vals[k] = m;
        Atomics.store(done, k, 1);
        seen[k] = 1;
      }
    }
  }
  const c00 = vals[p] * (1 - fx) + vals[p + 1] * fx;
  const c01 = vals[p + sy] * (1 - fx) + vals[p + sy + 1] * fx;
  const c10 = vals[p + sz] * (1 - fx) + vals[p + sz + 1] * fx;
  const c11 = vals[p + sz + sy] * (1 - fx) + vals[p + sz + sy + 1] * fx;
  const m = (c00 * (1 - fy) + c01 * fy) * (1 - fz) + (c10 * (1 - fy) + c11 * fy) * fz;
  const stops = m > 0 ? Math.max(t.floorStops, Math.log2(m / t.middleGrey)) : t.floorStops;
  const qv = ((stops - t.minStops) * t.q + 0.5) | 0;
  const qc = qv < 0 ? 0 : qv > t.maxQ ? t.maxQ : qv;
  if (t.out) return t.flag | t.out[qc];
  // outputCodes's entry qc (tone-curve-table.ts: greyOfStops at MIN_STOPS + qc / STOPS_Q, rounded), the same operations
  const tone = t.tone;
  const tg = tone.grey;
  const last = tg.length - 1;
  const xt = (t.minStops + qc / t.q - tone.minStops) / tone.step;
  let grey: number;
  if (!(xt > 0)) grey = tg[0];
  else if (xt >= last) grey = tg[last];
  else {
    const i = Math.floor(xt);
    grey = tg[i] + (xt - i) * (tg[i + 1] - tg[i]);
  }
  return t.flag | Math.round(grey * t.top);
}

/** Renders pixels [from, to) of 8-bit interleaved RGB(A) `src` (alpha ignored) into `dst`, one grey code a pixel, filling the table on the way. */
export function applyExactLut(t: ExactLut, src: ArrayLike<number>, channels: number, dst: GreyBuffer, from: number, to: number): void {
  const codes = t.codes;
  const mask = t.flag - 1;
  // one colour, computed by exactCode (kept out of the hot loop)
  const miss = (key: number): number => {
    const c = exactCode(t, key);
    codes[key] = c;
    return c;
  };
  let j = from;
  // 3-channel bytes on a 4-byte boundary, little-endian: four pixels from three 32-bit reads (measured
  // about a third faster than reading the bytes one by one)
  const bytes = src instanceof Uint8Array ? src : null;
  if (bytes && channels === 3 && (bytes.byteOffset + from * 3) % 4 === 0 && new Uint8Array(new Uint32Array([1]).buffer)[0] === 1) {
    const w = new Uint32Array(bytes.buffer, bytes.byteOffset + from * 3, ((to - from) * 3) >> 2);
    for (let i = 0; j + 3 < to; j += 4, i += 3) {
      const a = w[i];
      const b = w[i + 1];
      const c = w[i + 2];
      const k0 = ((a & 0xff) << 16) | (a & 0xff00) | ((a >>> 16) & 0xff);
      const k1 = ((a >>> 8) & 0xff0000) | ((b & 0xff) << 8) | ((b >>> 8) & 0xff);
      const k2 = (b & 0xff0000) | ((b >>> 16) & 0xff00) | (c & 0xff);
      const k3 = ((c & 0xff00) << 8) | ((c >>> 8) & 0xff00) | (c >>> 24);
      let x = codes[k0];
      dst[j] = (x === 0 ? miss(k0) : x) & mask;
      x = codes[k1];
      dst[j + 1] = (x === 0 ? miss(k1) : x) & mask;
      x = codes[k2];
      dst[j + 2] = (x === 0 ? miss(k2) : x) & mask;
      x = codes[k3];
      dst[j + 3] = (x === 0 ? miss(k3) : x) & mask;
    }
  }
  for (let i = j * channels; j < to; j++, i += channels) {
    const key = (src[i] << 16) | (src[i + 1] << 8) | src[i + 2];
    const c = codes[key];
    dst[j] = (c === 0 ? miss(key) : c) & mask;
  }
}

/**
 * The colours met by small renders, in a two-level sparse table: the cube cut into 2¹⁸ blocks of
 * 4 × 4 × 4 colours, `index` giving each block's start in `codes` (0 = no colour of it met yet), blocks
 * handed out as their first colour is met, each entry flag | code as in the full table (0 = not yet).
 * A photo's colours cluster, so they fill few blocks (the 0.25-megapixel bench photo: 16,000 colours in
 * 4,600 blocks, 0.6 MB) where the 2²⁴ table is 32 or 64 MB to allocate and touch; neighbouring pixels
 * mostly share a block, so a pixel costs two reads about as cheap as the table's one (measured). It
 * never holds more than the full table would (2¹⁸ blocks × 64 = 2²⁴ entries).
 */
export interface SparseColours {
  /** per block (r >> 2, g >> 2, b >> 2): its first entry in `codes`, 0 = none yet */
  index: Int32Array;
  /** the blocks' entries (Uint16 for 8-bit output, Uint32 for 16-bit; the first block unused) */
  codes: Uint16Array | Uint32Array;
  /** entries handed out (the first block included) */
  used: number;
}

/** Entries a sparse table starts with (1,024 blocks); it doubles when full. */
const SPARSE_START_ENTRIES = 1 << 16;

/** An empty sparse table of colours for `bits` of output (in shared memory with `shared`: for the server's render workers). */
export function sparseColours(bits: OutputBits, shared = false): SparseColours {
  const buffer = (bytes: number) => (shared ? new SharedArrayBuffer(bytes) : new ArrayBuffer(bytes));
  const codes = bits === 8 ? new Uint16Array(buffer(2 * SPARSE_START_ENTRIES)) : new Uint32Array(buffer(4 * SPARSE_START_ENTRIES));
  return { index: new Int32Array(buffer(4 << 18)), codes, used: 64 };
}

/** A new block's first entry in `s.codes`, the entries doubled first if full (refers to nothing outside its argument: the server's workers run it from its source). */
export function newBlock(s: SparseColours): number {
  if (s.used + 64 > s.codes.length) {
    // in shared memory if the table is (the server's render workers fill it for the main thread to keep)
    const bytes = s.codes.byteLength * 2;
    const buf = typeof SharedArrayBuffer !== 'undefined' && s.codes.buffer instanceof SharedArrayBuffer ? new SharedArrayBuffer(bytes) : new ArrayBuffer(bytes);
    const more = s.codes instanceof Uint16Array ? new Uint16Array(buf) : new Uint32Array(buf);
    more.set(s.codes);
    s.codes = more;
  }
  const base = s.used;
  s.used += 64;
  return base;
}

/**
 * Renders pixels [from, to) as applyExactLut does (the same code for every colour: both call exactCode),
 * keeping the colours met in a sparse table (`s`) instead of the full 2²⁴ one: for small images, where
 * allocating and touching the full table costs more than the pass. Main thread only (small images are
 * not split between threads).
 */
export function applyExactSparse(t: ExactColours, s: SparseColours, src: ArrayLike<number>, channels: number, dst: GreyBuffer, from: number, to: number): void {
  const mask = t.flag - 1;
  const index = s.index;
  let codes = s.codes;
  for (let j = from, i = from * channels; j < to; j++, i += channels) {
    const r = src[i];
    const g = src[i + 1];
    const b = src[i + 2];
    const block = ((r >> 2) << 12) | ((g >> 2) << 6) | (b >> 2);
    let base = index[block];
    if (base === 0) {
      base = newBlock(s);
      codes = s.codes;
      index[block] = base;
    }
    const o = base + (((r & 3) << 4) | ((g & 3) << 2) | (b & 3));
    let c = codes[o];
    if (c === 0) c = codes[o] = exactCode(t, (r << 16) | (g << 8) | b);
    dst[j] = c & mask;
  }
}
