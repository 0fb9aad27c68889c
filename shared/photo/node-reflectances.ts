/**
 * The upsampling table's node spectra, kept for many looks. `nodeExposures` (shared/spectral/lut.ts)
 * evaluates every node's sigmoid spectrum for each stack; the spectra do not depend on the stack, so a
 * renderer that builds tables for many looks (the server, the live preview) evaluates them once with
 * the engine's `sigmoidInto` and then needs one 81-term dot product per node per look.
 * Same numbers as `nodeExposures` (to float32 rounding of the reflectances, < 1e-7 relative).
 */
import type { Stack } from '../spectral/compute';
import { GRID_SIZE } from '../spectral/policy';
import { sigmoidInto } from '../spectral/upsample';
import type { UpsampleTable } from '../spectral/upsample-table';

/** Reflectance 0..1 of every node of `table` on the working grid: node k's 81 values from k·81. */
export function nodeReflectances(table: UpsampleTable): Float32Array {
  const cf = table.coefficients;
  const n = cf.length / 3;
  const out = new Float32Array(n * GRID_SIZE);
  const row = new Float64Array(GRID_SIZE);
  for (let k = 0; k < n; k++) {
    sigmoidInto(cf[3 * k], cf[3 * k + 1], cf[3 * k + 2], row);
    out.set(row, k * GRID_SIZE);
  }
  return out;
}

/** Medium exposure m (linear, relative to white, 0.18 = middle grey) of every node for `stack`. */
export function nodeExposuresFrom(reflectances: Float32Array, stack: Stack): Float64Array {
  const w = stack.mediumWeights;
  const n = reflectances.length / GRID_SIZE;
  const out = new Float64Array(n);
  for (let k = 0, o = 0; k < n; k++) {
    let m = 0;
    for (let i = 0; i < GRID_SIZE; i++, o++) m += w[i] * reflectances[o];
    out[k] = m;
  }
  return out;
}
