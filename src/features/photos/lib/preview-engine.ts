/**
 * The page's side of the preview worker: one worker for the page, a promise per request, and a small
 * cache of tables by key (a look's content hash plus the live edits).
 */
import type { PhotoLookView } from '../../../../shared/schemas/photo';
import { editsKey, type LookEdits } from './look-edits';
import type { FromWorker, PreviewLut, PreviewQuality, ToWorker } from './preview-protocol';

/** Nodes per axis of the preview's table (shared/photo/exposure-lut.ts PREVIEW_LUT_SIZE). */
export const PREVIEW_SIZE = 33;
/**
 * Nodes per axis while a slider moves: 13³ computes 12 % of the engine's node exposures and builds in a
 * few ms (shared/photo/preview-lut.ts); the resting frame gets the full table.
 */
export const DRAG_SIZE = 13;

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

  /** The full table of these edits when it was built already. */
  cached(view: PhotoLookView, edits: LookEdits): PreviewLut | undefined {
    return this.luts.get(editsKey(view, edits));
  }

  /** The table of a look with live edits (from the cache when it was built already): full, or the small one for a moving slider. */
  async lut(view: PhotoLookView, edits: LookEdits, quality: PreviewQuality = 'full'): Promise<PreviewLut> {
    const full = this.cached(view, edits);
    if (full) return full;
    const key = quality === 'full' ? editsKey(view, edits) : `${editsKey(view, edits)}|${DRAG_SIZE}`;
    const hit = this.luts.get(key);
    if (hit) return hit;
    const size = quality === 'full' ? PREVIEW_SIZE : DRAG_SIZE;
    const r = await this.send<Extract<FromWorker, { type: 'lut' }>>({ type: 'look', id: this.next++, key, view, edits, size });
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
