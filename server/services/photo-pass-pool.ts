/**
 * A second thread for full-resolution renders. sharp decodes and encodes on its own threads; the pass is
 * JavaScript, so the main thread shares it with one worker: the worker takes the bottom half of the
 * pixels (with a look's lazily filled exact table, shared/photo/exact-lut.ts, or a 16-bit plan).
 * The worker runs the very same functions (passed as their source text, so it needs no TypeScript
 * loader: they refer to nothing outside their arguments and each other); data reaches it through SharedArrayBuffers.
 * Any failure (no worker, an error in it) answers false and the caller does the work itself.
 */
import { Worker } from 'node:worker_threads';
import { applyLut16, type GreyBuffer, type LutPlan16 } from '../../shared/photo/apply-lut';
import { applyExactLut, exactCode, type ExactLut } from '../../shared/photo/exact-lut';

/** Images smaller than this are rendered on one thread, pixels. */
export const PARALLEL_MIN_PIXELS = 2_000_000;
/** Largest staging copy of the worker's pixels, bytes (kept for reuse); larger images render on one thread. */
const KEEP_STAGING_BYTES = 160 * 1024 * 1024;

const WORKER_SOURCE = `
const { parentPort } = require('node:worker_threads');
// the TypeScript loader may wrap inner functions as __name(fn, "name"); the worker runs plain JS
const __name = (f) => f;
const exactCode = ${exactCode.toString()};
const applyExactLut = ${applyExactLut.toString()};
const applyLut16 = ${applyLut16.toString()};
const typed = { u8: Uint8Array, u16: Uint16Array, u32: Uint32Array, i32: Int32Array, f32: Float32Array, f64: Float64Array };
const revive = (o) => {
  const out = {};
  for (const [k, v] of Object.entries(o)) out[k] = v && v.sab instanceof SharedArrayBuffer ? new typed[v.type](v.sab) : v;
  return out;
};
parentPort.on('message', (m) => {
  try {
    const src = m.bits === 16 ? new Uint16Array(m.src, 0, m.srcLength) : new Uint8Array(m.src, 0, m.srcLength);
    const dst = (m.outBits === 16 ? new Uint16Array(m.dst) : new Uint8Array(m.dst)).subarray(m.from);
    if (m.op === 'exact8') applyExactLut(revive(m.lut), src, 3, dst, 0, m.to - m.from);
    else applyLut16(revive(m.plan), src, 3, dst, 0, m.to - m.from);
    parentPort.postMessage({ ok: true });
  } catch (e) {
    parentPort.postMessage({ ok: false, message: String((e && e.message) || e) });
  }
});`;

interface SharedArray {
  sab: SharedArrayBuffer;
  type: 'u8' | 'u16' | 'u32' | 'i32' | 'f32' | 'f64';
}

function typeOf(a: ArrayBufferView): SharedArray['type'] {
  if (a instanceof Uint8Array) return 'u8';
  if (a instanceof Uint16Array) return 'u16';
  if (a instanceof Uint32Array) return 'u32';
  if (a instanceof Int32Array) return 'i32';
  if (a instanceof Float32Array) return 'f32';
  if (a instanceof Float64Array) return 'f64';
  throw new Error('unsupported table type');
}

/** The typed array in shared memory (copied once if it is not there already). */
function shared(a: ArrayBufferView): SharedArray {
  if (a.buffer instanceof SharedArrayBuffer && a.byteOffset === 0 && a.byteLength === a.buffer.byteLength) return { sab: a.buffer, type: typeOf(a) };
  const sab = new SharedArrayBuffer(a.byteLength);
  new Uint8Array(sab).set(new Uint8Array(a.buffer, a.byteOffset, a.byteLength));
  return { sab, type: typeOf(a) };
}

/** An object's typed arrays as shared arrays (cached per object). */
const sharedObjects = new WeakMap<object, Record<string, unknown>>();
function shareObject(o: object): Record<string, unknown> {
  let s = sharedObjects.get(o);
  if (!s) {
    s = Object.fromEntries(Object.entries(o).map(([k, v]) => [k, ArrayBuffer.isView(v) ? shared(v) : v]));
    sharedObjects.set(o, s);
  }
  return s;
}

