/**
 * The estimate's node spectra: every node of the upsampling table (upsample-table.ts) as a reflectance on
 * the working grid, shared by everything that estimates colours — single
 * swatches and photo pixels alike. A colour's estimated reflectance is the trilinear blend of its table
 * cell's eight corner spectra; that blend reproduces the colour under D65 exactly (the node colours are
 * trilinear in the cell), and since the medium exposure is linear in the reflectance, a photo needs only
 * one dot product per node and look (`nodeExposures`) and then the same blend of node exposures.
 * Swatches and pixels therefore get the same number for the same colour.
 */
import { ESTIMATE_SIZE, GRID_SIZE, estimateToGrid, weightsToEstimateGrid } from './policy';
import { makeSpectrum, type Spectrum } from './spectrum';
import { locateCell, type TableCell, type UpsampleTable } from './upsample-table';

/** Reflectance 0..1 of every node of `table` on the estimate's grid (node k's 111 values from k·111). */
export function nodeReflectances(table: UpsampleTable): Float32Array {
  return table.spectra;
}

/**
 * Σ wᵢ·ρₖ(λᵢ) for every node k, with `weights` on the working grid: with a light path's medium weights this
 * is the medium exposure m of every node (linear, relative to white, 0.18 = middle grey); with eye
 * weights, X, Y or Z. The weights are carried to the estimate's grid once (exactly: the transpose of the
 * interpolation the nodes go through), so a node costs one 111-term dot product.
 */
export function nodeExposures(reflectances: Float32Array, weights: Float64Array): Float64Array {
  const out = new Float64Array(reflectances.length / ESTIMATE_SIZE);
  exposuresInto(reflectances, weightsToEstimateGrid(weights), out);
  return out;
}

/**
 * Every node's dot product into `out`. Four nodes at a time: each node's sum keeps its own order (so the
 * same bits as one node at a time, and as `lazyNodeExposure`), but the four independent chains of
 * additions overlap in the processor instead of each waiting on the previous addition (measured about
 * 1.6× faster for the 98,304 nodes).
 */
function exposuresInto(reflectances: Float32Array, w: Float64Array, out: Float64Array): void {
  exposuresRange(reflectances, w, ESTIMATE_SIZE, out, 0, out.length);
}

/**
 * Nodes [from, to) of `exposuresInto` (`S` samples per node): each node's sum the same bits whatever the
 * range, so two threads filling halves give what one thread gives. Refers to nothing outside its
 * arguments (the server's render workers run it from its source text, server/services/photo-pass-pool.ts).
 */
export function exposuresRange(reflectances: Float32Array, w: Float64Array, S: number, out: Float64Array, from: number, to: number): void {
  const n = to;
  let k = from;
  for (; k + 3 < n; k += 4) {
    const o = k * S;
    let m0 = 0;
    let m1 = 0;
    let m2 = 0;
    let m3 = 0;
    for (let i = 0; i < S; i++) {
      const wi = w[i];
      m0 += wi * reflectances[o + i];
      m1 += wi * reflectances[o + S + i];
      m2 += wi * reflectances[o + 2 * S + i];
      m3 += wi * reflectances[o + 3 * S + i];
    }
    out[k] = m0;
    out[k + 1] = m1;
    out[k + 2] = m2;
    out[k + 3] = m3;
  }
  for (; k < n; k++) {
    const o = k * S;
    let m = 0;
    for (let i = 0; i < S; i++) m += w[i] * reflectances[o + i];
    out[k] = m;
  }
}

/**
 * Node exposures computed on demand: a small photo meets a few thousand colours, touching only the nodes
 * of their cells, where computing all 98,304 costs more than sharp's whole greyscale of it. `values[k]`
 * is valid once `done[k]` is 1; a node is computed exactly as `nodeExposures` computes it (the same sum
 * in the same order), so lazily and eagerly filled values are the same bits.
 * shared/photo/exact-lut.ts `exactCode` fills nodes itself (it refers to nothing outside its arguments);
 * tests/unit/photo/lazy-nodes.test.ts checks both against `nodeExposures`.
 */
