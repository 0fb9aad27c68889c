/**
 * The page's side of the uncertainty worker: one worker for the page, a promise per frame shaded. Each
 * table is sent once (by key); each frame's pixels are copied to the worker, so the page's own stay intact.
 */
import type { FromUncertaintyWorker, ToUncertaintyWorker } from './uncertainty-protocol';

export type Shaded = Extract<FromUncertaintyWorker, { type: 'shaded' }>;

class UncertaintyEngine {
  private worker = new Worker(new URL('./uncertainty.worker.ts', import.meta.url), { type: 'module' });
  private next = 1;
  private pending = new Map<number, { resolve: (s: Shaded) => void; reject: (e: Error) => void }>();
  private sent = new Set<string>();

  constructor() {
    this.worker.onmessage = (e: MessageEvent<FromUncertaintyWorker>) => {
      const m = e.data;
      const p = this.pending.get(m.id);
      if (!p) return;
      this.pending.delete(m.id);
      if (m.type === 'error') p.reject(new Error(m.message));
      else p.resolve(m);
    };
  }

  /** The overlay of `image` for table `key` (widths sent on first use). */
  shade(key: string, size: number, widths: Float32Array, image: ImageData): Promise<Shaded> {
    if (!this.sent.has(key)) {
      this.worker.postMessage({ type: 'table', key, size, widths } satisfies ToUncertaintyWorker);
      this.sent.add(key);
      if (this.sent.size > 8) this.sent.delete(this.sent.values().next().value!);
    }
    const id = this.next++;
    const rgba = image.data.slice();
    return new Promise((resolve, reject) => {
      this.pending.set(id, { resolve, reject });
      this.worker.postMessage({ type: 'shade', id, key, width: image.width, height: image.height, rgba } satisfies ToUncertaintyWorker, [rgba.buffer]);
    });
  }
}

let shared: UncertaintyEngine | null = null;
/** The page's one uncertainty engine (created on first use). */
export const uncertaintyEngine = () => (shared ??= new UncertaintyEngine());
