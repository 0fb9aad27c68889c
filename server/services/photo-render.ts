/**
 * Full-resolution photo renders through a look: sharp decodes (orientation applied, an embedded ICC
 * profile converted to sRGB, transparency flattened on white) to a raw Uint8 or Uint16 buffer; one
 * pass applies the look's table; sharp encodes the grey as a 16-bit PNG or a JPEG.
 * The table depends on the look only, so it is prepared while sharp decodes (on sharp's own threads):
 * for 8-bit photos a table of every colour filled lazily during the pass by the engine's own per-pixel
 * computation (only the colours the photo holds are computed: shared/photo/exact-lut.ts), a pixel then
 * costing one read once its colour was met; for 16-bit photos the 65³ table's trilinear plan
 * (shared/photo/apply-lut.ts). On large images a worker thread takes the bottom half of the pass
 * (photo-pass-pool.ts). Small 8-bit photos (under SMALL_IMAGE_PIXELS) skip the 2²⁴ table: the same
 * per-colour computation, its results kept in a sparse table of the colours met (exact-lut.ts
 * applyExactSparse), since allocating and touching 32–64 MB costs more than their whole pass; and
 * their look's exposures are computed only at the upsampling table's nodes their colours touch
 * (shared/spectral/node-spectra.ts LazyNodeExposures), not at all 98,304.
 */
import sharp, { type JpegOptions, type PngOptions } from 'sharp';
import { applyLut16, planLut16, type LutPlan16, type OutputBits } from '../../shared/photo/apply-lut';
import { applyExactLut, applyExactSparse, exactColours, filledColours, sparseColours, type ExactColours, type ExactLut, type SparseColours } from '../../shared/photo/exact-lut';
import { buildPhotoLut, type PhotoToneModel } from '../../shared/photo/look-photo-model';
import { RENDER_LUT_SIZE } from '../../shared/photo/exposure-lut';
import type { RenderFormat } from '../../shared/schemas/photo';
import { MAX_PHOTO_PIXELS } from '../../shared/schemas/photo';
import { srgbReader } from './srgb-reader';
import { PARALLEL_MIN_PIXELS, passPool } from './photo-pass-pool';

/** JPEG settings of renders (the benchmark's greyscale baseline uses the same). */
export const RENDER_JPEG: JpegOptions = { quality: 90 };
/** PNG settings of renders (zlib level 6, sharp's default, written explicitly). */
export const RENDER_PNG: PngOptions = { compressionLevel: 6 };
/** Pixels per chunk of the pass; the event loop runs between chunks. */
export const RENDER_CHUNK_PIXELS = 1 << 21;

/**
 * 8-bit photos with fewer pixels than this render through a sparse table of their colours instead of
 * the full 2²⁴ one (unless the look's full table was already allocated by an earlier, larger render): on
 * a small photo, allocating and touching the full table costs more than the pass. Equal to the
 * two-thread threshold, so a sparse pass never needs sharing with the worker.
 */
export const SMALL_IMAGE_PIXELS = PARALLEL_MIN_PIXELS;

/**
 * A look's table as the renderer applies it. For 8-bit input, `lut` (the lazy exact table) is allocated
 * by the first render large enough to need it and then kept with the table (and with its colours); until
 * then small renders keep the colours they met in `sparse` (so a look rendered before finds them again;
 * it never outgrows the full table).
 */
export type RenderTable = { kind: 'exact8'; colours: ExactColours; bits: OutputBits; lut: ExactLut | null; sparse: SparseColours | null } | { kind: 'plan16'; plan: LutPlan16 };
type Exact8Table = Extract<RenderTable, { kind: 'exact8' }>;

/**
 * Builds the render table of a look for an input and output depth: for 8-bit input the per-colour
 * computation, its lazy exact table allocated later, when a large image needs it (32 MB at 8-bit output,
 * 64 MB at 16-bit, in shared memory; a cached table keeps the colours earlier renders filled in); for
 * 16-bit input the 65³ table and its plan.
 */
