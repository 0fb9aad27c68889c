import { describe, expect, it } from 'vitest';
import { prepareLightPath, resolveLightPath, simulateSwatches, type LightPath } from '../../../shared/spectral/compute';
import { srgbToLinear, type Rgb3 } from '../../../shared/spectral/colour';
import { reflectanceFromLab, reflectanceFromSrgb } from '../../../shared/spectral/estimate';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { cieIlluminant } from '../../../shared/spectral/lights';
import { blendedReflectance } from '../../../shared/spectral/node-spectra';
import { eyeMedium } from '../../../shared/spectral/media';
import { lhtss } from '../../../shared/spectral/lhtss';
import { decodeUpsampleTable, encodeUpsampleTable, encodeUpsampleTableCompact, estimateNode, estimateRows, UPSAMPLE_METHOD } from '../../../shared/spectral/upsample-table';
import { ESTIMATE_SIZE, ESTIMATE_STEP_NM, GRID_SIZE, estimateToGrid } from '../../../shared/spectral/policy';
import { upsampleTable } from './fixtures';

/** Default tolerance of this file. */
const TOL = 1e-6;

describe('the smoothest reflectance (LHTSS, Burns 2020)', () => {
  const rows = estimateRows();
  it('reproduces a colour to 1e-9 in XYZ with a reflectance strictly inside (0, 1)', () => {
    const target: [number, number, number] = [30, 25, 10];
    const r = lhtss(rows, target);
    expect(r.converged).toBe(true);
    for (let k = 0; k < 3; k++) expect(Math.abs(rows[k].reduce((s, w, i) => s + w * r.reflectance[i], 0) - target[k])).toBeLessThan(1e-6);
    for (const v of r.reflectance) expect(v > 0 && v < 1).toBe(true);
  });
  it('gives a grey a flat reflectance (the smoothest one there is)', () => {
    const r = estimateNode(rows, [0.2, 0.2, 0.2]).reflectance;
    const spread = Math.max(...r) - Math.min(...r);
    expect(spread).toBeLessThan(2e-3); // the sRGB white and the integrated D65 white differ by about 1e-4 (README)
  });
  it('starts from a neighbour’s solution to the same answer', () => {
    const a = lhtss(rows, [20, 30, 40]);
    const b = lhtss(rows, [20.5, 30, 40.5], a.state);
    const c = lhtss(rows, [20.5, 30, 40.5]);
    for (let i = 0; i < c.reflectance.length; i++) expect(Math.abs(b.reflectance[i] - c.reflectance[i])).toBeLessThan(TOL);
  });
});

describe('the table of node spectra', () => {
  const table = upsampleTable();
  it('has the documented resolution and round-trips through both binary forms', () => {
    expect(table.resolution).toBe(UPSAMPLE_METHOD.resolution);
    const exact = decodeUpsampleTable(encodeUpsampleTable(table));
    expect(exact.zNodes).toEqual(table.zNodes);
    let same = true;
    for (let i = 0; i < table.spectra.length; i++) if (exact.spectra[i] !== table.spectra[i]) same = false;
    expect(same).toBe(true);
    const compact = decodeUpsampleTable(encodeUpsampleTableCompact(table));
    let worst = 0;
    for (let i = 0; i < table.spectra.length; i++) worst = Math.max(worst, Math.abs(compact.spectra[i] - table.spectra[i]));
    expect(worst).toBeLessThanOrEqual(0.5 / 65535 + 1e-9);
  });
  it('refuses damaged or stale bytes', () => {
    const bytes = encodeUpsampleTableCompact(table);
    expect(() => decodeUpsampleTable(bytes.slice(0, 100))).toThrow(/size/);
    expect(() => decodeUpsampleTable(bytes, UPSAMPLE_METHOD.version + 1)).toThrow(/version/);
    const bad = bytes.slice();
    bad[0] = 0;
    expect(() => decodeUpsampleTable(bad)).toThrow(/magic/);
  });
  it('blends to the node’s own spectrum at a node colour', () => {
    const R = table.resolution;
    const zi = 20;
    const z = table.zNodes[zi];
    const xi = 5;
    const yi = 9;
    const r = blendedReflectance(table, [z, (xi / (R - 1)) * z, (yi / (R - 1)) * z]).values; // slice l = 0 (red largest)
    // nodes are tabulated on the estimate's grid (111 samples, 5 nm); the blend is on the working grid (551, 1 nm)
    expect(r).toHaveLength(GRID_SIZE);
    const at = (((0 * R + zi) * R + yi) * R + xi) * ESTIMATE_SIZE;
    const node = table.spectra.subarray(at, at + ESTIMATE_SIZE);
    for (let k = 0; k < ESTIMATE_SIZE; k++) expect(Math.abs(r[k * ESTIMATE_STEP_NM] - node[k])).toBeLessThan(TOL); // at the 5 nm nodes
    const between = estimateToGrid(node); // and linear between them (policy.ts)
    for (let i = 0; i < r.length; i++) expect(Math.abs(r[i] - between[i])).toBeLessThan(TOL);
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
