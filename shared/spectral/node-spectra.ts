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
  const w = weightsToEstimateGrid(weights);
  const n = reflectances.length / ESTIMATE_SIZE;
  const out = new Float64Array(n);
  for (let k = 0, o = 0; k < n; k++) {
    let m = 0;
    for (let i = 0; i < ESTIMATE_SIZE; i++, o++) m += w[i] * reflectances[o];
    out[k] = m;
  }
  return out;
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
