/**
 * The render workers: the whole pass of a full-resolution render runs in two worker threads, never on the
 * main thread, so the API keeps answering while a photo renders (before, the main thread did half of a
 * large pass and all of a small one: up to a second without answering).
 * - The lead worker decodes the photo with sharp (on sharp's own threads; the pixels stay in the worker),
 *   and renders the top half of a large image, or all of a small one;
 * - the other worker renders the bottom half, from a copy the lead makes in shared memory; while the lead
 *   decodes, both compute the look's exposure at every node of the upsampling table (half each) for the
 *   lazily filled 2²⁴ table.
 * Each grey code is written over its own pixel (the decoded input and the output are never held at once),
 * and the lead encodes them: the main thread gets the encoded file. A small photo's pass and encoding are
 * one job (`renderSmall`), posted as soon as the look's table is ready, which the lead starts once the
 * photo is decoded: on a render of a few milliseconds the round trips to the main thread counted.
 * The workers run the very same functions as the main thread (passed as their source text, so they need
 * no TypeScript loader: they refer to nothing outside their arguments and each other); tables reach them in
 * shared memory (SharedArrayBuffers are shared, not copied, when posted), small ones are copied.
 * A pass the other worker cannot do, the lead does; when the workers fail otherwise (RenderWorkerError, or
 * no worker can run) photo-render.ts renders on the main thread as before. A photo sharp cannot read throws
 * sharp's own error, as on the main thread.
 */
import { createRequire } from 'node:module';
import { Worker } from 'node:worker_threads';
import { applyLut16, type LutPlan16 } from '../../shared/photo/apply-lut';
import { applyExactLut, applyExactSparse, exactCode, newBlock, type ExactColours, type ExactLut, type SparseColours } from '../../shared/photo/exact-lut';
import { exposuresRange, type LazyNodeExposures } from '../../shared/spectral/node-spectra';
import { sharpInput } from './srgb-reader';

/**
 * Images smaller than this are rendered by the lead worker alone, pixels. (Sharing a 0.25-megapixel
 * render between both workers was measured slower: both meet the same new colours at once and compute
 * the same node exposures twice.)
 */
export const PARALLEL_MIN_PIXELS = 2_000_000;
/** Largest staging copy of the second worker's pixels, bytes (kept for reuse); larger images render in the lead worker alone. */
const KEEP_STAGING_BYTES = 160 * 1024 * 1024;

