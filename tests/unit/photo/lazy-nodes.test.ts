import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { applyExactLut, applyExactSparse, exactColours, exactLut, filledColours, sparseColours } from '../../../shared/photo/exact-lut';
import { composeLook, type LookSpectra } from '../../../shared/look/compose-look';
import { photoToneModel, pixelStops, type PhotoToneModel } from '../../../shared/photo/look-photo-model';
import { fillNodeExposures, lazyNodeExposure, lazyNodeExposures, nodeExposures, nodeReflectances } from '../../../shared/spectral/node-spectra';
import { ESTIMATE_SIZE, weightsToEstimateGrid } from '../../../shared/spectral/policy';
import { resolveLightPath } from '../../../shared/spectral/compute';
import { buildRenderTable, renderGrey } from '../../../server/services/photo-render';
import { random, upsampleTable } from '../spectral/fixtures';
import { cyanPanchromaticLook } from './fixtures';

/**
 * A look's node exposures are computed on demand (node-spectra.ts LazyNodeExposures): a small photo's
 * colours touch only the nodes of their cells, so only those are computed. Computed lazily, four at a
 * time or one at a time, a node's exposure is the same sum in the same order, so the same bits, and a
 * render is byte for byte the render through exposures computed all at once. Tolerance: none.
 */
const spectra: LookSpectra = cyanPanchromaticLook();

/** The plain dot product of every node, one node at a time (what nodeExposures computed before). */
function reference(refl: Float32Array, weights: Float64Array): Float64Array {
  const w = weightsToEstimateGrid(weights);
  const out = new Float64Array(refl.length / ESTIMATE_SIZE);
  for (let k = 0, o = 0; k < out.length; k++) {
    let m = 0;
    for (let i = 0; i < ESTIMATE_SIZE; i++, o++) m += w[i] * refl[o];
    out[k] = m;
  }
  return out;
}

/** The same look with every node's exposure computed at once, and no lazy exposures (as a hand-made model). */
function eagerModel(): PhotoToneModel {
  const look = composeLook(spectra);
  const table = upsampleTable();
  return { upsample: table, nodeM: nodeExposures(nodeReflectances(table), look.path.mediumWeights), tone: look.toneTable, codes: look.codes };
}

/** A small photo-like image: a few smooth regions of colour with a little noise (interleaved RGB). */
function smallImage(): { width: number; height: number; rgb: Uint8Array } {
  const rnd = random(21);
  const width = 120;
  const height = 90;
  const rgb = new Uint8Array(width * height * 3);
  for (let y = 0, i = 0; y < height; y++) {
    for (let x = 0; x < width; x++, i += 3) {
      const n = () => Math.floor(rnd() * 6);
      rgb[i] = Math.min(255, 40 + ((x * 2) >> 2) + n());
      rgb[i + 1] = Math.min(255, 90 + (y >> 1) + n());
      rgb[i + 2] = Math.min(255, 30 + ((x + y) >> 3) + n());
    }
  }
  return { width, height, rgb };
}

describe('node exposures computed on demand', () => {
  const table = upsampleTable();
  const refl = nodeReflectances(table);
  const weights = resolveLightPath({ light: { id: 'd65' }, filters: [{ id: 'orange-550' }], medium: { id: 'orthochromatic' } }).mediumWeights;

  it('are the same bits computed all at once, node by node, or filled after some nodes', () => {
    const ref = reference(refl, weights);
    const all = nodeExposures(refl, weights);
    expect(Buffer.from(all.buffer).equals(Buffer.from(ref.buffer))).toBe(true);
    const lazy = lazyNodeExposures(refl, weights);
    const rnd = random(3);
    for (let j = 0; j < 500; j++) {
      const k = Math.floor(rnd() * ref.length);
      expect(lazyNodeExposure(lazy, k)).toBe(ref[k]);
    }
    expect(lazy.complete).toBe(false);
    const filled = fillNodeExposures(lazy);
    expect(lazy.complete).toBe(true);
    expect(Buffer.from(filled.buffer).equals(Buffer.from(ref.buffer))).toBe(true);
  });

  it('a small photo computes only the nodes its colours touch, and renders byte for byte as with all nodes computed', () => {
    const img = smallImage();
    const n = img.width * img.height;
    const eager = eagerModel();
    for (const bits of [8, 16] as const) {
      const model = photoToneModel(composeLook(spectra), table);
      const viaLazy = bits === 8 ? new Uint8Array(n) : new Uint16Array(n);
      applyExactSparse(exactColours(model, bits), sparseColours(bits), img.rgb, 3, viaLazy, 0, n);
      const done = model.nodes!.done.reduce((a, d) => a + d, 0);
      expect(done).toBeGreaterThan(0);
      expect(done).toBeLessThan(model.nodes!.done.length / 20);
      const viaEager = bits === 8 ? new Uint8Array(n) : new Uint16Array(n);
      applyExactSparse(exactColours(eager, bits), sparseColours(bits), img.rgb, 3, viaEager, 0, n);
      expect(Buffer.from(viaLazy.buffer).equals(Buffer.from(viaEager.buffer)), `${bits}-bit`).toBe(true);
      // the full table afterwards: every node filled (the ones met kept), nothing left for a worker to compute
      const lut = exactLut(bits === 8 ? new Uint16Array(1 << 24) : new Uint32Array(1 << 24), model, bits);
      expect(lut.nodes).toBe(null);
      expect(model.nodes!.complete).toBe(true);
      expect(Buffer.from(lut.nodeM.buffer).equals(Buffer.from(eager.nodeM.buffer))).toBe(true);
      const viaTable = bits === 8 ? new Uint8Array(n) : new Uint16Array(n);
      applyExactLut(lut, img.rgb, 3, viaTable, 0, n);
      expect(Buffer.from(viaTable.buffer).equals(Buffer.from(viaEager.buffer))).toBe(true);
    }
  });

  it('the model’s nodeM and the per-pixel computation read every node, filled on first read', () => {
    const model = photoToneModel(composeLook(spectra), table);
    const eager = eagerModel();
    const rnd = random(8);
    for (let j = 0; j < 200; j++) {
      const [r, g, b] = [rnd(), rnd(), rnd()];
      expect(pixelStops(model, r, g, b)).toBe(pixelStops(eager, r, g, b));
    }
    expect(model.nodes!.complete).toBe(true);
    expect(Buffer.from(model.nodeM.buffer).equals(Buffer.from(eager.nodeM.buffer))).toBe(true);
    expect(filledColours(exactColours(model, 8)).nodes).toBe(null);
  });

  it('a small render through the server computes only some nodes, and gives the eager render’s bytes', async () => {
    const img = smallImage();
    const png = await sharp(img.rgb, { raw: { width: img.width, height: img.height, channels: 3 } }).png().toBuffer();
    const model = photoToneModel(composeLook(spectra), table);
    const lazy = await renderGrey({ input: png, bitDepth: 8, hasProfile: false, table: () => buildRenderTable(model, 8, 8) }, 8);
    expect(model.nodes!.complete).toBe(false);
    const eager = await renderGrey({ input: png, bitDepth: 8, hasProfile: false, table: () => buildRenderTable(eagerModel(), 8, 8) }, 8);
    expect(Buffer.from(lazy.grey.buffer).equals(Buffer.from(eager.grey.buffer))).toBe(true);
  });
});
