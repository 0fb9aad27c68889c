/**
 * A composed look (shared/look/compose-look.ts) made ready for photos, with no spectral or tone math of
 * its own:
 * - a pixel's medium exposure m is the engine's estimate of its colour (shared/spectral/node-spectra.ts:
 *   the trilinear blend of the upsampling table's node spectra), so m is the same blend of the nodes'
 *   exposures (`nodeExposures`, `locateCell`, `interpolateAtCell`) — the number a swatch of that colour
 *   gets on a board;
 * - its tone is the look's tabulated tone curve and output codes.
 * `buildPhotoLut` turns it into the 3-D table (exposure-lut.ts) the renderers apply.
 */
import type { ComposedLook } from '../look/compose-look';
import { greyOfStops, type ToneCurveTable } from '../look/tone-curve-table';
import { fillNodeExposures, lazyNodeExposures, nodeReflectances, type LazyNodeExposures } from '../spectral/node-spectra';
import { interpolateAtCell, locateCell, type TableCell, type UpsampleTable } from '../spectral/upsample-table';
import { FLOOR_STOPS, MIDDLE_GREY } from '../spectral/limits';
import { srgbDecode } from '../tone/print';
import { buildExposureLut, type ExposureLut } from './exposure-lut';

/** Everything needed to tone a pixel through one look. */
export interface PhotoToneModel {
  readonly upsample: UpsampleTable;
  /** m at every node of the upsampling table for the look's light path (linear, 0.18 = middle grey); all computed on first read */
  readonly nodeM: Float64Array;
  /**
   * the same exposures computed node by node on demand (photoToneModel's models; absent in hand-made
   * ones): small photos compute only the nodes their colours touch (shared/photo/exact-lut.ts)
   */
  readonly nodes?: LazyNodeExposures;
  readonly tone: ToneCurveTable;
  /** the look's output codes by fixed-point stops (ComposedLook.codes) */
  readonly codes: ComposedLook['codes'];
}

/**
 * Prepares a composed look for photos: its light path's exposure at the nodes of the estimate's table,
 * computed when first needed (all of them on the first read of `nodeM`; node by node for a small
 * photo's colours), and its tone.
 */
export function photoToneModel(look: ComposedLook, upsample: UpsampleTable): PhotoToneModel {
  const nodes = lazyNodeExposures(nodeReflectances(upsample), look.path.mediumWeights);
  return {
    upsample,
    get nodeM() {
      return fillNodeExposures(nodes);
    },
    nodes,
    tone: look.toneTable,
    codes: look.codes,
  };
}

const cell: TableCell = { node: 0, fx: 0, fy: 0, fz: 0 };

/**
 * The engine's medium exposure m (linear, 0.18 = middle grey) of a linear sRGB colour (0..1 each,
 * clamped): the blend of the upsampling table's node exposures.
 */
export function pixelExposure(model: PhotoToneModel, rLin: number, gLin: number, bLin: number): number {
  locateCell(model.upsample, rLin, gLin, bLin, cell);
  return interpolateAtCell(model.upsample, model.nodeM, 1, 0, cell);
}

/** Stops from middle grey (before key placement, floored at FLOOR_STOPS) of a linear sRGB colour. */
export function pixelStops(model: PhotoToneModel, rLin: number, gLin: number, bLin: number): number {
  const m = pixelExposure(model, rLin, gLin, bLin);
  return m > 0 ? Math.max(FLOOR_STOPS, Math.log2(m / MIDDLE_GREY)) : FLOOR_STOPS;
}

/** The output grey (sRGB-encoded 0..1) of a linear sRGB colour, computed exactly (no 3-D table). */
export function pixelGrey(model: PhotoToneModel, rLin: number, gLin: number, bLin: number): number {
  return greyOfStops(model.tone, pixelStops(model, rLin, gLin, bLin));
}

/** The look's 3-D table with `size` nodes per axis, each node computed exactly. */
export function buildPhotoLut(model: PhotoToneModel, size: number): ExposureLut {
  return buildExposureLut(size, srgbDecode, (r, g, b) => pixelStops(model, r, g, b));
}
