/**
 * What a skin or makeup swatch stores besides its parameters: the engine's model reflectance (skin.ts,
 * makeup.ts, through compute.ts `resolveSwatch`) on the grid, and its hex, the colour of that reflectance
 * under D65 as a measured swatch gets its own. Engine refusals become a 400 on the field under `field`.
 */
import { resolveSwatch } from '../../../shared/spectral/compute';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { needsUpsampleTable, type NestedSwatchSource } from '../../../shared/spectral/sources';
import { toPairs } from '../../../shared/spectral/spectrum';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';
import { InvalidError } from '../../errors';
import { hexOfColour, hexOfReflectance } from './swatch-colour';

/** Rounds grid values for storage (as measured swatches are stored). */
const round6 = (v: number) => Math.round(v * 1e6) / 1e6;

/** The model's reflectance and D65 hex of a skin or makeup source (no name); `table` is needed when a colour value is in it. */
export function modelledFromSource(src: NestedSwatchSource, table: UpsampleTable | null, field: string): { hex: string; reflectance: [number, number][] } {
  if (needsUpsampleTable(src) && !table) throw new Error('modelledFromSource: a colour value in the source needs the upsampling table');
  // a hex paint the engine cannot read is refused here first, in the words of a colour swatch
  const paint = src.makeup?.colour;
  if (typeof paint === 'string') hexOfColour({ space: 'hex', hex: paint.toLowerCase() }, `${field}.makeup.colour`);
  try {
    const r = resolveSwatch({ name: 'swatch', ...src }, table).reflectance;
    return { hex: hexOfReflectance(r), reflectance: toPairs(r).map(([nm, v]) => [nm, round6(v)]) };
  } catch (err) {
    if (err instanceof SpectralInputError) {
      const e = err.under(...field.split('.'));
      throw new InvalidError(e.message, e.field);
    }
    throw err;
  }
}
