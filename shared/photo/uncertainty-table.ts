/**
 * Where a photo's rendering is uncertain: a 3-D table over sRGB-encoded colours of how wide the plausible
 * range of a colour's tone is through a look's light path (stops), for the overlay on the photos page.
 * Each node's colour is estimated as swatches and pixels are (node-spectra.ts) and ranged by the metamer
 * programs (metamer-range.ts `plausibleRange`). Built in slices so a caller can report progress.
 * Layout as the photo table (exposure-lut.ts): node i at encoded i / (size − 1), index (b·size + g)·size + r.
 */
import type { LightPath } from '../spectral/compute';
import { srgbDecode } from '../spectral/colour';
import { FLOOR_STOPS, MIDDLE_GREY } from '../spectral/limits';
import { plausibleRange, xyzD65 } from '../spectral/metamer-range';
import { blendedReflectance } from '../spectral/node-spectra';
import type { UpsampleTable } from '../spectral/upsample-table';

/** Nodes per axis of the uncertainty table (33³ = 35,937 colours, as the live preview's table). */
export const UNCERTAINTY_TABLE_SIZE = 33;

const stopsOf = (m: number) => (m > 0 ? Math.max(FLOOR_STOPS, Math.log2(m / MIDDLE_GREY)) : FLOOR_STOPS);

/**
 * Fills nodes [from, to) of `out` (size³ plausible widths in stops, layout in the header) for `lightPath`.
 * Returns `to`. A colour no reflectance can have (none in sRGB) gets width 0.
 */
export function fillUncertaintyTable(out: Float32Array, size: number, lightPath: LightPath, table: UpsampleTable, from: number, to: number): number {
  const w = lightPath.mediumWeights;
  for (let k = from; k < to; k++) {
    const r = k % size;
    const g = Math.floor(k / size) % size;
    const b = Math.floor(k / (size * size));
    const rho = blendedReflectance(table, [srgbDecode(r / (size - 1)), srgbDecode(g / (size - 1)), srgbDecode(b / (size - 1))]).values;
    const p = plausibleRange(xyzD65(rho), w);
    out[k] = p ? Math.max(0, stopsOf(p.range[1]) - stopsOf(p.range[0])) : 0;
  }
  return to;
}