const WORKER_SOURCE = `
const { parentPort, workerData } = require('node:worker_threads');
// the TypeScript loader may wrap inner functions as __name(fn, "name"); the worker runs plain JS
const __name = (f) => f;
const exactCode = ${exactCode.toString()};
const applyExactLut = ${applyExactLut.toString()};
const newBlock = ${newBlock.toString()};
const applyExactSparse = ${applyExactSparse.toString()};
const applyLut16 = ${applyLut16.toString()};
const exposuresRange = ${exposuresRange.toString()};
let sharp = null;
const photos = new Map();
// decodes under way, by photo (a small render's pass waits for its photo here: renderSmall)
const decoding = new Map();
// a staging buffer no render holds, kept for the next large one (allocating and faulting in 36 MB costs)
let spare = null;
// decodes as server/services/srgb-reader.ts srgbReader and photo-render.ts decodeSrgb do (the same sharp calls)
async function decode(m) {
  sharp ??= require(workerData.sharpPath);
  let s = sharp(m.input, m.sharpOptions).rotate().flatten({ background: '#ffffff' });
  if (m.bits === 16 && m.hasProfile) s = s.withIccProfile('srgb', { attach: false });
  const { data, info } = await (m.bits === 16 ? s.toColourspace('rgb16').raw({ depth: 'ushort' }) : s.toColourspace('srgb').raw()).toBuffer({ resolveWithObject: true });
  if (info.channels !== 3) throw new Error('decoded to ' + info.channels + ' channels, expected 3');
  // an even offset, so 16-bit values (input or output) can be read and written in place
  const bytes = data.byteOffset % 2 === 0 ? data : Uint8Array.from(data);
  const src = m.bits === 16 ? new Uint16Array(bytes.buffer, bytes.byteOffset, bytes.length / 2) : bytes;
  const n = info.width * info.height;
  const p = { src, bytes, n, width: info.width, height: info.height, staging: null };
  photos.set(m.photo, p);
  let bottom = null;
  if (n >= m.splitMin) {
    const from = Math.floor(n / 2);
    const part = src.subarray(from * 3, n * 3);
    if (part.byteLength <= m.keepStaging) {
      const sab = spare && spare.byteLength >= part.byteLength ? spare : new SharedArrayBuffer(part.byteLength);
      if (sab === spare) spare = null;
      p.staging = sab;
      new Uint8Array(sab, 0, part.byteLength).set(new Uint8Array(part.buffer, part.byteOffset, part.byteLength));
      bottom = { sab, length: part.length, from };
    }
  }
  return { width: info.width, height: info.height, bottom };
}
// the grey codes of pixels [from, to) written over their own pixels, as the pass goes (pixel j's code
// lands before any byte of pixel j + 1: the decoded input and the output are never held at once)
function greyOver(buffer, byteOffset, outBits, length) {
  return outBits === 16 ? new Uint16Array(buffer, byteOffset, length) : new Uint8Array(buffer, byteOffset, length);
}
function pass(m) {
  const p = photos.get(m.photo);
  const k = m.to - m.from;
  let src;
  let dst;
  if (m.staged) {
    src = m.bits === 16 ? new Uint16Array(m.staged.sab, 0, m.staged.length) : new Uint8Array(m.staged.sab, 0, m.staged.length);
    dst = greyOver(m.staged.sab, 0, m.outBits, k);
  } else {
    if (!p) throw new Error('no pixels for this render');
    src = p.src.subarray(m.from * 3, m.to * 3);
    dst = greyOver(p.bytes.buffer, p.bytes.byteOffset + m.from * (m.outBits / 8), m.outBits, k);
  }
  if (m.op === 'exact8') applyExactLut(m.lut, src, 3, dst, 0, k);
  else if (m.op === 'sparse') applyExactSparse(m.colours, m.sparse, src, 3, dst, 0, k);
  else applyLut16(m.plan, src, 3, dst, 0, k);
  return m.op === 'sparse' ? { sparse: m.sparse } : {};
}
// the other worker's grey codes (over its copy of the bottom half) moved beside the lead's
function assemble(m) {
  const p = photos.get(m.photo);
  const b = m.outBits / 8;
  p.bytes.set(new Uint8Array(m.staged.sab, 0, (m.to - m.from) * b), m.from * b);
  return {};
}
// a photo's pixels dropped, its staging buffer kept for the next large render
function drop(photo) {
  const p = photos.get(photo);
  photos.delete(photo);
  if (p && p.staging && (!spare || spare.byteLength < p.staging.byteLength)) spare = p.staging;
  return p;
}
// encodes the grey codes (as photo-render.ts encodeGrey does), or hands them over; the pixels are dropped
async function finish(m) {
  const p = drop(m.photo);
  const grey = greyOver(p.bytes.buffer, p.bytes.byteOffset, m.outBits, p.n);
  if (!m.format) return { grey: grey.slice() };
  sharp ??= require(workerData.sharpPath);
  const raw = { width: p.width, height: p.height, channels: 1 };
  const data = await (m.format === 'jpeg' ? sharp(grey, { raw }).toColourspace('b-w').jpeg(m.jpeg) : sharp(grey, { raw }).toColourspace('grey16').png(m.png)).toBuffer();
  return { data };
}
// a small photo's whole render in one job, posted while the photo still decodes: its pass through the
// look's sparse table once decoded, then its encoding (no round trip to the main thread between them)
async function renderSmall(m) {
  const d = decoding.get(m.photo);
  if (d) await d;
  const t0 = performance.now();
  const r = pass({ ...m, op: 'sparse', staged: null, from: 0, to: photos.get(m.photo) ? photos.get(m.photo).n : 0 });
  const t1 = performance.now();
  const f = await finish(m);
  return { ...r, ...f, passMs: t1 - t0, encodeMs: performance.now() - t1 };
}
async function handle(m) {
  if (m.op === 'decode') {
    const d = decode(m);
    decoding.set(m.photo, d);
    const forget = () => decoding.delete(m.photo);
    d.then(forget, forget);
    return d;
  }
  if (m.op === 'renderSmall') return renderSmall(m);
  if (m.op === 'release') return drop(m.photo), {};
  if (m.op === 'assemble') return assemble(m);
  if (m.op === 'finish') return finish(m);
  if (m.op === 'nodes') return exposuresRange(m.reflectances, m.weights, m.size, m.values, m.from, m.to), {};
  return pass(m);
}
parentPort.on('message', (m) => {
  handle(m).then(
    (r) => parentPort.postMessage({ id: m.id, ok: true, ...r }),
    (e) => parentPort.postMessage({ id: m.id, ok: false, message: String((e && e.message) || e) }),
  );
});`;