export async function buildRenderTable(model: PhotoToneModel, inputBits: 8 | 16, outputBits: OutputBits): Promise<RenderTable> {
  if (inputBits === 8) return { kind: 'exact8', colours: exactColours(model, outputBits), bits: outputBits, lut: null, sparse: null };
  return { kind: 'plan16', plan: planLut16(buildPhotoLut(model, RENDER_LUT_SIZE), model.tone, outputBits) };
}

/**
 * The lazy exact table of an 8-bit render table, allocated (zeroed, pages touched) on first need, with
 * every node's exposure filled in first (small renders compute only the nodes their colours touch; the
 * worker thread gets the filled exposures and computes none).
 */
function lazyTable(table: Exact8Table): ExactLut {
  table.lut ??= { codes: passPool.allocLazy(table.bits), ...filledColours(table.colours) };
  table.sparse = null; // small renders use the full table from now on
  return table.lut;
}

export interface RenderProgress {
  stage: 'decoding' | 'table' | 'rendering' | 'encoding';
  /** 0..1 over the whole render */
  progress: number;
}

export interface RenderRequest {
  /** the original file (path) or its bytes */
  input: string | Buffer;
  /** the original's bits per channel: 16-bit originals are decoded and rendered in 16 bits */
  bitDepth: 8 | 16;
  /** whether the original carries an ICC profile */
  hasProfile: boolean;
  format: RenderFormat;
  /** the look's table for this input and output depth (buildRenderTable, or a cached one); asked for while the image decodes */
  table: (inputBits: 8 | 16, outputBits: OutputBits) => Promise<RenderTable> | RenderTable;
  maxPixels?: number;
  onProgress?: (p: RenderProgress) => void;
}

export interface RenderResult {
  data: Buffer;
  width: number;
  height: number;
  /** image/png or image/jpeg */
  mime: string;
  /** ms by step; decode and table overlap */
  ms: { decode: number; table: number; pass: number; encode: number; total: number };
}

const yieldToLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Decodes to interleaved sRGB (3 channels), 8 or 16 bits (see srgbReader for the profile). */
export function decodeSrgb(input: string | Buffer, bits: 8 | 16, hasProfile: boolean, maxPixels = MAX_PHOTO_PIXELS) {
  const s = srgbReader(input, { bits, hasProfile, maxPixels });
  return bits === 16
    ? s.toColourspace('rgb16').raw({ depth: 'ushort' }).toBuffer({ resolveWithObject: true })
    : s.toColourspace('srgb').raw().toBuffer({ resolveWithObject: true });
}

/** Encodes one channel of grey codes (Uint8 for JPEG, Uint16 for 16-bit PNG). */
export function encodeGrey(grey: Uint8Array | Uint16Array, width: number, height: number, format: RenderFormat): Promise<Buffer> {
  const raw = { width, height, channels: 1 as const };
  return format === 'jpeg'
    ? sharp(grey, { raw }).toColourspace('b-w').jpeg(RENDER_JPEG).toBuffer()
    : sharp(grey, { raw }).toColourspace('grey16').png(RENDER_PNG).toBuffer();
}

/** A buffer of `n` grey codes, shared with the worker when the image is large enough for two threads, its pages touched. */
function greyBuffer(n: number, bits: OutputBits): Uint8Array | Uint16Array {
  const grey = n >= PARALLEL_MIN_PIXELS ? passPool.alloc(n, bits) : bits === 8 ? new Uint8Array(n) : new Uint16Array(n);
  for (let i = 0; i < n; i += 2048) grey[i] = 0;
  return grey;
}

/** The pass of a small 8-bit image: its colours kept in the look's sparse table (exact-lut.ts applyExactSparse). */
function sparseStep(table: Exact8Table, src: ArrayLike<number>, grey: Uint8Array | Uint16Array) {
  const sparse = (table.sparse ??= sparseColours(table.bits));
  return (from: number, to: number) => applyExactSparse(table.colours, sparse, src, 3, grey, from, to);
}

/** The grey codes of a photo through a look, before encoding. */
export interface GreyResult {
  grey: Uint8Array | Uint16Array;
  width: number;
  height: number;
  /** ms by step; decode and table overlap */
  ms: { decode: number; table: number; pass: number };
}

