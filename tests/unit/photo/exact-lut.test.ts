import { describe, expect, it } from 'vitest';
import { applyExactLut, exactLut } from '../../../shared/photo/exact-lut';
import { outputCodes, MIN_STOPS, STOPS_Q, MAX_Q } from '../../../shared/look/tone-curve-table';
import { composeLook, type LookSpectra } from '../../../shared/look/compose-look';
import { photoToneModel, pixelStops } from '../../../shared/photo/look-photo-model';
import { resolveFilter, resolveLight, resolveMedium } from '../../../shared/spectral/compute';
import { srgbDecode } from '../../../shared/tone/print';
import { random, upsampleTable } from '../spectral/fixtures';

/**
 * The lazy exact table of every 8-bit colour against the engine's per-pixel computation
 * (look-photo-model.ts pixelStops, which calls shared/spectral/upsample-table.ts locateCell and
 * interpolateAtCell), through the same fixed point and output codes.
 * Shared default tolerance: none, the same output code (the table writes the engine's computation out).
 */
const TOL_CODES = 0;

const spectra: LookSpectra = {
  bareLight: resolveLight({ id: 'tungsten-3200' }),
  filters: [{ spectrum: resolveFilter({ longPass: { cutOnNm: 590 } }), on: 'lens' }],
  medium: resolveMedium({ id: 'panchromatic' }),
  mediumToneId: 'medium.panchromatic',
  tone: { developmentStops: 0, ratingStops: 0, printGrade: 3, printExposureStops: 0, shadowDetailStops: null, highlightRollOffStops: null, keyZone: 5 },
  key: null,
};

describe('the lazy exact table', () => {
  const model = photoToneModel(composeLook(spectra), upsampleTable());
  const out16 = outputCodes(model.tone, 16);
  const engineCode = (r: number, g: number, b: number) => {
    const q = Math.min(MAX_Q, Math.max(0, Math.floor((pixelStops(model, srgbDecode(r / 255), srgbDecode(g / 255), srgbDecode(b / 255)) - MIN_STOPS) * STOPS_Q + 0.5)));
    return out16[q];
  };

  it('gives every pixel the engine’s own code, over the whole cube, black and the saturated edges included', () => {
    const rnd = random(21);
    const px: number[] = [];
    for (let i = 0; i < 20000; i++) px.push(Math.floor(rnd() * 256), Math.floor(rnd() * 256), Math.floor(rnd() * 256));
    // the cube's surface: black, white, the primaries' ramps and codes 0/255 on one channel
    for (let c = 0; c < 256; c += 3) px.push(c, 0, 0, 0, c, 0, 0, 0, c, c, c, c, 255, c, 0, 0, 255, c, c, 1, 2);
    const src = Uint8Array.from(px);
    const n = src.length / 3;
    const lut = exactLut(new Uint32Array(1 << 24), model, 16);
    const dst = new Uint16Array(n);
    // in two ranges with an odd start (the byte-by-byte path and the 32-bit reads both run)
    applyExactLut(lut, src, 3, dst, 0, 4001);
    applyExactLut(lut, src, 3, dst, 4001, n);
    let worst = 0;
    for (let j = 0; j < n; j++) worst = Math.max(worst, Math.abs(dst[j] - engineCode(src[3 * j], src[3 * j + 1], src[3 * j + 2])));
    expect(worst).toBeLessThanOrEqual(TOL_CODES);
    // a second pass reads what the first one wrote: the same codes
    const again = new Uint16Array(n);
    applyExactLut(lut, src, 3, again, 0, n);
    expect(Array.from(again)).toEqual(Array.from(dst));
  });

  it('8-bit output is the 16-bit code to 8 bits, and RGBA input ignores alpha', () => {
    const rgba = Uint8Array.from([0, 0, 0, 9, 255, 255, 255, 9, 12, 200, 40, 9, 250, 3, 3, 9]);
    const o8 = new Uint8Array(4);
    applyExactLut(exactLut(new Uint16Array(1 << 24), model, 8), rgba, 4, o8, 0, 4);
    const out8 = outputCodes(model.tone, 8);
    const codes8 = [0, 1, 2, 3].map((j) => {
      const q = Math.min(MAX_Q, Math.max(0, Math.floor((pixelStops(model, srgbDecode(rgba[4 * j] / 255), srgbDecode(rgba[4 * j + 1] / 255), srgbDecode(rgba[4 * j + 2] / 255)) - MIN_STOPS) * STOPS_Q + 0.5)));
      return out8[q];
    });
    expect(Array.from(o8)).toEqual(codes8);
  });
});