/** The render workers failed (not the photo): the caller renders on its own thread instead. */
export class RenderWorkerError extends Error {}

/** Whether a typed array lives in shared memory (a worker then sees the same bytes). */
export function isShared(a: ArrayBufferView): boolean {
  return a.buffer instanceof SharedArrayBuffer;
}

/** A copy of a typed array in shared memory (or the array itself when it is there already). */
export function toShared<T extends Float64Array | Float32Array | Uint8Array | Uint16Array | Uint32Array | Int32Array>(a: T): T {
  if (isShared(a)) return a;
  const Ctor = a.constructor as new (b: SharedArrayBuffer) => T;
  const out = new Ctor(new SharedArrayBuffer(a.byteLength));
  out.set(a as never);
  return out;
}

/** An object with its typed arrays in shared memory (copied once; cached per object), so posting it copies no table. */
const sharedObjects = new WeakMap<object, object>();
export function shareObject<T extends object>(o: T): T {
  let s = sharedObjects.get(o) as T | undefined;
  if (!s) {
    s = Object.fromEntries(Object.entries(o).map(([k, v]) => [k, ArrayBuffer.isView(v) && !(v instanceof DataView) ? toShared(v as Uint8Array) : v])) as T;
    sharedObjects.set(o, s);
  }
  return s;
}

/**
 * Lazy node exposures whose values and flags live in shared memory, so a worker filling them fills the
 * look's own (the values computed so far kept: they are the same bits).
 */
export function sharedNodes(lazy: LazyNodeExposures): LazyNodeExposures {
  if (isShared(lazy.values) && isShared(lazy.done) && isShared(lazy.reflectances)) return lazy;
  let reflectances = sharedReflectances.get(lazy.reflectances);
  if (!reflectances) sharedReflectances.set(lazy.reflectances, (reflectances = toShared(lazy.reflectances)));
  return { ...lazy, values: toShared(lazy.values), done: toShared(lazy.done), reflectances };
}
/** Upsampling tables not loaded in shared memory (built by hand, as tests do), copied there once each. */
const sharedReflectances = new WeakMap<Float32Array, Float32Array>();

/** The decoded photo in the lead worker: its size, and its bottom half in shared memory when asked for. */
export interface DecodedInWorker {
  photo: number;
  width: number;
  height: number;
  bottom: { sab: SharedArrayBuffer; length: number; from: number } | null;
}

interface Reply {
  id: number;
  ok: boolean;
  message?: string;
  [k: string]: unknown;
}

class RenderWorker {
  private worker: Worker | null = null;
  broken = false;
  private next = 1;
  private waiting = new Map<number, (r: Reply) => void>();

  private get(): Worker | null {
    if (this.broken) return null;
    if (!this.worker) {
      try {
        const sharpPath = createRequire(import.meta.url).resolve('sharp');
        const w = new Worker(WORKER_SOURCE, { eval: true, workerData: { sharpPath } });
        w.unref();
        w.on('message', (r: Reply) => {
          const done = this.waiting.get(r.id);
          this.waiting.delete(r.id);
          if (this.waiting.size === 0) w.unref();
          done?.(r);
        });
        w.on('error', () => this.fail(w));
        w.on('exit', () => this.fail(w));
        this.worker = w;
      } catch {
        this.broken = true;
        return null;
      }
    }
    return this.worker;
  }

