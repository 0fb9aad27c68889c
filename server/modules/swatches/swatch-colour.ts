/**
 * A swatch's colour to the eye as sRGB hex, from what was given: hex, sRGB 0..255, L*a*b* (D65, against the
 * sRGB white), or a measured reflectance (its XYZ under CIE D65, the sRGB white). The conversions are the
 * engine's (culori underneath); this file only chooses them and refuses colours outside the sRGB gamut.
 */
import { labToXyz, linearToSrgb, srgbToHex, xyzToLinearSrgb, type Rgb3 } from '../../../shared/spectral/colour';
import { xyzOfReflectance } from '../../../shared/spectral/integrate';
import { GAMUT_EPSILON } from '../../../shared/spectral/estimate';
import { cieIlluminant } from '../../../shared/spectral/lights';
import type { Spectrum } from '../../../shared/spectral/spectrum';
import type { ColourInput } from '../../../shared/schemas/swatch';
import { InvalidError } from '../../errors';


/** The hex of a colour input; L*a*b* outside the sRGB gamut is refused with a 400 on `field`. */
export function hexOfColour(c: ColourInput, field: string): string {
  if (c.space === 'hex') return c.hex.length === 4 ? '#' + [...c.hex.slice(1)].map((ch) => ch + ch).join('') : c.hex;
  if (c.space === 'rgb') return srgbToHex(c.rgb.map((v) => v / 255) as Rgb3);
  const lin = xyzToLinearSrgb(labToXyz(c.lab));
  if (lin.some((v) => v < -GAMUT_EPSILON || v > 1 + GAMUT_EPSILON)) {
    throw new InvalidError(`L*a*b* (${c.lab.join(', ')}) lies outside the sRGB gamut; a swatch needs a colour a screen can show`, `${field}.lab`);
  }
  return srgbToHex(linearToSrgb(lin.map((v) => Math.min(1, Math.max(0, v))) as Rgb3));
}

let d65: Spectrum | null = null;

/** The sRGB hex of a reflectance seen under D65 (clipped into the gamut for display). */
export function hexOfReflectance(r: Spectrum): string {
  d65 ??= cieIlluminant('D65');
  const lin = xyzToLinearSrgb(xyzOfReflectance(r, d65));
  return srgbToHex(linearToSrgb(lin.map((v) => Math.min(1, Math.max(0, v))) as Rgb3));
}
