/** Messages between the page and the preview worker (preview.worker.ts). */
import type { PhotoLookView } from '../../../../shared/schemas/photo';
import type { LookEdits } from './look-edits';
import type { PreviewGpuTable } from '../../../../shared/photo/preview-lut';

/** 'drag': the small table a moving slider gets (drawn at reduced resolution); 'full': the resting one. */
export type PreviewQuality = 'drag' | 'full';

/** A look's table as the preview uses it: the 3-D part (stops over sRGB-encoded nodes) and the 1-D tone curve. */
export interface PreviewLut {
  key: string;
  size: number;
  quality: PreviewQuality;
  /** stops at each node, red fastest (shared/photo/exposure-lut.ts) */
  stops: Float32Array;
  /** the output grey (sRGB-encoded 0..1) at each node: the GPU interpolates it directly (one texture read a pixel) */
  grey: Float32Array;
  /** grey and stops as 16-bit codes in byte pairs, the GPU's texture (shared/photo/preview-lut.ts) */
  gpu: PreviewGpuTable;
  tone: { minStops: number; step: number; grey: Float32Array; offsetStops: number };
  /** time the worker took to build it, ms */
  ms: number;
}

export type ToWorker =
  | { type: 'look'; id: number; key: string; view: PhotoLookView; edits: LookEdits; size: number }
  | { type: 'photo'; photoKey: string; width: number; height: number; rgba: Uint8ClampedArray }
  | { type: 'apply'; id: number; key: string; photoKey: string; zones: boolean };

export type FromWorker =
  | { type: 'ready'; ms: number }
  | { type: 'lut'; id: number; lut: PreviewLut }
  | { type: 'applied'; id: number; key: string; grey: Uint8Array; zone: Uint8Array | null; ms: number }
  | { type: 'error'; id: number; message: string };
