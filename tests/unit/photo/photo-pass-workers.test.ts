import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, describe, expect, it } from 'vitest';
import { applyExactLut, exactLut } from '../../../shared/photo/exact-lut';
import { composeLook } from '../../../shared/look/compose-look';
import { photoToneModel } from '../../../shared/photo/look-photo-model';
import { nodeExposures } from '../../../shared/spectral/node-spectra';
import { encodeUpsampleTable } from '../../../shared/spectral/upsample-table';
import { buildRenderTable, decodeSrgb, encodeGrey, mainThreadRenders, renderGrey, renderPhoto, type RenderTable } from '../../../server/services/photo-render';
import { PARALLEL_MIN_PIXELS, passPool } from '../../../server/services/photo-pass-pool';
import { getUpsampleTable, upsampleCacheFile } from '../../../server/services/upsample-table';
import { random, upsampleTable } from '../spectral/fixtures';
import { cyanPanchromaticLook } from './fixtures';

/**
 * Issue 15, item 2: the whole pass of a render runs in the render workers (server/services/photo-pass-pool.ts),
 * never on the main thread, so the API keeps answering during a render; the workers decode, write each grey
 * code over its own pixel and encode. The output stays the engine's, byte for byte (tolerance: none): every
 * render here is compared with the same look's exact table applied on this thread to the same decoded
 * pixels, and with sharp's encoding of those codes.
 */
const look = () => photoToneModel(composeLook(cyanPanchromaticLook()), upsampleTable());

/** A photo-like test image (smooth gradients with some grain), PNG. */
async function testImage(width: number, height: number, seed: number): Promise<Buffer> {
  const rnd = random(seed);
  const rgb = new Uint8Array(width * height * 3);
  for (let y = 0, i = 0; y < height; y++) {
    for (let x = 0; x < width; x++, i += 3) {
      const grain = () => Math.floor(rnd() * 9) - 4;
      const clamp = (v: number) => (v < 0 ? 0 : v > 255 ? 255 : v);
      rgb[i] = clamp(Math.round((x * 255) / (width - 1)) + grain());
      rgb[i + 1] = clamp(Math.round((y * 255) / (height - 1)) + grain());
      rgb[i + 2] = clamp(((x >> 3) + (y >> 3)) & 255);
    }
  }
  return sharp(rgb, { raw: { width, height, channels: 3 } }).png({ compressionLevel: 1 }).toBuffer();
}

/** The engine's grey codes of a photo, computed on this thread: the exact table over the decoded pixels. */
async function reference(png: Buffer, bits: 8 | 16): Promise<Uint8Array | Uint16Array> {
  const { data, info } = await decodeSrgb(png, 8, false);
  const n = info.width * info.height;
  const lut = exactLut(bits === 8 ? new Uint16Array(1 << 24) : new Uint32Array(1 << 24), look(), bits);
  const out = bits === 8 ? new Uint8Array(n) : new Uint16Array(n);
  applyExactLut(lut, data, 3, out, 0, n);
  return out;
}

const same = (a: Uint8Array | Uint16Array, b: Uint8Array | Uint16Array) =>
  a.length === b.length && Buffer.from(a.buffer, a.byteOffset, a.byteLength).equals(Buffer.from(b.buffer, b.byteOffset, b.byteLength));