  /** A worker that errs or exits is not used again; what it was doing answers not-ok. */
  private fail(w: Worker) {
    if (this.worker !== w) return;
    this.broken = true;
    this.worker = null;
    for (const done of this.waiting.values()) done({ id: 0, ok: false, message: 'the render worker stopped' });
    this.waiting.clear();
  }

  /** Sends a job; resolves with the worker's reply (ok false when it failed or there is no worker). */
  send(message: object): Promise<Reply> {
    const w = this.get();
    if (!w) return Promise.resolve({ id: 0, ok: false, message: 'no render worker' });
    const id = this.next++;
    return new Promise<Reply>((resolve) => {
      this.waiting.set(id, resolve);
      w.ref();
      w.postMessage({ ...message, id });
    });
  }
}

class PassPool {
  /** passes the workers completed (for tests and diagnostics) */
  runs = 0;
  private lead = new RenderWorker();
  private other = new RenderWorker();
  private photos = 0;

  /** Whether the lead worker can take renders (else the caller renders on its own thread). */
  get available(): boolean {
    return !this.lead.broken && typeof SharedArrayBuffer !== 'undefined';
  }

  /**
   * A zeroed lazy table of 2²⁴ entries the workers fill (exact-lut.ts): Uint16 for 8-bit output, Uint32 for
   * 16-bit. Its pages are not touched beforehand: only those holding a colour the photo has become resident
   * (the 24-megapixel still life and photographs: about 20 of its 32 MB, measured), the price being their
   * page faults during the pass, shared by the two workers.
   */
  allocLazy(bits: 8 | 16): Uint16Array | Uint32Array {
    const buf = new SharedArrayBuffer((1 << 24) * (bits === 8 ? 2 : 4));
    return bits === 8 ? new Uint16Array(buf) : new Uint32Array(buf);
  }

  /** Every node's exposure of `lazy` (values in shared memory, sharedNodes), half in each worker; false when they cannot. */
  async fillNodes(lazy: LazyNodeExposures): Promise<boolean> {
    if (!isShared(lazy.values) || !isShared(lazy.reflectances)) return false;
    const n = lazy.values.length;
    const half = Math.floor(n / 8) * 4;
    const job = { op: 'nodes', reflectances: lazy.reflectances, weights: lazy.weights, size: lazy.size, values: lazy.values };
    const [a, b] = await Promise.all([this.lead.send({ ...job, from: 0, to: half }), this.other.send({ ...job, from: half, to: n })]);
    if (!a.ok || !b.ok) return false;
    lazy.done.fill(1);
    lazy.complete = true;
    return true;
  }

  /**
   * Decodes a photo in the lead worker (its pixels stay there until `release`; a large one's bottom half
   * also copied into shared memory for the other worker); throws what the decoder threw.
   */
  async decode(input: string | Buffer, bits: 8 | 16, hasProfile: boolean, maxPixels?: number): Promise<DecodedInWorker> {
    return this.startDecode(input, bits, hasProfile, maxPixels).decoded;
  }

  /**
   * `decode`, with the photo's number known at once (renderSmall posts a small photo's render before its
   * decoding is answered).
   */
  startDecode(input: string | Buffer, bits: 8 | 16, hasProfile: boolean, maxPixels?: number): { photo: number; decoded: Promise<DecodedInWorker> } {
    const photo = ++this.photos;
    // posting a view copies its whole buffer: a Buffer cut from a larger one is posted as its own bytes
    if (typeof input !== 'string' && input.byteLength !== input.buffer.byteLength) input = Buffer.from(input);
    const decoded = this.lead
      .send({ op: 'decode', photo, input, bits, hasProfile, sharpOptions: sharpInput(maxPixels), splitMin: PARALLEL_MIN_PIXELS, keepStaging: KEEP_STAGING_BYTES })
      .then((r) => {
        if (!r.ok) throw new Error(r.message ?? 'the photo could not be decoded');
        return { photo, width: r.width as number, height: r.height as number, bottom: r.bottom as DecodedInWorker['bottom'] };
      });
    return { photo, decoded };
  }

