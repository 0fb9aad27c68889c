/**
 * Full-resolution photo renders through a look: sharp decodes (orientation applied, an embedded ICC
 * profile converted to sRGB, transparency flattened on white) to a raw Uint8 or Uint16 buffer; one
 * pass applies the look's table; sharp encodes the grey as a 16-bit PNG or a JPEG.
 * The table depends on the look only, so it is prepared while sharp decodes (on sharp's own threads):
 * for 8-bit photos a table of every colour filled lazily during the pass by the engine's own per-pixel
 * computation (only the colours the photo holds are computed: shared/photo/exact-lut.ts), a pixel then
 * costing one read once its colour was met; for 16-bit photos the 65³ table's trilinear plan
 * (shared/photo/apply-lut.ts). Decoding, the pass and encoding run in two worker threads, never on the
 * main thread, so the API keeps answering (photo-pass-pool.ts: the lead worker decodes, renders the top
 * half of a large image or all of a small one, each grey code over its own pixel, and encodes; the other
 * renders the bottom half, and both fill the look's node exposures while the photo decodes); only when no
 * worker can run does the main thread render (renderGreyHere). Small 8-bit photos (under SMALL_IMAGE_PIXELS) skip the 2²⁴ table: the same
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
import { PARALLEL_MIN_PIXELS, passPool, RenderWorkerError, sharedNodes, toShared, type DecodedInWorker } from './photo-pass-pool';

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
export type RenderTable =
  | {
      kind: 'exact8';
      colours: ExactColours;
      bits: OutputBits;
      lut: ExactLut | null;
      sparse: SparseColours | null;
      /** the full table being made (allocated and its nodes filled by the workers) */
      making?: Promise<ExactLut>;
      /** the sparse table's passes, one after another (each may hand out blocks) */
      sparseQueue?: Promise<unknown>;
    }
  | { kind: 'plan16'; plan: LutPlan16 };
type Exact8Table = Extract<RenderTable, { kind: 'exact8' }>;

/**
 * Builds the render table of a look for an input and output depth: for 8-bit input the per-colour
 * computation, its lazy exact table allocated later, when a large image needs it (32 MB at 8-bit output,
 * 64 MB at 16-bit, in shared memory; a cached table keeps the colours earlier renders filled in); for
 * 16-bit input the 65³ table and its plan.
 */
export async function buildRenderTable(model: PhotoToneModel, inputBits: 8 | 16, outputBits: OutputBits): Promise<RenderTable> {
  if (inputBits === 8) return { kind: 'exact8', colours: sharedColours(exactColours(model, outputBits)), bits: outputBits, lut: null, sparse: null };
  return { kind: 'plan16', plan: planLut16(buildPhotoLut(model, RENDER_LUT_SIZE), model.tone, outputBits) };
}

/**
 * The per-colour computation with its tables in shared memory (the lazily computed node exposures
 * included), so the render workers compute into the look's own nodes and post no copies.
 */
function sharedColours(c: ExactColours): ExactColours {
  if (!passPool.available) return c;
  const nodes = c.nodes ? sharedNodes(c.nodes) : null;
  return { ...c, lin: toShared(c.lin), zNodes: toShared(c.zNodes), out: c.out ? toShared(c.out) : null, nodes, nodeM: nodes ? nodes.values : toShared(c.nodeM) };
}

/**
 * The full exact table of an 8-bit render table, made on first need: every node's exposure filled by the
 * workers while the photo decodes (here only if they cannot), the table allocated empty.
 */
function fullTable(table: Exact8Table): Promise<ExactLut> {
  if (table.lut) return Promise.resolve(table.lut);
  table.making ??= (async () => {
    const nodes = table.colours.nodes;
    if (nodes && !nodes.complete) await passPool.fillNodes(nodes);
    table.lut ??= { codes: passPool.allocLazy(table.bits), ...filledColours(table.colours) };
    table.sparse = null; // small renders use the full table from now on
    return table.lut;
  })();
  table.making.catch(() => (table.making = undefined));
  return table.making;
}

/**
 * The lazy exact table of an 8-bit render table for a render on this thread (no workers), allocated
 * (zeroed, pages touched) on first need, with every node's exposure filled in first (small renders
 * compute only the nodes their colours touch).
 */
