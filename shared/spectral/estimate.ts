/**
 * Estimated reflectances for colour values (sRGB hex or triple, linear sRGB, L*a*b*), which have no
 * spectrum of their own: the smoothest reflectance with the colour under D65 (LHTSS, Burns 2020: lhtss.ts),
 * tabulated over linear sRGB (upsample-table.ts); a colour's reflectance is the blend of its table cell's
 * node spectra (node-spectra.ts), which reproduces it under D65 (ΔE00 about 1e-5; 0.02 at pure white, where
 * the integrated D65 white and the sRGB white part). Swatches and photo pixels share it, so a colour gets
 * one grey everywhere.
 */
import { SpectralInputError } from './errors';
import { hexToSrgb, labToXyz, srgbToLinear, xyzToLinearSrgb } from './colour';
import { blendedReflectance } from './node-spectra';
import { estimateRows, type UpsampleTable } from './upsample-table';
import { lhtss } from './lhtss';
import { makeSpectrum } from './spectrum';
import { estimateToGrid } from './policy';
import type { Lab3, Rgb3, Spectrum, Xyz } from './types';

/** Linear sRGB outside [−ε, 1 + ε] is out of gamut (ε absorbs rounding of typed-in L*a*b*). */
export const GAMUT_EPSILON = 2e-3;

/**
 * A reflectance (0..1) on the grid reproducing linear sRGB `rgb` (each 0..1, clamped) under D65: the blend
 * of its table cell's node spectra (node-spectra.ts), the very estimate photo pixels of this colour get.
 */
export function reflectanceFromLinearRgb(rgb: Rgb3, table: UpsampleTable): Spectrum {
  return blendedReflectance(table, rgb);
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

/**
 * A reflectance (0..1) reproducing CIE XYZ under D65 (Y = 100 for white), for a colour measured without its
 * spectrum: the table's blend when the colour lies in the sRGB gamut (as for colour values), else the
 * estimate solved for it directly (lhtss.ts), which reaches any colour a reflectance can have.
 */
export function estimateFromXyz(xyz: Xyz, table: UpsampleTable): Spectrum {
  const lin = xyzToLinearSrgb(xyz);
  if (lin.every((v) => v >= 0 && v <= 1)) return reflectanceFromLinearRgb(lin, table);
  const r = lhtss(estimateRows(), xyz);
  if (!r.converged) throw new SpectralInputError(`XYZ (${xyz.map((v) => v.toFixed(2)).join(', ')}) is not the colour of any reflectance 0..1 under D65`);
  return makeSpectrum(estimateToGrid(r.reflectance));
}