export interface LazyNodeExposures {
  readonly values: Float64Array;
  /** 1 where values[k] has been computed */
  readonly done: Uint8Array;
  /**
   * 1 where this thread has seen done[k] set (or set it): its own copy, never in shared memory (a worker
   * gets a copy with each job posted to it), so shared/photo/exact-lut.ts exactCode reads each node's shared
   * flag once per thread with Atomics, not once per colour; a hint only (0 = look at done)
   */
  readonly seen: Uint8Array;
  readonly reflectances: Float32Array;
  /** the weights on the estimate's grid (ESTIMATE_SIZE values) */
  readonly weights: Float64Array;
  /** samples per node spectrum (ESTIMATE_SIZE) */
  readonly size: number;
  /** whether every node is done (fillNodeExposures) */
  complete: boolean;
}

/**
 * Node exposures of `weights` (working grid), none computed yet; in shared memory when the reflectances
 * are (the server's render workers then fill the look's own nodes, server/services/photo-pass-pool.ts).
 */
export function lazyNodeExposures(reflectances: Float32Array, weights: Float64Array): LazyNodeExposures {
  const n = reflectances.length / ESTIMATE_SIZE;
  const shared = typeof SharedArrayBuffer !== 'undefined' && reflectances.buffer instanceof SharedArrayBuffer;
  const values = shared ? new Float64Array(new SharedArrayBuffer(n * 8)) : new Float64Array(n);
  const done = shared ? new Uint8Array(new SharedArrayBuffer(n)) : new Uint8Array(n);
  return { values, done, seen: new Uint8Array(n), reflectances, weights: weightsToEstimateGrid(weights), size: ESTIMATE_SIZE, complete: false };
}

/** Node k's exposure, computed now if not yet. */
export function lazyNodeExposure(lazy: LazyNodeExposures, k: number): number {
  if (lazy.done[k]) return lazy.values[k];
  const { reflectances: refl, weights: w, size: S } = lazy;
  const o = k * S;
  let m = 0;
  for (let i = 0; i < S; i++) m += w[i] * refl[o + i];
  lazy.values[k] = m;
  lazy.done[k] = 1;
  return m;
}

/** Every node's exposure (those not computed yet, computed now): the filled `values`. */
export function fillNodeExposures(lazy: LazyNodeExposures): Float64Array {
  if (!lazy.complete) {
    // recomputing the nodes already done writes the same bits
    exposuresInto(lazy.reflectances, lazy.weights, lazy.values);
    lazy.done.fill(1);
    lazy.complete = true;
  }
  return lazy.values;
}

/** The eight corner nodes of a cell and their trilinear weights (zero weights included). */
export function cellCorners(table: UpsampleTable, cell: TableCell): { nodes: number[]; weights: number[] } {
  const R = table.resolution;
  const nodes: number[] = [];
  const weights: number[] = [];
  for (let dz = 0; dz < 2; dz++) {
    for (let dy = 0; dy < 2; dy++) {
      for (let dx = 0; dx < 2; dx++) {
        nodes.push(cell.node + dx + dy * R + dz * R * R);
        weights.push((dx ? cell.fx : 1 - cell.fx) * (dy ? cell.fy : 1 - cell.fy) * (dz ? cell.fz : 1 - cell.fz));
      }
    }
  }
  return { nodes, weights };
}

const blendCell: TableCell = { node: 0, fx: 0, fy: 0, fz: 0 };
const blendScratch = new Float64Array(ESTIMATE_SIZE);
const gridScratch = new Float64Array(GRID_SIZE);

/**
 * The estimated reflectance (0..1 on the working grid) of linear sRGB `rgb` (each 0..1, clamped): the
 * trilinear blend of its cell's corner node spectra, carried from the estimate's grid. Reproduces the
 * colour under D65.
 */
export function blendedReflectance(table: UpsampleTable, rgb: readonly [number, number, number]): Spectrum {
  const refl = nodeReflectances(table);
  const { nodes, weights } = cellCorners(table, locateCell(table, rgb[0], rgb[1], rgb[2], blendCell));
  blendScratch.fill(0);
  for (let j = 0; j < 8; j++) {
    const w = weights[j];
    if (w === 0) continue;
    const o = nodes[j] * ESTIMATE_SIZE;
    for (let i = 0; i < ESTIMATE_SIZE; i++) blendScratch[i] += w * refl[o + i];
  }
  return makeSpectrum(estimateToGrid(blendScratch, gridScratch));
}
