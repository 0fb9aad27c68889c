/**
 * Colour-space steps, done by culori 4 (sRGB per IEC 61966-2-1, CIE XYZ D65, CIE 1976 L*a*b*).
 * Engine convention: XYZ on the 0..100 scale (Y = 100 for white); culori works on 0..1.
 */
import { converter, modeLab, modeLab65, modeLrgb, modeRgb, modeXyz65, useMode, type Lab65, type Lrgb, type Xyz65 } from 'culori/fn';
import { SpectralInputError } from './errors';
import type { Lab3, Rgb3, Xyz } from './types';

export type { Lab3, Rgb3 } from './types';

useMode(modeRgb);
useMode(modeLrgb);
useMode(modeXyz65);
useMode(modeLab65);
useMode(modeLab);

const toLrgb = converter('lrgb');
const toRgb = converter('rgb');
const toXyz65 = converter('xyz65');
const toLab65 = converter('lab65');

/** culori's D65 white (x 0.3127, y 0.3290), XYZ 0..100: the white of the sRGB working space. */
export const SRGB_WHITE: Xyz = (() => {
  const w = toXyz65({ mode: 'lrgb', r: 1, g: 1, b: 1 });
  return [w.x * 100, w.y * 100, w.z * 100];
})();

/** '#rrggbb' or '#rgb' → encoded sRGB 0..1. Throws SpectralInputError for anything else. */
export function hexToSrgb(hex: string): Rgb3 {
  if (typeof hex !== 'string' || !/^#([0-9a-f]{3}|[0-9a-f]{6})$/i.test(hex.trim())) {
    throw new SpectralInputError(`"${String(hex)}" is not an sRGB colour like #7f6a55`);
  }
  const h = hex.trim().slice(1);
  const full = h.length === 3 ? h.replace(/./g, '$&$&') : h;
  return [parseInt(full.slice(0, 2), 16) / 255, parseInt(full.slice(2, 4), 16) / 255, parseInt(full.slice(4, 6), 16) / 255];
}

/** Encoded sRGB 0..1 → '#rrggbb' (rounded, clamped). */
export function srgbToHex(rgb: Rgb3): string {
  return '#' + rgb.map((v) => Math.round(Math.min(1, Math.max(0, v)) * 255).toString(16).padStart(2, '0')).join('');
}

/**
 * IEC 61966-2-1 sRGB encoding of one channel: a linear value or relative luminance 0..1 (clamped) →
 * encoded value 0..1. The one sRGB transfer function of Grisaille (culori's, as in linearToSrgb).
 */
export function srgbEncode(linear: number): number {
  const v = Math.min(1, Math.max(0, linear));
  return toRgb({ mode: 'lrgb', r: v, g: v, b: v } as Lrgb).r;
}

/** IEC 61966-2-1 sRGB decoding of one channel: encoded value 0..1 (clamped) → linear value 0..1 (culori's, as in srgbToLinear). */
export function srgbDecode(encoded: number): number {
  const e = Math.min(1, Math.max(0, encoded));
  return toLrgb({ mode: 'rgb', r: e, g: e, b: e }).r;
}

/** Encoded sRGB 0..1 → linear sRGB 0..1 (IEC 61966-2-1 transfer function, by culori). */
export function srgbToLinear([r, g, b]: Rgb3): Rgb3 {
  const c = toLrgb({ mode: 'rgb', r, g, b });
  return [c.r, c.g, c.b];
}

/** Linear sRGB 0..1 → encoded sRGB 0..1 (IEC 61966-2-1, by culori). */
export function linearToSrgb([r, g, b]: Rgb3): Rgb3 {
  const c = toRgb({ mode: 'lrgb', r, g, b } as Lrgb);
  return [c.r, c.g, c.b];
}

/** Linear sRGB 0..1 → XYZ D65, 0..100 (IEC 61966-2-1 primaries, by culori). */
export function linearSrgbToXyz([r, g, b]: Rgb3): Xyz {
  const c = toXyz65({ mode: 'lrgb', r, g, b } as Lrgb);
  return [c.x * 100, c.y * 100, c.z * 100];
}

/** XYZ D65, 0..100 → linear sRGB 0..1 (unclamped). */
export function xyzToLinearSrgb([x, y, z]: Xyz): Rgb3 {
  const c = toLrgb({ mode: 'xyz65', x: x / 100, y: y / 100, z: z / 100 } as Xyz65);
  return [c.r, c.g, c.b];
}

/** Encoded sRGB 0..1 → XYZ D65, 0..100. */
export function srgbToXyz(rgb: Rgb3): Xyz {
  return linearSrgbToXyz(srgbToLinear(rgb));
}

/**
 * XYZ (0..100) → CIE 1976 L*a*b* against the reference white `white` (XYZ 0..100, default sRGB D65).
 * culori's lab65 carries the CIE formula for its D65 white; the white is swapped by scaling XYZ
 * component-wise (a change of reference white, not a chromatic adaptation: the CIELAB definition).
 */
export function xyzToLab([x, y, z]: Xyz, white: Xyz = SRGB_WHITE): Lab3 {
  const c = toLab65({
    mode: 'xyz65',
    x: (x / white[0]) * (SRGB_WHITE[0] / 100),
    y: (y / white[1]) * (SRGB_WHITE[1] / 100),
    z: (z / white[2]) * (SRGB_WHITE[2] / 100),
  } as Xyz65);
  return [c.l, c.a, c.b];
}

/** CIE 1976 L*a*b* against `white` (XYZ 0..100, default sRGB D65) → XYZ 0..100. */
export function labToXyz([l, a, b]: Lab3, white: Xyz = SRGB_WHITE): Xyz {
  const c = toXyz65({ mode: 'lab65', l, a, b } as Lab65);
  return [(c.x / (SRGB_WHITE[0] / 100)) * white[0], (c.y / (SRGB_WHITE[1] / 100)) * white[1], (c.z / (SRGB_WHITE[2] / 100)) * white[2]];
}