  /**
   * A small 8-bit photo's whole render in the lead worker, in one job posted as soon as the look's table is
   * ready, without waiting for the photo's decoding to be answered: its pass through the sparse table
   * (all of it, in the lead) once decoded, then its encoding (`encode`, as `finish`) or its grey codes; the
   * lead drops the photo. Saves two round trips to the main thread on a render of a few milliseconds.
   * Resolves ok false when the worker could not (the caller then looks at the decoding's own answer).
   */
  async renderSmall(
    table: { colours: ExactColours; sparse: SparseColours },
    photo: number,
    outBits: 8 | 16,
    encode: { format: 'jpeg' | 'png16'; jpeg: object; png: object } | null,
  ): Promise<{ ok: boolean; sparse?: SparseColours; data?: Buffer; grey?: Uint8Array | Uint16Array; passMs: number; encodeMs: number }> {
    const r = await this.lead.send({ op: 'renderSmall', ...table, photo, bits: 8, outBits, ...(encode ?? { format: null }) });
    if (!r.ok) return { ok: false, passMs: 0, encodeMs: 0 };
    this.runs++;
    const u = r.data as Uint8Array | undefined;
    return {
      ok: true,
      sparse: r.sparse as SparseColours | undefined,
      data: u ? Buffer.from(u.buffer, u.byteOffset, u.byteLength) : undefined,
      grey: r.grey as Uint8Array | Uint16Array | undefined,
      passMs: r.passMs as number,
      encodeMs: r.encodeMs as number,
    };
  }

  /** Drops a decoded photo's pixels from the lead worker. */
  release(photo: number): void {
    void this.lead.send({ op: 'release', photo });
  }

  /**
   * Renders pixels [from, to) of a decoded photo, `outBits` deep, each grey code written over its own
   * pixel: in the lead worker over its pixels, or in the other one over the bottom half's copy (`staged`;
   * then `assemble` moves them beside the lead's). With a sparse table, answers the table as the worker left
   * it (it may have grown). Resolves ok false when the worker could not.
   */
  async pass(
    table: { lut: ExactLut } | { plan: LutPlan16 } | { colours: ExactColours; sparse: SparseColours },
    d: DecodedInWorker,
    bits: 8 | 16,
    outBits: 8 | 16,
    from: number,
    to: number,
    staged: boolean,
  ): Promise<{ ok: boolean; sparse?: SparseColours }> {
    const op = 'lut' in table ? 'exact8' : 'plan' in table ? 'plan16' : 'sparse';
    const shared = 'lut' in table ? { lut: shareObject(table.lut) } : 'plan' in table ? { plan: shareObject(table.plan) } : table;
    const worker = staged ? this.other : this.lead;
    const r = await worker.send({ op, ...shared, photo: d.photo, staged: staged ? d.bottom : null, bits, outBits, from, to });
    if (r.ok) this.runs++;
    return { ok: r.ok, sparse: r.sparse as SparseColours | undefined };
  }

  /** Moves the other worker's grey codes of pixels [from, to) beside the lead's. */
  async assemble(d: DecodedInWorker, outBits: 8 | 16, from: number, to: number): Promise<void> {
    const r = await this.lead.send({ op: 'assemble', photo: d.photo, staged: d.bottom, outBits, from, to });
    if (!r.ok) throw new RenderWorkerError(r.message ?? 'the render workers failed');
  }

  /**
   * The rendered photo, encoded in the lead worker (`encode`: the format and sharp's settings, as
   * photo-render.ts encodeGrey encodes), or its grey codes; the lead drops the photo either way.
   */
  async finish(d: DecodedInWorker, outBits: 8 | 16, encode: { format: 'jpeg' | 'png16'; jpeg: object; png: object } | null): Promise<{ data?: Buffer; grey?: Uint8Array | Uint16Array }> {
    const r = await this.lead.send({ op: 'finish', photo: d.photo, outBits, ...(encode ?? { format: null }) });
    if (!r.ok) throw new RenderWorkerError(r.message ?? 'the render workers failed');
    if (r.data) {
      const u = r.data as Uint8Array;
      return { data: Buffer.from(u.buffer, u.byteOffset, u.byteLength) };
    }
    return { grey: r.grey as Uint8Array | Uint16Array };
  }
}

/** The process's one pool. */
export const passPool = new PassPool();
