/**
 * Estimated reflectances for colour values (sRGB hex or triple, linear sRGB, L*a*b*), which have no
 * spectrum of their own: the smooth upsampling of upsample.ts (Jakob & Hanika 2019), looked up in the
 * table and refined by a few Gauss–Newton steps so the colour is reproduced under D65 (to about
 * 1e-4 ΔE*ab, except at pure black and white, which the model only approaches).
 */
import { SpectralInputError } from './errors';
import { hexToSrgb, labToXyz, linearSrgbToXyz, srgbToLinear, xyzToLinearSrgb, type Lab3, type Rgb3 } from './colour';
import { fitCoefficients, sigmoidReflectance } from './upsample';
import { lookupCoefficients, type UpsampleTable } from './upsample-table';
import type { Spectrum } from './spectrum';

/** Linear sRGB outside [−ε, 1 + ε] is out of gamut (ε absorbs rounding of typed-in L*a*b*). */
export const GAMUT_EPSILON = 2e-3;

/** A reflectance (0..1) on the grid reproducing linear sRGB `rgb` (each 0..1, clamped) under D65. */
export function reflectanceFromLinearRgb(rgb: Rgb3, table: UpsampleTable): Spectrum {
  const c = rgb.map((v) => Math.min(1, Math.max(0, v))) as Rgb3;
  const start = lookupCoefficients(table, c[0], c[1], c[2], [0, 0, 0]);
  return sigmoidReflectance(fitCoefficients(linearSrgbToXyz(c), start, { maxIterations: 16, tolerance: 1e-4 }).coefficients);
}

/**
 * A reflectance (0..1) on the grid reproducing an sRGB colour under D65: `'#rrggbb'` / `'#rgb'`, or
 * an encoded sRGB triple with each channel 0..1 (IEC 61966-2-1). Throws SpectralInputError for a bad hex.
 */
export function reflectanceFromSrgb(colour: string | Rgb3, table: UpsampleTable): Spectrum {
  const rgb = typeof colour === 'string' ? hexToSrgb(colour) : colour;
  if (rgb.length !== 3 || rgb.some((v) => typeof v !== 'number' || !Number.isFinite(v) || v < 0 || v > 1)) {
    throw new SpectralInputError('an sRGB triple needs three numbers 0..1');
  }
  return reflectanceFromLinearRgb(srgbToLinear(rgb), table);
}

/**
 * A reflectance reproducing CIE L*a*b* (against the D65 sRGB white) under D65. Throws
 * SpectralInputError when the colour lies outside the sRGB gamut.
 */
export function reflectanceFromLab(lab: Lab3, table: UpsampleTable): Spectrum {
  const lin = xyzToLinearSrgb(labToXyz(lab));
  if (lin.some((v) => !Number.isFinite(v) || v < -GAMUT_EPSILON || v > 1 + GAMUT_EPSILON)) {
    throw new SpectralInputError(`L*a*b* (${lab.join(', ')}) lies outside the sRGB gamut`);
  }
  return reflectanceFromLinearRgb(lin, table);
}