describe('renders in the render workers', () => {
  it('small and large photos, 8- and 16-bit output: no pass on the main thread, the engine’s codes byte for byte', async () => {
    const small = await testImage(300, 200, 1);
    const side = Math.ceil(Math.sqrt(PARALLEL_MIN_PIXELS)) + 8; // large: split between both workers
    const large = await testImage(side, side, 2);
    for (const [name, png] of [['small', small], ['large', large]] as const) {
      for (const bits of [8, 16] as const) {
        const before = { main: mainThreadRenders.count, runs: passPool.runs };
        const r = await renderGrey({ input: png, bitDepth: 8, hasProfile: false, table: (ib, ob) => buildRenderTable(look(), ib, ob) }, bits);
        expect(mainThreadRenders.count, `${name} ${bits}-bit: no pass on the main thread`).toBe(before.main);
        expect(passPool.runs - before.runs, `${name} ${bits}-bit: passes in the workers`).toBe(name === 'large' ? 2 : 1);
        expect(same(r.grey, await reference(png, bits)), `${name} ${bits}-bit`).toBe(true);
      }
    }
  });

  it('encodes in the lead worker exactly as the main thread’s encoder does (JPEG and 16-bit PNG)', async () => {
    const png = await testImage(320, 240, 3);
    for (const format of ['jpeg', 'png16'] as const) {
      const before = mainThreadRenders.count;
      const r = await renderPhoto({ input: png, bitDepth: 8, hasProfile: false, format, table: (ib, ob) => buildRenderTable(look(), ib, ob) });
      expect(mainThreadRenders.count).toBe(before);
      const expected = await encodeGrey(await reference(png, format === 'jpeg' ? 8 : 16), 320, 240, format);
      expect(r.data.equals(expected), format).toBe(true);
      expect(r.mime).toBe(format === 'jpeg' ? 'image/jpeg' : 'image/png');
    }
  });

  it('16-bit photos (the 65³ plan) render in the workers too', async () => {
    const rnd = random(4);
    const rgb16 = new Uint16Array(200 * 150 * 3).map(() => Math.floor(rnd() * 65536));
    const png = await sharp(Buffer.from(rgb16.buffer), { raw: { width: 200, height: 150, channels: 3 } }).toColourspace('rgb16').png().toBuffer();
    const before = mainThreadRenders.count;
    const r = await renderGrey({ input: png, bitDepth: 16, hasProfile: false, table: (ib, ob) => buildRenderTable(look(), ib, ob) }, 16);
    expect(mainThreadRenders.count).toBe(before);
    expect(r.grey.length).toBe(200 * 150);
  });

  it('renders of one look at the same time keep its sparse table consistent (each pass after the other)', async () => {
    const pngs = await Promise.all([5, 6, 7, 8].map((seed) => testImage(240, 160, seed)));
    const table = await buildRenderTable(look(), 8, 8);
    const together = await Promise.all(pngs.map((png) => renderGrey({ input: png, bitDepth: 8, hasProfile: false, table: () => table }, 8)));
    for (let i = 0; i < pngs.length; i++) expect(same(together[i].grey, await reference(pngs[i], 8)), `photo ${i}`).toBe(true);
    expect((table as Extract<RenderTable, { kind: 'exact8' }>).sparse?.used).toBeGreaterThan(64);
  });

  it('when no render worker can run, the main thread renders the same bytes', async () => {
    const png = await testImage(300, 200, 10);
    Object.defineProperty(passPool, 'available', { get: () => false, configurable: true });
    try {
      const before = mainThreadRenders.count;
      const r = await renderGrey({ input: png, bitDepth: 8, hasProfile: false, table: (ib, ob) => buildRenderTable(look(), ib, ob) }, 8);
      expect(mainThreadRenders.count).toBe(before + 1);
      expect(same(r.grey, await reference(png, 8))).toBe(true);
    } finally {
      delete (passPool as { available?: boolean }).available;
    }
    expect(passPool.available).toBe(true);
  });

  it('the workers fill every node’s exposure for a large render with the same bits as the engine', async () => {
    const side = Math.ceil(Math.sqrt(PARALLEL_MIN_PIXELS)) + 8;
    const model = look();
    const table = (await buildRenderTable(model, 8, 8)) as Extract<RenderTable, { kind: 'exact8' }>;
    await renderGrey({ input: await testImage(side, side, 9), bitDepth: 8, hasProfile: false, table: () => table }, 8);
    const eager = nodeExposures(upsampleTable().spectra, composeLook(cyanPanchromaticLook()).path.mediumWeights);
    expect(table.lut).not.toBe(null);
    expect(Buffer.from(table.lut!.nodeM.buffer, table.lut!.nodeM.byteOffset, table.lut!.nodeM.byteLength).equals(Buffer.from(eager.buffer))).toBe(true);
  });
});

describe('the upsampling table in the server', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-upsample-'));
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

  it('is held once, in shared memory: the spectra are a view on the cache file’s bytes (no copy)', async () => {
    const file = upsampleCacheFile(dir);
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, encodeUpsampleTable(upsampleTable()));
    const table = await getUpsampleTable(dir);
    expect(table.spectra.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(table.spectra.buffer.byteLength).toBe(fs.statSync(file).size);
    expect(Buffer.from(table.spectra.buffer, table.spectra.byteOffset, table.spectra.byteLength).equals(Buffer.from(upsampleTable().spectra.buffer))).toBe(true);
  });
});
