/**
 * A look made ready for photos, composed from the engine (no spectral or tone math of its own):
 * - a pixel's medium exposure m is the engine's per-pixel computation (shared/spectral/lut.ts): the
 *   colour's reflectance is the trilinear blend of the upsampling table's corner spectra, so m is the
 *   same blend of the table nodes' exposures (`nodeExposures`, `locateCell`, `interpolateAtCell`);
 * - its tone is the look's tone pipeline, tabulated (tone-curve-table.ts).
 * `buildPhotoLut` turns it into the 3-D table (exposure-lut.ts) the renderers apply.
 */
import { nodeExposures } from '../spectral/lut';
import type { Stack } from '../spectral/compute';
import { interpolateAtCell, locateCell, type TableCell, type UpsampleTable } from '../spectral/upsample-table';
import { FLOOR_STOPS, MIDDLE_GREY } from '../spectral/limits';
import type { TonePipeline } from '../tone/tone-pipeline';
import { srgbDecode } from '../tone/print';
import { buildExposureLut, type ExposureLut } from './exposure-lut';
import { nodeExposuresFrom } from './node-reflectances';
import { greyOfStops, toneCurveTable, type ToneCurveTable } from './tone-curve-table';

/** Everything needed to tone a pixel through one look. */
export interface PhotoToneModel {
  readonly upsample: UpsampleTable;
  /** m at every node of the upsampling table for the look's stack (linear, 0.18 = middle grey) */
  readonly nodeM: Float64Array;
  readonly tone: ToneCurveTable;
}

/**
 * Prepares a look for photos: the stack's node exposures and its tabulated tone curve. Pass the
 * table's node reflectances (node-reflectances.ts) when several looks are prepared: same numbers, faster.
 */
export function photoToneModel(stack: Stack, pipeline: TonePipeline, upsample: UpsampleTable, reflectances?: Float32Array): PhotoToneModel {
  const nodeM = reflectances ? nodeExposuresFrom(reflectances, stack) : nodeExposures(stack, upsample);
  return { upsample, nodeM, tone: toneCurveTable(pipeline) };
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
