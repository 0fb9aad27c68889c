import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { applyExactSparse, exactCode, exactColours, filledColours, sparseColours } from '../../../shared/photo/exact-lut';
import { composeLook } from '../../../shared/look/compose-look';
import { codeOfStops, outputCodes } from '../../../shared/look/tone-curve-table';
import { photoToneModel, pixelStops } from '../../../shared/photo/look-photo-model';
import { lazyNodeExposure, nodeExposures, nodeReflectances } from '../../../shared/spectral/node-spectra';
import { srgbDecode } from '../../../shared/tone/print';
import { buildRenderTable, renderPhoto } from '../../../server/services/photo-render';
import { passPool } from '../../../server/services/photo-pass-pool';
import { random, upsampleTable } from '../spectral/fixtures';
import { cyanPanchromaticLook } from './fixtures';

/**
 * Issue 15, item 2 (small photos at the cost of the image): a small render no longer makes the look's
 * 32,769 output codes (each colour's code is computed from the tone curve with outputCodes's own
 * operations), reads each node's shared flag once per thread (its `seen` copy), computes two or more
 * missing corners of a cell's plane four at a time, and runs its pass and encoding in one job in the lead
 * worker. None of it may change a code: tolerance none, against the engine's per-pixel computation
 * (look-photo-model.ts pixelStops, tone-curve-table.ts codeOfStops).
 */
const model = () => photoToneModel(composeLook(cyanPanchromaticLook()), upsampleTable());

/** Colours over the whole cube: a coarse lattice (black, white and the saturated edges included) and random ones. */
function colours(): number[] {
  const keys: number[] = [];
  const levels = [0, 1, 2, 17, 63, 64, 127, 128, 191, 200, 254, 255];
  for (const r of levels) for (const g of levels) for (const b of levels) keys.push((r << 16) | (g << 8) | b);
  const rnd = random(15);
  for (let i = 0; i < 4000; i++) keys.push(Math.floor(rnd() * (1 << 24)));
  return keys;
}

/** The engine's code of a colour: its stops by the per-pixel computation, through the look's output codes. */
function engineCode(m: ReturnType<typeof model>, key: number, bits: 8 | 16): number {
  const stops = pixelStops(m, srgbDecode((key >> 16) / 255), srgbDecode(((key >> 8) & 255) / 255), srgbDecode((key & 255) / 255));
  return codeOfStops(m.codes(bits), stops);
}

describe('small renders: the same codes by the cheaper paths', () => {
  it('codes computed from the tone curve (no output-code table) are the engine’s, 8 and 16 bits', () => {
    const m = model();
    for (const bits of [8, 16] as const) {
      const lazy = exactColours(m, bits);
      expect(lazy.out).toBeNull();
      const full = filledColours(exactColours(m, bits));
      expect(Array.from(full.out!)).toEqual(Array.from(outputCodes(m.tone, bits)));
      const mask = lazy.flag - 1;
      let mismatches = 0;
      for (const key of colours()) {
        const a = exactCode(lazy, key);
        if (a !== exactCode(full, key) || (a & mask) !== engineCode(m, key, bits)) mismatches++;
      }
      expect(mismatches, `${bits}-bit`).toBe(0);
    }
  });

  it('nodes another thread computed (flags set, this thread’s `seen` not) are read, not lost; partly done planes give the same bits', () => {
    const m = model();
    const c = exactColours(m, 8);
    const nodes = c.nodes!;
    // "another thread": some nodes computed and flagged in `done`, this thread's `seen` left empty
    const rnd = random(7);
    for (let k = 0; k < nodes.done.length; k++) if (rnd() < 0.3) lazyNodeExposure(nodes, k);
    expect(nodes.seen.some((x) => x === 1)).toBe(false);
    const rgb = new Uint8Array(3 * 20000);
    for (let i = 0; i < rgb.length; i++) rgb[i] = Math.floor(rnd() * 256);
    const n = rgb.length / 3;
    const grey = new Uint8Array(n);
    applyExactSparse(c, sparseColours(8), rgb, 3, grey, 0, n);
    const eager = nodeExposures(nodeReflectances(m.upsample), composeLook(cyanPanchromaticLook()).path.mediumWeights);
    let wrongNodes = 0;
    for (let k = 0; k < nodes.done.length; k++) if (nodes.done[k] && !Object.is(nodes.values[k], eager[k])) wrongNodes++;
    expect(wrongNodes).toBe(0);
    let wrongPixels = 0;
    for (let j = 0; j < n; j++) if (grey[j] !== engineCode(m, (rgb[3 * j] << 16) | (rgb[3 * j + 1] << 8) | rgb[3 * j + 2], 8)) wrongPixels++;
    expect(wrongPixels).toBe(0);
  });

  it('a small render in one worker job: an unreadable photo throws the decoder’s error, and the workers go on rendering', async () => {
    const table = await buildRenderTable(model(), 8, 8);
    const bad = Buffer.from('not an image at all, just some bytes');
    await expect(renderPhoto({ input: bad, bitDepth: 8, hasProfile: false, format: 'jpeg', table: () => table })).rejects.toThrow(/unsupported image format|Input buffer/i);
    expect(passPool.available).toBe(true);
    const rgb = new Uint8Array(64 * 48 * 3).map((_, i) => (i * 37) & 255);
    const png = await sharp(rgb, { raw: { width: 64, height: 48, channels: 3 } }).png().toBuffer();
    const runs = passPool.runs;
    const r = await renderPhoto({ input: png, bitDepth: 8, hasProfile: false, format: 'jpeg', table: () => table });
    expect(passPool.runs).toBe(runs + 1);
    expect(r.width).toBe(64);
    expect((await sharp(r.data).metadata()).channels).toBe(1);
  });
});
