/**
 * The photo look-up table, 1-D part: stops on the medium (before key placement) → the output grey,
 * a look's tone pipeline (shared/tone/tone-pipeline.ts: key placement, characteristic curve and
 * development, print or display, IEC 61966-2-1 encoding) sampled finely along stops once per look.
 * Between samples: linear interpolation; beyond the range, the end values hold.
 */
import type { TonePipeline } from '../tone/tone-pipeline';
import { FLOOR_STOPS } from '../spectral/limits';

/** The stops range tabulated (before key placement): the engine's floor to well past paper white. */
export const TONE_TABLE_STOPS: readonly [number, number] = [FLOOR_STOPS, 4];
/**
 * Samples of the tabulated tone curve: 1/64 stop apart. The curves bend by at most about 0.3 (encoded
 * grey) per stop², so linear interpolation between samples is within 0.3 · (1/64)² / 8 ≈ 1e-5 of the
 * pipeline (0.002/255).
 */
export const TONE_TABLE_SAMPLES = (TONE_TABLE_STOPS[1] - TONE_TABLE_STOPS[0]) * 64 + 1;

/** A look's tone curve along stops. */
export interface ToneCurveTable {
  /** stops of sample 0 (before key placement) */
  readonly minStops: number;
  /** stops between samples */
  readonly step: number;
  /** output grey at each sample, sRGB-encoded 0..1 */
  readonly grey: Float32Array;
  /** the key placement the pipeline applies, stops (zone = 5 + stops + offsetStops) */
  readonly offsetStops: number;
}

/** Tabulates a look's tone pipeline over TONE_TABLE_STOPS (stops before key placement → sRGB grey 0..1). */
export function toneCurveTable(pipeline: TonePipeline, samples: number = TONE_TABLE_SAMPLES): ToneCurveTable {
  const [lo, hi] = TONE_TABLE_STOPS;
  const step = (hi - lo) / (samples - 1);
  const grey = new Float32Array(samples);
  // the pipeline's grey alone (srgbOfStops: renderStops(s).srgb, the same bits, without the rest of its result)
  for (let i = 0; i < samples; i++) grey[i] = pipeline.srgbOfStops(lo + i * step);
  const top = lo + (samples - 1) * step;
  return { minStops: lo, step, grey, offsetStops: pipeline.stopsAfterKey(top) - top };
}

/** Output grey (sRGB-encoded 0..1) of a tone `stops` from middle grey (before key placement). */
export function greyOfStops(t: ToneCurveTable, stops: number): number {
  const last = t.grey.length - 1;
  const x = (stops - t.minStops) / t.step;
  if (!(x > 0)) return t.grey[0];
  if (x >= last) return t.grey[last];
  const i = Math.floor(x);
  return t.grey[i] + (x - i) * (t.grey[i + 1] - t.grey[i]);
}

/** Zone (5 + stops after key placement, unrounded) of a tone `stops` before placement. */
export function zoneOfStops(t: ToneCurveTable, stops: number): number {
  return 5 + stops + t.offsetStops;
}

/** Fixed-point steps per stop in output codes (a tone 1/2048 stop apart moves the grey < 0.02/255). */
export const STOPS_Q = 2048;
/** Stops (before key placement) of fixed-point 0. */
export const MIN_STOPS = TONE_TABLE_STOPS[0];
/** Largest fixed-point value (the top of the tone table). */
export const MAX_Q = (TONE_TABLE_STOPS[1] - TONE_TABLE_STOPS[0]) * STOPS_Q;

/** Bits per output grey code. */
export type OutputBits = 8 | 16;

/** Fixed-point stops → output code (0..255 or 0..65535), MAX_Q + 1 entries. */
export function outputCodes(tone: ToneCurveTable, bits: OutputBits): Uint8Array | Uint16Array {
  const n = MAX_Q + 1;
  const top = bits === 8 ? 255 : 65535;
  const out = bits === 8 ? new Uint8Array(n) : new Uint16Array(n);
  for (let i = 0; i < n; i++) out[i] = Math.round(greyOfStops(tone, MIN_STOPS + i / STOPS_Q) * top);
  return out;
}

/**
 * The output code of a tone `stopsBeforeKey` (stops from middle grey before key placement) through
 * `codes` (outputCodes): the one rounding every grey in the product goes through, swatches and photo
 * pixels alike (shared/photo/exact-lut.ts writes the same two lines out for its worker).
 */
export function codeOfStops(codes: Uint8Array | Uint16Array, stopsBeforeKey: number): number {
  const q = ((stopsBeforeKey - MIN_STOPS) * STOPS_Q + 0.5) | 0;
  return codes[q < 0 ? 0 : q > MAX_Q ? MAX_Q : q];
}
