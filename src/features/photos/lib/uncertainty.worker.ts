/// <reference lib="webworker" />
/**
 * The uncertainty overlay's worker: shades a preview's pixels by how wide their plausible tone range is
 * (uncertainty-shade.ts), off the page's thread. Tables are kept by key, so a table is sent once.
 */
import { shadeUncertainty } from './uncertainty-shade';
import type { FromUncertaintyWorker, ToUncertaintyWorker } from './uncertainty-protocol';

declare const self: DedicatedWorkerGlobalScope;

const tables = new Map<string, { size: number; widths: Float32Array }>();

self.onmessage = (e: MessageEvent<ToUncertaintyWorker>) => {
  const m = e.data;
  try {
    if (m.type === 'table') {
      tables.set(m.key, { size: m.size, widths: m.widths });
      if (tables.size > 8) tables.delete(tables.keys().next().value!);
      return;
    }
    const t = tables.get(m.key);
    if (!t) throw new Error('the uncertainty table is not loaded');
    const t0 = performance.now();
    const n = m.width * m.height;
    const out = new Uint8ClampedArray(n * 4);
    const r = shadeUncertainty(t.widths, t.size, m.rgba, out, n);
    const msg: FromUncertaintyWorker = { type: 'shaded', id: m.id, rgba: out, ...r, ms: performance.now() - t0 };
    self.postMessage(msg, [out.buffer]);
  } catch (err) {
    const msg: FromUncertaintyWorker = { type: 'error', id: 'id' in m ? m.id : 0, message: err instanceof Error ? err.message : String(err) };
    self.postMessage(msg);
  }
};
