/**
 * The browser's live preview table of a look, built fast enough to follow a slider:
 * - the tone: a look without a key swatch places middle grey on zone V whatever its light and filters
 *   (compose-look.ts), so its tone table depends only on the medium's tone id and the tone settings and
 *   is kept across edits of the light and the filters (composing it is most of a look's cost; a look
 *   with a key swatch is composed afresh, as its key's place moves with the light);
 * - the nodes: a small table (the preview's while a slider moves) computes only the upsampling table's
 *   node exposures its cells touch (12 % of them at 13³, 21 % at 17³, 56 % at 33³), the full one fills
 *   them all at once (cheaper per node);
 *   either way each value is the engine's, so the table equals buildPhotoLut's (look-photo-model.ts)
 *   of the same look and size, bit for bit;
 * - the GPU form: grey and stops each as two 8-bit channels (high and low byte of a 16-bit code),
 *   because a software WebGL2 (SwiftShader) filters 8-bit 3-D textures 2–3× faster than half floats,
 *   and linear filtering of the two bytes apart is the filtering of the 16-bit code (a linear map).
 */
import { composeLook, lookLightPath, type LookSpectra } from '../look/compose-look';
import { greyOfStops, type ToneCurveTable } from '../look/tone-curve-table';
import { lazyNodeExposure, fillNodeExposures, lazyNodeExposures, nodeReflectances, type LazyNodeExposures } from '../spectral/node-spectra';
import { interpolateAtCell, locateCell, type TableCell, type UpsampleTable } from '../spectral/upsample-table';
import { FLOOR_STOPS, MIDDLE_GREY } from '../spectral/limits';
import { srgbDecode } from '../tone/print';
import { buildExposureLut, type ExposureLut } from './exposure-lut';

/** What the preview needs of a look: its medium weights' node exposures (lazy) and its tone. */
export interface PreviewLook {
  nodes: LazyNodeExposures;
  tone: ToneCurveTable;
}

/** Tone tables of key-less looks by their tone inputs (a few looks' worth). */
export type PreviewToneCache = Map<string, ToneCurveTable>;

/** A look for the preview; `cache` keeps tone tables across edits that leave the tone as it was. */
export function previewLook(s: LookSpectra, upsample: UpsampleTable, cache: PreviewToneCache): PreviewLook {
  const built = lookLightPath(s);
  const toneKey = s.key ? null : JSON.stringify([s.mediumToneId, s.tone]);
  let tone = toneKey === null ? undefined : cache.get(toneKey);
  if (!tone) {
    tone = composeLook(s, built).toneTable;
    if (toneKey !== null) {
      cache.set(toneKey, tone);
      if (cache.size > 16) cache.delete(cache.keys().next().value!);
    }
  }
  return { nodes: lazyNodeExposures(nodeReflectances(upsample), built.path.mediumWeights), tone };
}

/**
 * The look's 3-D table of stops (exposure-lut.ts layout) with `size` nodes per axis: every node's stops
 * as pixelStops (look-photo-model.ts) computes them. `eager`: fill every node exposure first (cheaper per
 * node, for tables that touch most of them).
 */
export function previewStopsLut(upsample: UpsampleTable, nodes: LazyNodeExposures, size: number, eager: boolean): ExposureLut {
  if (eager) fillNodeExposures(nodes);
  const R = upsample.resolution;
  const corners = [0, 1, R, R + 1, R * R, R * R + 1, R * R + R, R * R + R + 1];
  const cell: TableCell = { node: 0, fx: 0, fy: 0, fz: 0 };
  const m = nodes.values;
  return buildExposureLut(size, srgbDecode, (r, g, b) => {
    locateCell(upsample, r, g, b, cell);
    if (!nodes.complete) for (const c of corners) lazyNodeExposure(nodes, cell.node + c);
    const e = interpolateAtCell(upsample, m, 1, 0, cell);
    return e > 0 ? Math.max(FLOOR_STOPS, Math.log2(e / MIDDLE_GREY)) : FLOOR_STOPS;
  });
}

/** The table as the GPU reads it: 16-bit codes in two bytes (high, low) per node. */
export interface PreviewGpuTable {
  /** output grey (sRGB-encoded 0..1) × 65535 */
  grey: Uint8Array;
  /** (stops − stopsMin) / (stopsMax − stopsMin) × 65535 */
  stops: Uint8Array;
  stopsMin: number;
  stopsMax: number;
}

function put16(out: Uint8Array, i: number, v: number) {
  const q = Math.round(Math.min(1, Math.max(0, v)) * 65535);
  out[2 * i] = q >> 8;
  out[2 * i + 1] = q & 255;
}

/**
 * The GPU form of a stops table through `tone`, and its grey per node (0..1). Decoding a filtered pair
 * (hi, lo), each read 0..1: code / 65535 = (256·hi + lo) / 257.
 */
export function previewGpuTable(lut: ExposureLut, tone: ToneCurveTable): { gpu: PreviewGpuTable; grey: Float32Array } {
  const n = lut.stops.length;
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < n; i++) {
    lo = Math.min(lo, lut.stops[i]);
    hi = Math.max(hi, lut.stops[i]);
  }
  if (!(hi > lo)) hi = lo + 1;
  const grey = new Float32Array(n);
  const gpu: PreviewGpuTable = { grey: new Uint8Array(2 * n), stops: new Uint8Array(2 * n), stopsMin: lo, stopsMax: hi };
  for (let i = 0; i < n; i++) {
    grey[i] = greyOfStops(tone, lut.stops[i]);
    put16(gpu.grey, i, grey[i]);
    put16(gpu.stops, i, (lut.stops[i] - lo) / (hi - lo));
  }
  return { gpu, grey };
}
