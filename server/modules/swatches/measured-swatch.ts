import { reflectanceFromPairs } from '../../../shared/spectral/bases';
import { toPairs } from '../../../shared/spectral/spectrum';
import type { REFLECTANCE_BASES, SwatchOrigin } from '../../../shared/schemas/swatch';
import { withTableErrors, type ReadTable } from '../library/table-input';
import { hexOfReflectance } from './swatch-colour';

/** Rounds grid values for storage (reflectance to 6 decimals is far below any measurement's noise). */
const round6 = (v: number) => Math.round(v * 1e6) / 1e6;

/**
 * What a measured swatch stores, from a table already read: the engine's reflectance reader checks the pairs
 * (a refusal becomes a 400 naming the file line and field, on `errorField`), the hex is its colour under D65,
 * the reflectance is kept on the grid. Used by a single measured swatch and by a file import alike.
 */
export function measuredFromTable(
  table: ReadTable,
  basis: (typeof REFLECTANCE_BASES)[number],
  field: string,
  errorField?: string,
): { origin: SwatchOrigin; hex: string; reflectance: [number, number][] } {
  const r = withTableErrors(table, field, (pairs) => reflectanceFromPairs(pairs, basis), errorField);
  return {
    origin: { type: 'measured', basis, fileName: table.fileName, points: table.pairs.length },
    hex: hexOfReflectance(r),
    reflectance: toPairs(r).map(([nm, v]) => [nm, round6(v)]),
  };
}
