import { describe, expect, it } from 'vitest';
import { greyOfStops, toneCurveTable, TONE_TABLE_STOPS, zoneOfStops } from '../../../shared/look/tone-curve-table';
import { blendedReflectance, nodeExposures, nodeReflectances } from '../../../shared/spectral/node-spectra';
import { composeLook, lookFingerprint, type LookSpectra } from '../../../shared/look/compose-look';
import { buildTonePipeline } from '../../../shared/tone/tone-pipeline';
import { resolveFilter, resolveLight, resolveMedium, resolveLightPath, simulateSwatches } from '../../../shared/spectral/compute';
import { makeSpectrum } from '../../../shared/spectral/spectrum';
import { ESTIMATE_SIZE, estimateToGrid } from '../../../shared/spectral/policy';
import { keyOffsetStops } from '../../../shared/tone/zones';
import { constantSpectrum } from '../../../shared/spectral/spectrum';
import { upsampleTable } from '../spectral/fixtures';
import { pixelExposure } from '../../../shared/photo/look-photo-model';

/** Shared default tolerance (relative or absolute, as each check says): the photo module's own claims. */
const TOL = 1e-5;

const tone = { developmentStops: 0, ratingStops: 0, printGrade: 3, printExposureStops: 0, shadowDetailStops: null, highlightRollOffStops: null, keyZone: 5 };
const spectra = (cutOnNm = 590, key: LookSpectra['key'] = null): LookSpectra => ({
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
  it('are the table’s node spectra, and give their exposures', () => {
    const table = upsampleTable();
    const lightPath = resolveLightPath({ light: { id: 'd65' }, filters: [{ id: 'orange-550' }], medium: { id: 'orthochromatic' } });
    const refl = nodeReflectances(table);
    expect(nodeReflectances(table)).toBe(refl); // computed once per table
    const m = nodeExposures(refl, lightPath.mediumWeights);
    // nodes are tabulated on the estimate's grid (111 samples, 5 nm) and reach the working grid linearly (policy.ts)
    const n = table.spectra.length / ESTIMATE_SIZE;
    for (let k = 0; k < n; k += 997) {
      const rho = makeSpectrum(estimateToGrid(table.spectra.subarray(ESTIMATE_SIZE * k, ESTIMATE_SIZE * (k + 1))));
      const direct = simulateSwatches(lightPath, [{ name: 'node', reflectance: rho, estimated: true }]).swatches[0].exposure;
      expect(Math.abs(m[k] - direct)).toBeLessThan(TOL * Math.max(direct, 1e-3));
    }
  });

  it('blend into a colour’s estimate whose exposure is the same blend of node exposures', () => {
    const table = upsampleTable();
    const lightPath = resolveLightPath({ light: { id: 'tungsten-3200' }, filters: [{ id: 'red-590' }], medium: { id: 'panchromatic' } });
    const m = nodeExposures(nodeReflectances(table), lightPath.mediumWeights);
    const model = { upsample: table, nodeM: m };
    for (const rgb of [[0.6, 0.2, 0.1], [0.05, 0.3, 0.7], [0.5, 0.5, 0.5]] as [number, number, number][]) {
      const viaSpectrum = simulateSwatches(lightPath, [{ name: 'c', reflectance: blendedReflectance(table, rgb), estimated: true }]).swatches[0].exposure;
      expect(Math.abs(pixelExposure(model as never, ...rgb) - viaSpectrum)).toBeLessThan(1e-12);
    }
  });
});

describe('a look for photos', () => {
  it('places a key swatch on its zone (keyOffsetStops of the key’s stops)', () => {
    const key = constantSpectrum(0.36);
    const look = composeLook({ ...spectra(590, key), tone: { ...tone, keyZone: 6 } });
    const keyStops = simulateSwatches(look.path, [{ name: 'k', reflectance: key, estimated: false }]).swatches[0].stops;
    expect(look.offsetStops).toBeCloseTo(keyOffsetStops(keyStops, 6), 9);
  });

  it('has a fingerprint that changes with the content only', () => {
    expect(lookFingerprint(spectra())).toBe(lookFingerprint(spectra()));
    expect(lookFingerprint(spectra(600))).not.toBe(lookFingerprint(spectra()));
  });
});
