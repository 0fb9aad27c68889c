/** Shared fixtures of the spectral tests (not a test file). */
import { buildUpsampleTable, type UpsampleTable } from '../../../shared/spectral/upsample-table';
import { makeSpectrum, type Spectrum } from '../../../shared/spectral/spectrum';
import { GRID_NM } from '../../../shared/spectral/grid';
import { readRunUpsampleTable } from '../../setup/upsample-table-file';

let table: UpsampleTable | null = null;

/**
 * The upsampling table: built once per test run by the global setup (tests/setup/upsample-table.global.ts)
 * and read from its file here; built in this file's process when run without it (about a second).
 */
export function upsampleTable(): UpsampleTable {
  table ??= readRunUpsampleTable() ?? buildUpsampleTable();
  return table;
}

/** Deterministic pseudo-random numbers in [0, 1) (mulberry32). */
export function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A spectrum on the grid from a function of nm. */
export function fromFn(fn: (nm: number) => number): Spectrum {
  return makeSpectrum(Array.from(GRID_NM, fn));
}

/** A flat reflectance. */
export function flat(value: number): Spectrum {
  return fromFn(() => value);
}