function lazyTable(table: Exact8Table): ExactLut {
  table.lut ??= { codes: zeroedTable(table.bits), ...filledColours(table.colours) };
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

/** A zeroed lazy table of 2²⁴ entries for this thread (no workers), its pages touched (writing 0 keeps it empty). */
function zeroedTable(bits: OutputBits): Uint16Array | Uint32Array {
  const codes = bits === 8 ? new Uint16Array(1 << 24) : new Uint32Array(1 << 24);
  for (let i = 0; i < codes.length; i += 1024) codes[i] = 0;
  return codes;
}

/** A buffer of `n` grey codes, its pages touched. */
function greyBuffer(n: number, bits: OutputBits): Uint8Array | Uint16Array {
  const grey = bits === 8 ? new Uint8Array(n) : new Uint16Array(n);
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

/**
 * Decodes a photo and applies a look's table at full resolution: one grey code a pixel, `outBits` deep;
 * in the render workers (renderInWorkers), or here when no worker can run.
 */
export async function renderGrey(req: Omit<RenderRequest, 'format'>, outBits: OutputBits): Promise<GreyResult> {
  if (passPool.available) {
    try {
      const r = await renderInWorkers(req, outBits, null);
      return { grey: r.grey!, width: r.width, height: r.height, ms: r.ms };
    } catch (e) {
      if (passPool.available && !(e instanceof RenderWorkerError)) throw e; // the photo's own fault (unreadable, too large)
    }
  }
  return renderGreyHere(req, outBits);
}

/** A sparse table of colours in shared memory, for the lead worker to fill. */
function sharedSparse(bits: OutputBits): SparseColours {
  return sparseColours(bits, true);
}

/** A small photo's pass through the look's sparse table, after any other pass through it (each may hand out blocks). */
function sparsePassInWorker(table: Exact8Table, d: DecodedInWorker, outBits: OutputBits, n: number): Promise<boolean> {
  const run = (table.sparseQueue ?? Promise.resolve()).then(async () => {
    const sparse = (table.sparse ??= sharedSparse(table.bits));
    const r = await passPool.pass({ colours: table.colours, sparse }, d, 8, outBits, 0, n, false);
    if (r.ok && r.sparse && !table.lut) table.sparse = r.sparse; // it may have grown
    return r.ok;
  });
  table.sparseQueue = run.catch(() => false);
  return run;
}

/**
 * A small photo's whole render (pass through the look's sparse table, then encoding) in the lead worker
 * (photo-pass-pool.ts renderSmall), after any other pass through the same sparse table (each may hand out
 * blocks), posted before the photo's decoding is answered.
 */
function sparseRenderInWorker(table: Exact8Table, photo: number, outBits: OutputBits, format: RenderFormat | null): ReturnType<typeof passPool.renderSmall> {
  const run = (table.sparseQueue ?? Promise.resolve()).then(async () => {
    const sparse = (table.sparse ??= sharedSparse(table.bits));
    const r = await passPool.renderSmall({ colours: table.colours, sparse }, photo, outBits, format ? { format, jpeg: RENDER_JPEG, png: RENDER_PNG } : null);
    if (r.ok && r.sparse && !table.lut) table.sparse = r.sparse; // it may have grown
    return r;
  });
  table.sparseQueue = run.catch(() => false);
  return run;
}

/** The pass of a decoded photo in the workers: a large one split between both. */
async function passInWorkers(req: Omit<RenderRequest, 'format'>, table: RenderTable, making: Promise<ExactLut> | null, d: DecodedInWorker, outBits: OutputBits): Promise<boolean> {
  const n = d.width * d.height;
  if (table.kind === 'exact8' && !table.lut && !making && n < SMALL_IMAGE_PIXELS) return sparsePassInWorker(table, d, outBits, n);
  const job = table.kind === 'plan16' ? { plan: table.plan } : { lut: await (making ?? fullTable(table)) };
  const split = d.bottom ? d.bottom.from : n;
  const [top, bottom] = await Promise.all([
    passPool.pass(job, d, req.bitDepth, outBits, 0, split, false),
    split < n ? passPool.pass(job, d, req.bitDepth, outBits, split, n, true) : { ok: true },
  ]);
  if (!top.ok) return false;
  if (split === n) return true;
  // the other worker's codes beside the lead's, or the lead renders the bottom half itself
  if (bottom.ok) await passPool.assemble(d, outBits, split, n);
  else if (!(await passPool.pass(job, d, req.bitDepth, outBits, split, n, false)).ok) return false;
  return true;
}

/**
 * A render in the workers: the lead decodes while the look's table is readied (by the workers, for a
 * large 8-bit photo); the pass; then the lead encodes (`format`) or hands over the grey codes (null).
 */
async function renderInWorkers(req: Omit<RenderRequest, 'format'>, outBits: OutputBits, format: RenderFormat | null) {
  const t0 = performance.now();
  const report = req.onProgress ?? (() => {});
  report({ stage: 'decoding', progress: 0 });
  const started = passPool.startDecode(req.input, req.bitDepth, req.hasProfile, req.maxPixels);
  const decoding = started.decoded.then((d) => ({ d, at: performance.now() }));
  decoding.catch(() => {});
  const header = sharp(req.input).metadata().catch(() => null);
  let finished = false;
  try {
    const table = await req.table(req.bitDepth, outBits);
    if ((req.bitDepth === 16) !== (table.kind === 'plan16')) throw new Error('the table does not fit the input depth');
    const meta = await header;
    // a large 8-bit photo's full table is made by the workers while the image decodes
    const large = !!meta?.width && !!meta.height && meta.width * meta.height >= SMALL_IMAGE_PIXELS;
    const making = table.kind === 'exact8' && (table.lut || large) ? fullTable(table) : null;
    making?.catch(() => {});
    const tableMs = performance.now() - t0;
    if (table.kind === 'exact8' && !making && !table.making && meta?.width && meta.height) {
      // a small photo: its pass and encoding posted now, in one job the lead starts once the photo is decoded
      report({ stage: 'rendering', progress: 0.3 });
      const small = await sparseRenderInWorker(table, started.photo, outBits, format);
      const decoded = await decoding; // the photo's own fault (unreadable, too large) throws here
      if (!small.ok) throw new RenderWorkerError('the render workers failed');
      finished = true;
      report({ stage: 'encoding', progress: 0.6 });
      const total = performance.now() - t0;
      return { data: small.data, grey: small.grey, width: decoded.d.width, height: decoded.d.height, ms: { decode: decoded.at - t0, table: tableMs, pass: small.passMs, encode: small.encodeMs, total } };
    }
    const decoded = await decoding;
    const d = decoded.d;
    report({ stage: 'rendering', progress: 0.3 });
    const tPass = performance.now();
    if (!(await passInWorkers(req, table, making, d, outBits))) throw new RenderWorkerError('the render workers failed');
    const passMs = performance.now() - tPass;
    report({ stage: 'encoding', progress: 0.6 });
    const tEncode = performance.now();
    const done = await passPool.finish(d, outBits, format ? { format, jpeg: RENDER_JPEG, png: RENDER_PNG } : null);
    finished = true;
    const t1 = performance.now();
    return { ...done, width: decoded.d.width, height: decoded.d.height, ms: { decode: decoded.at - t0, table: tableMs, pass: passMs, encode: t1 - tEncode, total: t1 - t0 } };
  } finally {
    // the lead drops the pixels of a render that did not finish
    if (!finished) void decoding.then(({ d }) => passPool.release(d.photo), () => {});
  }
}

/** Renders whose pass ran on the main thread (none while the render workers run; for tests and diagnostics). */
export const mainThreadRenders = { count: 0 };

/** renderGrey on this thread, in chunks between which the event loop runs (only when no render worker can run). */
async function renderGreyHere(req: Omit<RenderRequest, 'format'>, outBits: OutputBits): Promise<GreyResult> {
  mainThreadRenders.count++;
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
  let step: (from: number, to: number) => void;
  if (table.kind === 'plan16') step = (from, to) => applyLut16(table.plan, src, 3, grey, from, to);
  else if (lut) step = (from, to) => applyExactLut(lut, src, 3, grey, from, to);
  else step = sparseStep(table, src, grey);
  for (let from = 0; from < n; from += RENDER_CHUNK_PIXELS) {
    const to = Math.min(n, from + RENDER_CHUNK_PIXELS);
    step(from, to);
    report({ stage: 'rendering', progress: 0.3 + 0.3 * (to / n) });
    if (to < n) await yieldToLoop();
  }
  return { grey, width: info.width, height: info.height, ms: { decode: decodedAt - t0, table: tableMs, pass: performance.now() - tPass } };
}

/** Renders a photo through a look's table at full resolution and encodes it (in the render workers, or here when none can run). */
export async function renderPhoto(req: RenderRequest): Promise<RenderResult> {
  const mime = req.format === 'jpeg' ? 'image/jpeg' : 'image/png';
  if (passPool.available) {
    try {
      const r = await renderInWorkers(req, req.format === 'jpeg' ? 8 : 16, req.format);
      return { data: r.data!, width: r.width, height: r.height, mime, ms: r.ms };
    } catch (e) {
      if (passPool.available && !(e instanceof RenderWorkerError)) throw e; // the photo's own fault (unreadable, too large)
    }
  }
  const t0 = performance.now();
  const { grey, width, height, ms } = await renderGreyHere(req, req.format === 'jpeg' ? 8 : 16);
  const tEncode = performance.now();
  req.onProgress?.({ stage: 'encoding', progress: 0.6 });
  const out = await encodeGrey(grey, width, height, req.format);
  const t1 = performance.now();
  return {
    data: out,
    width,
    height,
    mime,
    ms: { ...ms, encode: t1 - tEncode, total: t1 - t0 },
  };
}
