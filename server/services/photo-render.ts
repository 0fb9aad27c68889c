/**
 * Full-resolution photo renders through a look: sharp decodes (orientation applied, an embedded ICC
 * profile converted to sRGB, transparency flattened on white) to a raw Uint8 or Uint16 buffer; one
 * pass applies the look's table; sharp encodes the grey as a 16-bit PNG or a JPEG.
 * The table depends on the look only, so it is prepared while sharp decodes (on sharp's own threads):
 * for 8-bit photos a table of every colour filled lazily during the pass by the engine's own per-pixel
 * computation (only the colours the photo holds are computed: shared/photo/exact-lut.ts), a pixel then
 * costing one read once its colour was met; for 16-bit photos the 65³ table's trilinear plan
 * (shared/photo/apply-lut.ts). On large images a worker thread takes the bottom half of the pass
 * (photo-pass-pool.ts).
 */
import sharp, { type JpegOptions, type PngOptions } from 'sharp';
import { applyLut16, planLut16, type LutPlan16, type OutputBits } from '../../shared/photo/apply-lut';
import { applyExactLut, exactLut, type ExactLut } from '../../shared/photo/exact-lut';
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

/** A look's table as the renderer applies it. */
export type RenderTable = { kind: 'exact8'; lut: ExactLut } | { kind: 'plan16'; plan: LutPlan16 };

/**
 * Builds the render table of a look for an input and output depth: for 8-bit input an empty lazy exact
 * table (32 MB at 8-bit output, 64 MB at 16-bit, in shared memory; a cached table keeps the colours
 * earlier renders filled in); for 16-bit input the 65³ table and its plan.
 */
export async function buildRenderTable(model: PhotoToneModel, inputBits: 8 | 16, outputBits: OutputBits): Promise<RenderTable> {
  if (inputBits === 8) return { kind: 'exact8', lut: exactLut(passPool.allocLazy(outputBits), model, outputBits) };
  return { kind: 'plan16', plan: planLut16(buildPhotoLut(model, RENDER_LUT_SIZE), model.tone, outputBits) };
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
  const parallel = n >= PARALLEL_MIN_PIXELS;
  const grey = early && early.length === n ? early : greyBuffer(n, outBits);
  const split = parallel ? Math.floor(n / 2) : n;
  const other = parallel ? passPool.pass(table.kind === 'exact8' ? { lut: table.lut } : { plan: table.plan }, req.bitDepth, src, grey, split, n) : Promise.resolve(true);
  const pass = async (start: number, end: number, share: number) => {
    for (let from = start; from < end; from += RENDER_CHUNK_PIXELS) {
      const to = Math.min(end, from + RENDER_CHUNK_PIXELS);
      if (table.kind === 'exact8') applyExactLut(table.lut, src, 3, grey, from, to);
      else applyLut16(table.plan, src, 3, grey, from, to);
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
