import { describe, expect, it } from 'vitest';
import { composeLook, type LookSpectra } from '../../../shared/look/compose-look';
import { buildPhotoLut, photoToneModel } from '../../../shared/photo/look-photo-model';
import { previewGpuTable, previewLook, previewStopsLut, type PreviewToneCache } from '../../../shared/photo/preview-lut';
import { resolveFilter, resolveLight } from '../../../shared/spectral/compute';
import { reflectanceFromSrgb } from '../../../shared/spectral/estimate';
import { upsampleTable } from '../spectral/fixtures';
import { cyanPanchromaticLook } from './fixtures';

/**
 * The live preview's table (shared/photo/preview-lut.ts) is the engine's photo table of the same look and
 * size, bit for bit, whether its node exposures are computed lazily (a moving slider's small table) or all
 * at once (the resting table), and whether its tone table was kept from an earlier edit or composed afresh.
 * Tolerance: none, except the GPU form's 16-bit rounding (half a code of 65,535).
 */
const cyan = (cutOffNm?: number): LookSpectra => {
  const s = cyanPanchromaticLook();
  return cutOffNm === undefined ? s : { ...s, filters: [{ spectrum: resolveFilter({ shortPass: { cutOffNm, slopeNm: 20 } }), on: 'lens' }] };
};

function engineLut(s: LookSpectra, size: number) {
  const look = composeLook(s);
  return { lut: buildPhotoLut(photoToneModel(look, upsampleTable()), size), tone: look.toneTable };
}

describe('preview table', () => {
  it('equals the engine’s photo table, lazily (small) and all at once (full)', () => {
    const table = upsampleTable();
    for (const [size, eager] of [[13, false], [17, false], [33, true], [17, true]] as const) {
      const s = cyan(560);
      const mine = previewStopsLut(table, previewLook(s, table, new Map()).nodes, size, eager);
      expect(Buffer.from(mine.stops.buffer).equals(Buffer.from(engineLut(s, size).lut.stops.buffer))).toBe(true);
    }
  });

  it('keeps a key-less look’s tone across edits of the light and filters, and composes a keyed look’s afresh', () => {
    const table = upsampleTable();
    const cache: PreviewToneCache = new Map();
    const a = previewLook(cyan(540), table, cache);
    const b = previewLook({ ...cyan(620), bareLight: resolveLight({ blackbody: 2800 }) }, table, cache);
    expect(b.tone).toBe(a.tone);
    expect(Array.from(b.tone.grey)).toEqual(Array.from(engineLut(cyan(620), 5).tone.grey));
    expect(b.tone.offsetStops).toBe(engineLut(cyan(620), 5).tone.offsetStops);
    // a key swatch's place moves with the light path: never from the cache
    const keyed = (nm: number): LookSpectra => ({ ...cyan(nm), key: reflectanceFromSrgb([0.7, 0.3, 0.2], table) });
    const k1 = previewLook(keyed(540), table, cache);
    const k2 = previewLook(keyed(640), table, cache);
    expect(k2.tone).not.toBe(k1.tone);
    expect(k1.tone.offsetStops).not.toBe(k2.tone.offsetStops);
    expect(k2.tone.offsetStops).toBe(engineLut(keyed(640), 5).tone.offsetStops);
  });

  it('encodes grey and stops as 16-bit codes the GPU decodes as (256·hi + lo) / 257', () => {
    const table = upsampleTable();
    const look = previewLook(cyan(), table, new Map());
    const lut = previewStopsLut(table, look.nodes, 9, false);
    const { gpu, grey } = previewGpuTable(lut, look.tone);
    const range = gpu.stopsMax - gpu.stopsMin;
    for (let i = 0; i < grey.length; i++) {
      const g = (256 * (gpu.grey[2 * i] / 255) + gpu.grey[2 * i + 1] / 255) / 257;
      const s = gpu.stopsMin + ((256 * (gpu.stops[2 * i] / 255) + gpu.stops[2 * i + 1] / 255) / 257) * range;
      expect(Math.abs(g - grey[i])).toBeLessThanOrEqual(0.5 / 65535 + 1e-9);
      expect(Math.abs(s - lut.stops[i])).toBeLessThanOrEqual((0.5 / 65535) * range + 1e-9);
    }
  });
});
