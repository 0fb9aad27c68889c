import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { applyExactLut, applyExactSparse, exactColours, exactLut, sparseColours } from '../../../shared/photo/exact-lut';
import { composeLook, type LookSpectra } from '../../../shared/look/compose-look';
import { photoToneModel } from '../../../shared/photo/look-photo-model';
import { buildRenderTable, renderGrey, type RenderTable } from '../../../server/services/photo-render';
import { random, upsampleTable } from '../spectral/fixtures';
import { cyanPanchromaticLook } from './fixtures';

/**
 * Small images skip the full 2²⁴ table (exact-lut.ts applyExactSparse, photo-render.ts SMALL_IMAGE_PIXELS):
 * the sparse table must give byte for byte what the full one gives, for every pixel, so a small render is
 * the same render. Tolerance: none (both call the same per-colour computation, exactCode).
 */
const spectra: LookSpectra = cyanPanchromaticLook();

/** Test images, interleaved RGB: random colours (the cube's surface included), a gradient, one flat colour. */
function images(): Record<string, { width: number; height: number; rgb: Uint8Array }> {
  const rnd = random(15);
  const w = 160;
  const h = 125; // 20,000 pixels
  const noise = new Uint8Array(w * h * 3);
  for (let i = 0; i < noise.length; i++) noise[i] = Math.floor(rnd() * 256);
  for (let c = 0; c < 256; c++) noise.set([c, 0, 0, 0, c, 255, 255, c, 0, c, c, c], c * 12);
  const gradient = new Uint8Array(w * h * 3);
  for (let y = 0, i = 0; y < h; y++) for (let x = 0; x < w; x++, i += 3) gradient.set([Math.round((x * 255) / (w - 1)), Math.round((y * 255) / (h - 1)), (x + y) & 255], i);
  const flat = new Uint8Array(w * h * 3);
  for (let i = 0; i < flat.length; i += 3) flat.set([179, 38, 46], i);
  return { noise: { width: w, height: h, rgb: noise }, gradient: { width: w, height: h, rgb: gradient }, flat: { width: w, height: h, rgb: flat } };
}

describe('the sparse table of small images', () => {
  const model = photoToneModel(composeLook(spectra), upsampleTable());

  it.each([8, 16] as const)('gives the table’s codes byte for byte on random colours, a gradient and a flat image (%i-bit out)', (bits) => {
    const lut = exactLut(bits === 8 ? new Uint16Array(1 << 24) : new Uint32Array(1 << 24), model, bits);
    const colours = exactColours(model, bits);
    // one sparse table over all three images: the random colours fill more blocks than it starts with, so it grows on the way
    const sparse = sparseColours(bits);
    const startEntries = sparse.codes.length;
    for (const [name, img] of Object.entries(images())) {
      const n = img.width * img.height;
      const fromTable = bits === 8 ? new Uint8Array(n) : new Uint16Array(n);
      const fromSparse = bits === 8 ? new Uint8Array(n) : new Uint16Array(n);
      applyExactLut(lut, img.rgb, 3, fromTable, 0, n);
      // in two ranges with an odd split, as the renderer's chunks may fall
      applyExactSparse(colours, sparse, img.rgb, 3, fromSparse, 0, 777);
      applyExactSparse(colours, sparse, img.rgb, 3, fromSparse, 777, n);
      expect(Buffer.from(fromSparse.buffer).equals(Buffer.from(fromTable.buffer)), name).toBe(true);
    }
    expect(sparse.codes.length).toBeGreaterThan(startEntries);
    expect(sparse.used).toBeLessThanOrEqual(sparse.codes.length);
  });

  it('RGBA input ignores alpha, as the table does', () => {
    const rgba = Uint8Array.from([0, 0, 0, 9, 255, 255, 255, 0, 12, 200, 40, 255, 12, 200, 40, 1]);
    const a = new Uint8Array(4);
    const b = new Uint8Array(4);
    applyExactLut(exactLut(new Uint16Array(1 << 24), model, 8), rgba, 4, a, 0, 4);
    applyExactSparse(exactColours(model, 8), sparseColours(8), rgba, 4, b, 0, 4);
    expect(Array.from(b)).toEqual(Array.from(a));
  });

  it('a small render allocates no 2²⁴ table and equals the render through the table, pixel for pixel', async () => {
    for (const [name, img] of Object.entries(images())) {
      const png = await sharp(img.rgb, { raw: { width: img.width, height: img.height, channels: 3 } }).png().toBuffer();
      for (const bits of [8, 16] as const) {
        const small = await buildRenderTable(model, 8, bits);
        const viaSparse = await renderGrey({ input: png, bitDepth: 8, hasProfile: false, table: () => small }, bits);
        expect(small.kind === 'exact8' && small.lut, `${name}: no table allocated`).toBe(null);
        expect(small.kind === 'exact8' && small.sparse?.used, `${name}: its colours kept with the look`).toBeGreaterThan(64);
        // the same look whose table an earlier large render allocated: the small render then reads the table
        const withTable = (await buildRenderTable(model, 8, bits)) as Extract<RenderTable, { kind: 'exact8' }>;
        withTable.lut = exactLut(bits === 8 ? new Uint16Array(1 << 24) : new Uint32Array(1 << 24), model, bits);
        const viaTable = await renderGrey({ input: png, bitDepth: 8, hasProfile: false, table: () => withTable }, bits);
        expect(withTable.sparse, `${name}: no sparse table beside a full one`).toBe(null);
        expect(viaSparse.grey.length).toBe(img.width * img.height);
        expect(Buffer.from(viaSparse.grey.buffer).equals(Buffer.from(viaTable.grey.buffer)), `${name} ${bits}-bit`).toBe(true);
        // a second small render through the kept sparse table: the same again
        const again = await renderGrey({ input: png, bitDepth: 8, hasProfile: false, table: () => small }, bits);
        expect(Buffer.from(again.grey.buffer).equals(Buffer.from(viaSparse.grey.buffer)), `${name} again`).toBe(true);
      }
    }
  });
});