class PassPool {
  /** jobs the worker completed (for tests and diagnostics) */
  runs = 0;
  private worker: Worker | null = null;
  private broken = false;
  private staging: SharedArrayBuffer | null = null;

  private get(): Worker | null {
    if (this.broken) return null;
    if (!this.worker) {
      try {
        this.worker = new Worker(WORKER_SOURCE, { eval: true });
        this.worker.unref();
        this.worker.on('error', () => {
          this.broken = true;
          this.worker = null;
        });
      } catch {
        this.broken = true;
        return null;
      }
    }
    return this.worker;
  }

  private post(message: object): Promise<boolean> {
    const w = this.get();
    if (!w) return Promise.resolve(false);
    return new Promise<boolean>((resolve) => {
      const onMessage = (m: { ok: boolean }) => {
        w.off('error', onError);
        if (m.ok) this.runs++;
        resolve(m.ok);
      };
      const onError = () => {
        w.off('message', onMessage);
        resolve(false);
      };
      w.once('message', onMessage);
      w.once('error', onError);
      w.ref();
      w.postMessage(message);
    }).finally(() => w.unref());
  }

  /** A buffer of `n` codes the worker can write into (shared memory unless the worker is gone). */
  alloc(n: number, bits: 8 | 16): Uint8Array | Uint16Array {
    if (this.broken) return bits === 8 ? new Uint8Array(n) : new Uint16Array(n);
    const sab = new SharedArrayBuffer(n * (bits === 8 ? 1 : 2));
    return bits === 8 ? new Uint8Array(sab) : new Uint16Array(sab);
  }

  /** A zeroed lazy table of 2²⁴ entries both threads can fill (exact-lut.ts): Uint16 for 8-bit output, Uint32 for 16-bit. */
  allocLazy(bits: 8 | 16): Uint16Array | Uint32Array {
    const n = 1 << 24;
    const bytes = n * (bits === 8 ? 2 : 4);
    const buf = this.broken ? new ArrayBuffer(bytes) : new SharedArrayBuffer(bytes);
    const codes = bits === 8 ? new Uint16Array(buf) : new Uint32Array(buf);
    // touch every page now, while the photo decodes: the pass then meets no page faults (about 30 ms
    // on the 24-megapixel benchmark, measured); writing 0 keeps the table empty
    for (let i = 0; i < n; i += 1024) codes[i] = 0;
    return codes;
  }

  /**
   * Renders pixels [from, n) of `src` on the worker into `dst` (from `alloc`), with a lazy exact table
   * (8-bit input; its codes from `allocLazy`, or the worker's share is refused) or a 16-bit plan. Resolves false when the worker cannot (the caller then renders them).
   */
  pass(table: { lut: ExactLut } | { plan: LutPlan16 }, bits: 8 | 16, src: Uint8Array | Uint16Array, dst: GreyBuffer, from: number, n: number): Promise<boolean> {
    if (!(dst.buffer instanceof SharedArrayBuffer) || !this.get()) return Promise.resolve(false);
    if ('lut' in table && !(table.lut.codes.buffer instanceof SharedArrayBuffer)) return Promise.resolve(false);
    const part = src.subarray(from * 3, n * 3);
    const bytes = part.byteLength;
    if (bytes > KEEP_STAGING_BYTES) return Promise.resolve(false); // very large images: one thread, no second copy
    if (!this.staging || this.staging.byteLength < bytes) this.staging = new SharedArrayBuffer(bytes);
    new Uint8Array(this.staging, 0, bytes).set(new Uint8Array(part.buffer, part.byteOffset, bytes));
    const common = { bits, src: this.staging, srcLength: bytes / (bits === 16 ? 2 : 1), dst: dst.buffer, outBits: dst instanceof Uint16Array ? 16 : 8, from, to: n };
    return 'lut' in table ? this.post({ op: 'exact8', lut: shareObject(table.lut), ...common }) : this.post({ op: 'plan16', plan: shareObject(table.plan), ...common });
  }
}

/** The process's one pool. */
export const passPool = new PassPool();