/** Decodes a photo and applies a look's table at full resolution: one grey code a pixel, `outBits` deep. */
export async function renderGrey(req: Omit<RenderRequest, 'format'>, outBits: OutputBits): Promise<GreyResult> {
  const t0 = performance.now();
  const report = req.onProgress ?? (() => {});
  report({ stage: 'decoding', progress: 0 });
  const decoding = decodeSrgb(req.input, req.bitDepth, req.hasProfile, req.maxPixels).then((d) => ({ ...d, at: performance.now() }));
  decoding.catch(() => {});
  // the output buffer, sized from the header and its pages touched while the image decodes
  const header = sharp(req.input).metadata().catch(() => null);
  const table = await req.table(req.bitDepth, outBits);
  const meta = await header;
  const early = meta?.width && meta.height ? greyBuffer(meta.width * meta.height, outBits) : null;
  // a large 8-bit photo's table is allocated and touched while the image decodes
  if (table.kind === 'exact8' && early && early.length >= SMALL_IMAGE_PIXELS) lazyTable(table);
  const tableMs = performance.now() - t0;
  report({ stage: 'decoding', progress: 0.25 });
  const { data, info, at: decodedAt } = await decoding;
  if (info.channels !== 3) throw new Error(`decoded to ${info.channels} channels, expected 3`);
  const tPass = performance.now();
  const n = info.width * info.height;
  const src: Uint8Array | Uint16Array =
    req.bitDepth === 16
      ? data.byteOffset % 2 === 0
        ? new Uint16Array(data.buffer, data.byteOffset, data.length / 2)
        : new Uint16Array(Uint8Array.from(data).buffer)
      : data;
  if ((req.bitDepth === 16) !== (table.kind === 'plan16')) throw new Error('the table does not fit the input depth');
  const grey = early && early.length === n ? early : greyBuffer(n, outBits);
  // 8-bit: the full table if the look has one already or the image is large, else the sparse one
  const lut = table.kind === 'exact8' && (table.lut || n >= SMALL_IMAGE_PIXELS) ? lazyTable(table) : null;
  const job = table.kind === 'plan16' ? { plan: table.plan } : lut ? { lut } : null;
  let step: (from: number, to: number) => void;
  if (table.kind === 'plan16') step = (from, to) => applyLut16(table.plan, src, 3, grey, from, to);
  else if (lut) step = (from, to) => applyExactLut(lut, src, 3, grey, from, to);
  else step = sparseStep(table, src, grey);
  const parallel = n >= PARALLEL_MIN_PIXELS && job !== null;
  const split = parallel ? Math.floor(n / 2) : n;
  const other = parallel ? passPool.pass(job, req.bitDepth, src, grey, split, n) : Promise.resolve(true);
  const pass = async (start: number, end: number, share: number) => {
    for (let from = start; from < end; from += RENDER_CHUNK_PIXELS) {
      const to = Math.min(end, from + RENDER_CHUNK_PIXELS);
      step(from, to);
      report({ stage: 'rendering', progress: 0.3 + 0.3 * share * ((to - start) / (end - start)) });
      if (to < end) await yieldToLoop();
    }
  };
  await pass(0, split, split / n);
  if (!(await other)) await pass(split, n, 1);
  return { grey, width: info.width, height: info.height, ms: { decode: decodedAt - t0, table: tableMs, pass: performance.now() - tPass } };
}

/** Renders a photo through a look's table at full resolution and encodes it. */
export async function renderPhoto(req: RenderRequest): Promise<RenderResult> {
  const t0 = performance.now();
  const { grey, width, height, ms } = await renderGrey(req, req.format === 'jpeg' ? 8 : 16);
  const tEncode = performance.now();
  req.onProgress?.({ stage: 'encoding', progress: 0.6 });
  const out = await encodeGrey(grey, width, height, req.format);
  const t1 = performance.now();
  return {
    data: out,
    width,
    height,
    mime: req.format === 'jpeg' ? 'image/jpeg' : 'image/png',
    ms: { ...ms, encode: t1 - tEncode, total: t1 - t0 },
  };
}
