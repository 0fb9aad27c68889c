/**
 * One composition of a look: a swatch of a colour on a board and a photo pixel of the same colour get the
 * same grey. Flat images of a few colours are rendered by the server's own full-resolution path (sharp
 * decode, the look's exact 8-bit table, one grey code a pixel) and compared with the board's tones of
 * swatches of the same hex colours (server/modules/tones: the estimate, the light path, the key, the
 * tone pipeline, the output rounding), through looks with a key swatch, gels and lens filters.
 * Expected: identical codes (tolerance 0), and identical stops to rounding (1e-9 stop).
 */
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { composeLook, type LookSpectra } from '../../../shared/look/compose-look';
import { photoToneModel } from '../../../shared/photo/look-photo-model';
import { pixelStops } from '../../../shared/photo/look-photo-model';
import { resolveFilter, resolveLight, resolveMedium } from '../../../shared/spectral/compute';
import { srgbDecode } from '../../../shared/spectral/colour';
import { lookTones } from '../../../server/modules/tones/board-tones';
import { swatchSpectrum } from '../../../server/modules/tones/swatch-spectra';
import { buildRenderTable, renderGrey } from '../../../server/services/photo-render';
import { upsampleTable } from '../spectral/fixtures';

const TOL_CODES = 0;
const TOL_STOPS = 1e-9;

const COLOURS = ['#b3262e', '#d9a38c', '#2f5d8a', '#6b8e23', '#808080', '#f2e6c9', '#1a1a1a', '#ffcc00'];
const tone = { developmentStops: 0, ratingStops: 0, printGrade: 2, printExposureStops: 0, shadowDetailStops: null, highlightRollOffStops: null, keyZone: 5 };

function looks(): LookSpectra[] {
  const table = upsampleTable();
  return [
    { bareLight: resolveLight({ id: 'tungsten-3200' }), filters: [{ spectrum: resolveFilter({ id: 'cyan-530' }), on: 'lens' }], medium: resolveMedium({ id: 'panchromatic' }), mediumToneId: 'medium.panchromatic', tone, key: null },
    {
      bareLight: resolveLight({ id: 'd65' }),
      filters: [{ spectrum: resolveFilter({ id: 'yellow-490' }), on: 'light' }, { spectrum: resolveFilter({ id: 'red-590' }), on: 'lens' }],
      medium: resolveMedium({ id: 'orthochromatic' }),
      mediumToneId: 'medium.orthochromatic',
      tone: { ...tone, keyZone: 6, printGrade: 3 },
      key: swatchSpectrum({ hex: '#d9a38c', reflectance: null }, table).reflectance,
    },
  ];
}

describe('a board and a photo agree', () => {
  it.each(looks().map((l, i) => [i, l] as const))('look %i: every flat colour renders to the board’s grey', async (_i, spectra) => {
    const table = upsampleTable();
    const look = composeLook(spectra);
    const swatches = COLOURS.map((hex, id) => ({ id, name: hex, ...swatchSpectrum({ hex, reflectance: null }, table) }));
    const board = lookTones({ id: 1, name: 'look', resolved: null as never, composed: look }, swatches, 0, Infinity).tones;
    const model = photoToneModel(look, table);
    for (const [i, hex] of COLOURS.entries()) {
      const png = await sharp({ create: { width: 16, height: 8, channels: 3, background: hex } }).png().toBuffer();
      const photo = await renderGrey({ input: png, bitDepth: 8, hasProfile: false, table: (ib, ob) => buildRenderTable(model, ib, ob) }, 8);
      expect(new Set(photo.grey).size).toBe(1);
      expect(Math.abs(photo.grey[0] - board[i].grey), hex).toBeLessThanOrEqual(TOL_CODES);
      const [r, g, b] = [1, 3, 5].map((k) => srgbDecode(parseInt(hex.slice(k, k + 2), 16) / 255));
      expect(Math.abs(pixelStops(model, r, g, b) + look.offsetStops - board[i].stops), hex).toBeLessThan(TOL_STOPS);
    }
  });
});
