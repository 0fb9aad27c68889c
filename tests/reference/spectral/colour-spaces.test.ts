/**
 * sRGB ↔ XYZ ↔ L*a*b* of the engine against culori 4.0.2 (the project's reference library for colour
 * spaces) and the sRGB transfer function and matrix of IEC 61966-2-1:1999.
 */
import { converter, differenceCiede2000 } from 'culori';
import { describe, expect, it } from 'vitest';
import { labToXyz, linearSrgbToXyz, linearToSrgb, srgbDecode, srgbEncode, srgbToLinear, srgbToXyz, xyzToLab, xyzToLinearSrgb, type Rgb3 } from '../../../shared/spectral/colour';
import type { Xyz } from '../../../shared/spectral/types';
import { random } from '../../unit/spectral/fixtures';

/** Default tolerance of this file: agreement with culori, 1e-6 (issue requirement). */
const TOL = 1e-6;

// IEC 61966-2-1:1999 sRGB transfer function constants
/** linear segment threshold on the encoded value */
const IEC_THRESHOLD = 0.04045;
/** slope of the linear segment */
const IEC_SLOPE = 12.92;
/** offset and exponent of the power segment */
const IEC_OFFSET = 0.055;
const IEC_GAMMA = 2.4;
/** IEC 61966-2-1:1999 RGB→XYZ matrix (D65), printed to 4 decimals. */
const IEC_MATRIX = [
  [0.4124, 0.3576, 0.1805],
  [0.2126, 0.7152, 0.0722],
  [0.0193, 0.1192, 0.9505],
];
/** The IEC matrix is printed to 4 decimals: agreement to half a unit in the last place (reason for the looser one). */
const TOL_IEC_MATRIX = 5e-5 * 100;

const iecDecode = (v: number) => (v <= IEC_THRESHOLD ? v / IEC_SLOPE : ((v + IEC_OFFSET) / (1 + IEC_OFFSET)) ** IEC_GAMMA);

const rnd = random(61966);
const samples: Rgb3[] = [
  [0, 0, 0],
  [1, 1, 1],
  [1, 0, 0],
  [0, 1, 0],
  [0, 0, 1],
  [0.5, 0.5, 0.5],
  [IEC_THRESHOLD, 0.2, 0.9],
  ...Array.from({ length: 200 }, () => [rnd(), rnd(), rnd()] as Rgb3),
];

const cLrgb = converter('lrgb');
const cXyz65 = converter('xyz65');
const cLab65 = converter('lab65');

describe('sRGB transfer function (IEC 61966-2-1:1999)', () => {
  it('decodes like the standard formula', () => {
    for (const c of samples) srgbToLinear(c).forEach((v, i) => expect(Math.abs(v - iecDecode(c[i]))).toBeLessThanOrEqual(TOL));
  });
  it('encodes back (round trip, to the default 1e-6: the standard\'s two segments meet only to about 1e-7)', () => {
    for (const c of samples) linearToSrgb(srgbToLinear(c)).forEach((v, i) => expect(Math.abs(v - c[i])).toBeLessThanOrEqual(TOL));
  });
  it('does one channel the same way (srgbDecode / srgbEncode, clamped to 0..1)', () => {
    for (const c of samples) {
      c.forEach((v, i) => expect(srgbDecode(v)).toBe(srgbToLinear(c)[i]));
      const lin = srgbToLinear(c);
      lin.forEach((v, i) => expect(srgbEncode(v)).toBe(linearToSrgb(lin)[i]));
    }
    expect([srgbDecode(-0.5), srgbDecode(1.5), srgbEncode(-0.5), srgbEncode(1.5)]).toEqual([0, srgbDecode(1), 0, srgbEncode(1)]);
  });
  it('uses the IEC primaries matrix', () => {
    const cols: Rgb3[] = [
      [1, 0, 0],
      [0, 1, 0],
      [0, 0, 1],
    ];
    cols.forEach((c, j) => linearSrgbToXyz(c).forEach((v, i) => expect(Math.abs(v - 100 * IEC_MATRIX[i][j])).toBeLessThanOrEqual(TOL_IEC_MATRIX)));
  });
});

describe('sRGB ↔ XYZ ↔ L*a*b* against culori', () => {
  it('sRGB → linear → XYZ D65', () => {
    for (const [r, g, b] of samples) {
      const ref = cXyz65({ mode: 'rgb', r, g, b });
      const lin = cLrgb({ mode: 'rgb', r, g, b });
      srgbToLinear([r, g, b]).forEach((v, i) => expect(Math.abs(v - [lin.r, lin.g, lin.b][i])).toBeLessThanOrEqual(TOL));
      srgbToXyz([r, g, b]).forEach((v, i) => expect(Math.abs(v / 100 - [ref.x, ref.y, ref.z][i])).toBeLessThanOrEqual(TOL));
    }
  });
  it('XYZ → linear sRGB', () => {
    for (const c of samples) {
      const xyz = srgbToXyz(c);
      const ref = cLrgb({ mode: 'xyz65', x: xyz[0] / 100, y: xyz[1] / 100, z: xyz[2] / 100 });
      xyzToLinearSrgb(xyz).forEach((v, i) => expect(Math.abs(v - [ref.r, ref.g, ref.b][i])).toBeLessThanOrEqual(TOL));
    }
  });
  it('XYZ ↔ L*a*b* against the D65 white', () => {
    for (const c of samples) {
      const xyz = srgbToXyz(c);
      const ref = cLab65({ mode: 'xyz65', x: xyz[0] / 100, y: xyz[1] / 100, z: xyz[2] / 100 });
      const lab = xyzToLab(xyz);
      lab.forEach((v, i) => expect(Math.abs(v - [ref.l, ref.a, ref.b][i])).toBeLessThanOrEqual(TOL));
      labToXyz(lab).forEach((v, i) => expect(Math.abs(v - xyz[i])).toBeLessThanOrEqual(TOL * 100));
    }
  });
  it('L*a*b* against another white follows the CIE 1976 definition (white → L* 100, a* = b* = 0)', () => {
    const white: Xyz = [109.85, 100, 35.585];
    xyzToLab(white, white).forEach((v, i) => expect(Math.abs(v - [100, 0, 0][i])).toBeLessThanOrEqual(TOL));
    const half: Xyz = [white[0] * 0.18, 18, white[2] * 0.18];
    const lab = xyzToLab(half, white);
    // culori lab65 of the same relative colour under its own white gives the same L*a*b*
    const ref = cLab65({ mode: 'xyz65', x: 0.18 * (0.3127 / 0.329), y: 0.18, z: 0.18 * ((1 - 0.3127 - 0.329) / 0.329) });
    lab.forEach((v, i) => expect(Math.abs(v - [ref.l, ref.a, ref.b][i])).toBeLessThanOrEqual(TOL));
  });
  it('culori CIEDE2000 of identical colours is 0 (sanity of the round-trip metric)', () => {
    expect(differenceCiede2000()('#7f6a55', '#7f6a55')).toBe(0);
  });
});
