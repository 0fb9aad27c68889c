/**
 * Full-resolution photo renders through a look: sharp decodes (orientation applied, an embedded ICC
 * profile converted to sRGB, transparency flattened on white) to a raw Uint8 or Uint16 buffer; one
 * pass applies the look's table (shared/photo/apply-lut.ts) in chunks; sharp encodes the grey as a
 * 16-bit PNG or a JPEG. The table is prepared while sharp decodes (sharp works on its own threads),
 * so its cost hides behind the decode.
 */
import sharp, { type JpegOptions, type PngOptions } from 'sharp';
import { applyLut16, applyLut8, type LutPlan16, type LutPlan8, type OutputBits } from '../../shared/photo/apply-lut';
import type { RenderFormat } from '../../shared/schemas/photo';
import { MAX_PHOTO_PIXELS } from '../../shared/schemas/photo';
import { srgbReader } from '../modules/photos/photo-ingest';

/** JPEG settings of renders (the benchmark's greyscale baseline uses the same). */
export const RENDER_JPEG: JpegOptions = { quality: 90 };
/** PNG settings of renders (zlib level 6, sharp's default, written explicitly). */
export const RENDER_PNG: PngOptions = { compressionLevel: 6 };
/** Pixels per chunk of the table pass (about 5 ms each); the event loop runs between chunks. */
export const RENDER_CHUNK_PIXELS = 1 << 20;

export interface RenderProgress {
  stage: 'decoding' | 'rendering' | 'encoding';
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
  /** prepares the look's table for this input and output depth; called while the image decodes */
  plan: (inputBits: 8 | 16, outputBits: OutputBits) => LutPlan8 | LutPlan16;
  maxPixels?: number;
  onProgress?: (p: RenderProgress) => void;
}

export interface RenderResult {
  data: Buffer;
  width: number;
  height: number;
  /** image/png or image/jpeg */
  mime: string;
  /** time spent, ms, by step */
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

/** Renders a photo through a look's table at full resolution. */
export async function renderPhoto(req: RenderRequest): Promise<RenderResult> {
  const t0 = performance.now();
  const report = req.onProgress ?? (() => {});
  const outBits: OutputBits = req.format === 'jpeg' ? 8 : 16;
  report({ stage: 'decoding', progress: 0 });
  const decoding = decodeSrgb(req.input, req.bitDepth, req.hasProfile, req.maxPixels);
  // prepared on this thread while libvips decodes on its own
  const tt = performance.now();
  let plan: LutPlan8 | LutPlan16;
  try {
    plan = req.plan(req.bitDepth, outBits);
  } catch (e) {
    decoding.catch(() => {});
    throw e;
  }
  const tableMs = performance.now() - tt;
  const { data, info } = await decoding;
  const tDecoded = performance.now();
  if (info.channels !== 3) throw new Error(`decoded to ${info.channels} channels, expected 3`);
  const n = info.width * info.height;
  const src: Uint8Array | Uint16Array =
    req.bitDepth === 16
      ? data.byteOffset % 2 === 0
        ? new Uint16Array(data.buffer, data.byteOffset, data.length / 2)
        : new Uint16Array(Uint8Array.from(data).buffer)
      : data;
  const grey = outBits === 8 ? new Uint8Array(n) : new Uint16Array(n);
  for (let from = 0; from < n; from += RENDER_CHUNK_PIXELS) {
    const to = Math.min(n, from + RENDER_CHUNK_PIXELS);
    if (req.bitDepth === 16) applyLut16(plan as LutPlan16, src, 3, grey, from, to);
    else applyLut8(plan as LutPlan8, src, 3, grey, from, to);
    report({ stage: 'rendering', progress: 0.3 + 0.3 * (to / n) });
    if (to < n) await yieldToLoop();
  }
  const tPass = performance.now();
  report({ stage: 'encoding', progress: 0.6 });
  const out = await encodeGrey(grey, info.width, info.height, req.format);
  const t1 = performance.now();
  return {
    data: out,
    width: info.width,
    height: info.height,
    mime: req.format === 'jpeg' ? 'image/jpeg' : 'image/png',
    ms: { decode: tDecoded - t0, table: tableMs, pass: tPass - tDecoded, encode: t1 - tPass, total: t1 - t0 },
  };
}
