/** Messages between the page and the uncertainty worker (uncertainty.worker.ts). */
export type ToUncertaintyWorker =
  | { type: 'table'; key: string; size: number; widths: Float32Array }
  | { type: 'shade'; id: number; key: string; width: number; height: number; rgba: Uint8ClampedArray };

export type FromUncertaintyWorker =
  | { type: 'shaded'; id: number; rgba: Uint8ClampedArray; shaded: number; maxStops: number; ms: number }
  | { type: 'error'; id: number; message: string };
