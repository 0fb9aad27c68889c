import { describe, expect, it } from 'vitest';
import { prepareLightPath, resolveLightPath, simulateSwatches, type LightPath } from '../../../shared/spectral/compute';
import { srgbToLinear, type Rgb3 } from '../../../shared/spectral/colour';
import { reflectanceFromLab, reflectanceFromSrgb } from '../../../shared/spectral/estimate';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { cieIlluminant } from '../../../shared/spectral/lights';
import { blendedReflectance } from '../../../shared/spectral/node-spectra';
import { eyeMedium } from '../../../shared/spectral/media';
import { fitCoefficients, sigmoid, xyzOfCoefficients } from '../../../shared/spectral/upsample';
import { decodeUpsampleTable, encodeUpsampleTable, lookupCoefficients, UPSAMPLE_METHOD } from '../../../shared/spectral/upsample-table';
import { upsampleTable } from './fixtures';

/** Default tolerance of this file. */
const TOL = 1e-6;

describe('the sigmoid-quadratic model (Jakob & Hanika 2019)', () => {
  it('maps any polynomial value into (0, 1)', () => {
    expect(sigmoid(0)).toBe(0.5);
    expect(sigmoid(1e6)).toBeLessThanOrEqual(1);
    expect(sigmoid(-1e6)).toBeGreaterThanOrEqual(0);
  });
  it('fits a colour to within 1e-6 ΔE*ab', () => {
    const target: [number, number, number] = [30, 25, 10];
    const { coefficients, residual } = fitCoefficients(target);
    expect(residual).toBeLessThan(TOL);
    xyzOfCoefficients(coefficients).forEach((v, i) => expect(Math.abs(v - target[i])).toBeLessThan(1e-4));
  });
});

describe('the coefficient table', () => {
  const table = upsampleTable();
  it('has the documented resolution and round-trips through its binary form', () => {
    expect(table.resolution).toBe(UPSAMPLE_METHOD.resolution);
    const bytes = encodeUpsampleTable(table);
    expect(bytes.byteLength).toBe(12 + 4 * (table.resolution + 9 * table.resolution ** 3));
    const back = decodeUpsampleTable(bytes);
    expect(back.coefficients).toEqual(table.coefficients);
    expect(back.zNodes).toEqual(table.zNodes);
  });
  it('refuses damaged or stale bytes', () => {
    const bytes = encodeUpsampleTable(table);
    expect(() => decodeUpsampleTable(bytes.slice(0, 100))).toThrow(/size/);
    expect(() => decodeUpsampleTable(bytes, UPSAMPLE_METHOD.version + 1)).toThrow(/version/);
    const bad = bytes.slice();
    bad[0] = 0;
    expect(() => decodeUpsampleTable(bad)).toThrow(/magic/);
  });
  it('returns the node coefficients at a node colour', () => {
    const R = table.resolution;
    const zi = 20;
    const z = table.zNodes[zi];
    const xi = 5;
    const yi = 9;
    const c = lookupCoefficients(table, z, (xi / (R - 1)) * z, (yi / (R - 1)) * z); // slice l = 0 (red largest)
    const at = (((0 * R + zi) * R + yi) * R + xi) * 3;
    for (let k = 0; k < 3; k++) expect(Math.abs(c[k] - table.coefficients[at + k])).toBeLessThanOrEqual(1e-4 * Math.max(1, Math.abs(c[k])));
  });
});

describe('estimated reflectances', () => {
  const table = upsampleTable();
  it('stay within 0..1 and are smooth', () => {
    for (const hex of ['#000000', '#ffffff', '#ff0000', '#00ff00', '#0000ff', '#8a5a44']) {
      const r = reflectanceFromSrgb(hex, table).values;
      for (const v of r) expect(v >= 0 && v <= 1).toBe(true);
    }
  });
  it('refuse a bad hex and an out-of-gamut L*a*b*', () => {
    expect(() => reflectanceFromSrgb('#12345', table)).toThrow(SpectralInputError);
    expect(() => reflectanceFromLab([50, 120, 0], table)).toThrow(/outside the sRGB gamut/);
    expect(() => reflectanceFromLab([50, 10, 10], table)).not.toThrow();
  });
});

describe('the blended node spectra (node-spectra.ts, what photos use)', () => {
  const table = upsampleTable();
  const lightPath = resolveLightPath({ light: { cie: 'D65' }, filters: [{ id: 'red-590' }], medium: { id: 'panchromatic' } });
  const exposureOf = (s: LightPath, rgb: Rgb3) => simulateSwatches(s, [{ name: 'n', reflectance: blendedReflectance(table, rgb), estimated: true }]).swatches[0].exposure;

  it('read greys as themselves (opened up by the filter factor)', () => {
    for (let i = 0; i <= 8; i++) expect(Math.abs(exposureOf(lightPath, [i / 8, i / 8, i / 8]) - i / 8)).toBeLessThan(2e-3);
  });
  it('agree with the single-colour estimate to a small fraction of a stop', () => {
    for (const hex of ['#b01c2e', '#2e6b3a', '#3050a0', '#d8b090']) {
      const single = simulateSwatches(lightPath, [{ name: hex, reflectance: reflectanceFromSrgb(hex, table), estimated: true }]).swatches[0].exposure;
      const rgb = srgbToLinear([parseInt(hex.slice(1, 3), 16) / 255, parseInt(hex.slice(3, 5), 16) / 255, parseInt(hex.slice(5, 7), 16) / 255]);
      expect(Math.abs(Math.log2(exposureOf(lightPath, rgb) / single))).toBeLessThan(0.1);
    }
  });
  it('under the eye medium give luminance Y/100', () => {
    const eye = prepareLightPath({ light: cieIlluminant('D65'), medium: eyeMedium() });
    expect(Math.abs(exposureOf(eye, [1, 0, 0]) - 0.2126390058715102)).toBeLessThan(1e-4); // linear red: Y = 0.2126 (IEC 61966-2-1)
  });
});
