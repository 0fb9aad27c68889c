/**
 * The working grid (350–900 nm at 1 nm, 551 samples; see policy.ts for the standard behind it).
 */
import { GRID_SHAPE, GRID_SIZE, GRID_START_NM, GRID_STEP_NM, wavelengthsOf } from './policy';
import type { SpectrumShape } from './types';

/** Wavelengths of the working grid, nm: 350, 351, … 900. Do not mutate. */
export const GRID_NM: Float64Array = wavelengthsOf(GRID_SHAPE);

/** Wavelengths of the working grid as a plain array, nm (for JSON and charts). */
export const GRID_NM_LIST: readonly number[] = Object.freeze(Array.from(GRID_NM));

/** True when `shape` is exactly the working grid. */
export function isGridShape(shape: SpectrumShape): boolean {
  return shape.startNm === GRID_SHAPE.startNm && shape.endNm === GRID_SHAPE.endNm && shape.stepNm === GRID_SHAPE.stepNm;
}

/** Index on the working grid of a wavelength that lies on it, nm → 0..550; -1 when it does not. */
export function gridIndexOf(nm: number): number {
  const i = (nm - GRID_START_NM) / GRID_STEP_NM;
  return Number.isInteger(i) && i >= 0 && i < GRID_SIZE ? i : -1;
}
