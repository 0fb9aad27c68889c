import { describe, expect, it } from 'vitest';
import { CIE_TABLES } from '../../../shared/spectral/cie';
import { GRID_NM } from '../../../shared/spectral/grid';
import { whitePoint } from '../../../shared/spectral/integrate';
import { cieIlluminant, D50_CCT_K, D65_CCT_K, daylight, illuminantARelative } from '../../../shared/spectral/lights';
import { valueAt } from '../../../shared/spectral/spectrum';

/** Default tolerance of this file: ±0.01 on the 0..100 XYZ scale (the figure the white points are quoted to). */
const TOL_XYZ = 0.01;

// White points of the perfect reflecting diffuser, CIE 1931 2° observer, Y = 100:
// CIE 015:2018 Colorimetry (also ASTM E308), as quoted to 3 decimals.
/** CIE 015:2018 white point of D65 */
const WHITE_D65 = [95.047, 100.0, 108.883];
/** CIE 015:2018 white point of A */
const WHITE_A = [109.85, 100.0, 35.585];
/** CIE 015:2018 white point of D50 */
const WHITE_D50 = [96.422, 100.0, 82.521];

/** CIE 015:2018 defining formula of A vs the published table: relative agreement required (issue requirement). */
const TOL_A_RELATIVE = 1e-3;
/** Daylight formula vs published D tables, relative per sample. */
const TOL_DAYLIGHT_RELATIVE = 0.002;
/** colord prints D50 to 3 decimals: allow half a unit in the last place on top (reason for the looser check). */
const D50_TABLE_ROUNDING = 0.0005;

describe('CIE white points computed from the tables (CIE 015:2018)', () => {
  it.each([
    ['D65', WHITE_D65],
    ['A', WHITE_A],
    ['D50', WHITE_D50],
  ] as const)('%s', (name, expected) => {
    const w = whitePoint(cieIlluminant(name));
    for (let i = 0; i < 3; i++) expect(Math.abs(w[i] - expected[i])).toBeLessThanOrEqual(TOL_XYZ);
  });
});

describe('illuminant A by its defining formula (CIE 015:2018) vs the colord table', () => {
  it('agrees at every 1 nm of the table, 300–830 nm, to 1e-3 relative', () => {
    const t = CIE_TABLES.A;
    let worst = 0;
    t.values.forEach((v, i) => {
      const nm = t.startNm + i * t.stepNm;
      worst = Math.max(worst, Math.abs(illuminantARelative(nm) / v - 1));
    });
    expect(worst).toBeLessThanOrEqual(TOL_A_RELATIVE);
  });
});

describe('CIE daylight from S0, S1, S2 (CIE 015:2018 formula) vs the tabulated D illuminants', () => {
  const compare = (cctK: number, name: 'D65' | 'D50', absolute: number) => {
    const made = daylight(cctK);
    const t = CIE_TABLES[name];
    const madeAt560 = valueAt(made, 560);
    for (const nm of GRID_NM) {
      const idx = Math.round((nm - t.startNm) / t.stepNm);
      const tab = t.values[idx];
      const ours = valueAt(made, nm) / madeAt560;
      expect(Math.abs(ours - tab), `${name} at ${nm} nm`).toBeLessThanOrEqual(TOL_DAYLIGHT_RELATIVE * tab + absolute);
    }
  };
  it('6504 K reproduces the D65 table within 0.2 % per sample', () => compare(D65_CCT_K, 'D65', 0));
  it('5003 K reproduces the D50 table within 0.2 % per sample (plus the table’s 3-decimal rounding)', () => compare(D50_CCT_K, 'D50', D50_TABLE_ROUNDING));
});
