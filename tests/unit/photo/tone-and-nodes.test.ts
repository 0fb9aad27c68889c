import { describe, expect, it } from 'vitest';
import { greyOfStops, toneCurveTable, TONE_TABLE_STOPS, zoneOfStops } from '../../../shared/photo/tone-curve-table';
import { nodeExposuresFrom, nodeReflectances } from '../../../shared/photo/node-reflectances';
import { photoLook, photoLookFingerprint, type PhotoLookSpectra } from '../../../shared/photo/compose-look';
import { buildTonePipeline } from '../../../shared/tone/tone-pipeline';
import { nodeExposures } from '../../../shared/spectral/lut';
import { resolveFilter, resolveLight, resolveMedium, resolveStack, simulateSwatches } from '../../../shared/spectral/compute';
import { keyOffsetStops } from '../../../shared/tone/zones';
import { constantSpectrum } from '../../../shared/spectral/spectrum';
import { upsampleTable } from '../spectral/fixtures';

/** Shared default tolerance (relative or absolute, as each check says): the photo module's own claims. */
const TOL = 1e-5;

const tone = { developmentStops: 0, ratingStops: 0, printGrade: 3, printExposureStops: 0, shadowDetailStops: null, highlightRollOffStops: null, keyZone: 5 };
const spectra = (cutOnNm = 590, key: PhotoLookSpectra['key'] = null): PhotoLookSpectra => ({
  bareLight: resolveLight({ id: 'tungsten-3200' }),
  filters: [{ spectrum: resolveFilter({ longPass: { cutOnNm } }), on: 'lens' }],
  medium: resolveMedium({ id: 'panchromatic' }),
  mediumToneId: 'medium.panchromatic',
  tone,
  key,
});

describe('the tabulated tone curve', () => {
  it('follows the tone pipeline within 1e-5 (its header’s bound) between samples', () => {
    const pipe = buildTonePipeline({ mediumId: 'medium.panchromatic', settings: tone, offsetStops: 0.7 });
    const t = toneCurveTable(pipe);
    for (let s = TONE_TABLE_STOPS[0] + 0.003; s < TONE_TABLE_STOPS[1]; s += 0.0371) expect(Math.abs(greyOfStops(t, s) - pipe.renderStops(s).srgb)).toBeLessThan(TOL);
    expect(t.offsetStops).toBeCloseTo(0.7, 9);
    expect(zoneOfStops(t, 0)).toBeCloseTo(5.7, 9);
  });
});

describe('node spectra kept for many looks', () => {
  it('give the node exposures of shared/spectral/lut.ts', () => {
    const table = upsampleTable();
    const stack = resolveStack({ light: { id: 'd65' }, filters: [{ id: 'orange-550' }], medium: { id: 'orthochromatic' } });
    const a = nodeExposures(stack, table);
    const b = nodeExposuresFrom(nodeReflectances(table), stack);
    for (let i = 0; i < a.length; i += 97) expect(Math.abs(a[i] - b[i])).toBeLessThan(TOL * Math.max(a[i], 1e-3));
  });
});

describe('a look for photos', () => {
  it('places a key swatch on its zone (keyOffsetStops of the key’s stops)', () => {
    const key = constantSpectrum(0.36);
    const look = photoLook({ ...spectra(590, key), tone: { ...tone, keyZone: 6 } }, upsampleTable());
    const keyStops = simulateSwatches(look.stack, [{ name: 'k', reflectance: key, estimated: false }]).swatches[0].stops;
    expect(look.offsetStops).toBeCloseTo(keyOffsetStops(keyStops, 6), 9);
  });

  it('has a fingerprint that changes with the content only', () => {
    expect(photoLookFingerprint(spectra())).toBe(photoLookFingerprint(spectra()));
    expect(photoLookFingerprint(spectra(600))).not.toBe(photoLookFingerprint(spectra()));
  });
});
