/**
 * The page's side of the preview worker: one worker for the page, a promise per request, and a small
 * cache of tables by key (a look's content hash plus the live edits).
 */
import type { PhotoLookView } from '../../../../shared/schemas/photo';
import { editsKey, type LookEdits } from './look-edits';
import type { FromWorker, PreviewLut, ToWorker } from './preview-protocol';

/** Nodes per axis of the preview's table (shared/photo/exposure-lut.ts PREVIEW_LUT_SIZE). */
export const PREVIEW_SIZE = 33;

type Pending = { resolve: (v: never) => void; reject: (e: Error) => void };

export class PreviewEngine {
  private worker: Worker;
  private next = 1;
  private pending = new Map<number, Pending>();
  private luts = new Map<string, PreviewLut>();
  private sentPhotos = new Set<string>();

  constructor() {
    this.worker = new Worker(new URL('./preview.worker.ts', import.meta.url), { type: 'module' });
    this.worker.onmessage = (e: MessageEvent<FromWorker>) => {
      const m = e.data;
      if (m.type === 'ready') return;
      const p = this.pending.get(m.id);
      if (!p) return;
      this.pending.delete(m.id);
      if (m.type === 'error') p.reject(new Error(m.message));
      else p.resolve(m as never);
    };
  }

  private send<T>(m: ToWorker & { id: number }, transfer: Transferable[] = []): Promise<T> {
    return new Promise<T>((resolve, reject) => {
      this.pending.set(m.id, { resolve: resolve as (v: never) => void, reject });
      this.worker.postMessage(m, transfer);
    });
  }

  /** The table of a look with live edits (from the cache when it was built already). */
  async lut(view: PhotoLookView, edits: LookEdits): Promise<PreviewLut> {
    const key = editsKey(view, edits);
    const hit = this.luts.get(key);
    if (hit) return hit;
    const r = await this.send<Extract<FromWorker, { type: 'lut' }>>({ type: 'look', id: this.next++, key, view, edits, size: PREVIEW_SIZE });
    this.luts.set(key, r.lut);
    if (this.luts.size > 24) this.luts.delete(this.luts.keys().next().value!);
    return r.lut;
  }

  /** CPU fallback: the grey and zone index of every preview pixel through table `key`. */
  async apply(key: string, photoKey: string, image: ImageData, zones: boolean): Promise<{ grey: Uint8Array; zone: Uint8Array | null; ms: number }> {
    if (!this.sentPhotos.has(photoKey)) {
      this.worker.postMessage({ type: 'photo', photoKey, width: image.width, height: image.height, rgba: image.data.slice() } satisfies ToWorker);
      this.sentPhotos.add(photoKey);
    }
    return this.send({ type: 'apply', id: this.next++, key, photoKey, zones });
  }

  dispose() {
    this.worker.terminate();
  }
}

let shared: PreviewEngine | null = null;
/** The page's one engine (created on first use). */
export function previewEngine(): PreviewEngine {
  shared ??= new PreviewEngine();
  return shared;
}
