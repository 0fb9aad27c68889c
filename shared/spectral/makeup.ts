/**
 * A layer of paint (foundation, greasepaint, lip colour, stage blood) over a surface, by Kubelka–Munk
 * (P. Kubelka, "New contributions to the optics of intensely light-scattering materials. Part I",
 * J. Opt. Soc. Am. 38(5), 1948: the reflectance of a layer of finite hiding over a background).
 * README "Skin, blood and makeup from physics".
 *
 * Per wavelength (every quantity 0..1 except K/S and SX):
 *   R∞   = the paint's own reflectance (what a layer thick enough to hide anything reflects), clamped to
 *          [1e-6, 1 − 1e-9] for the algebra;
 *   K/S  = (1 − R∞)² / (2 R∞)                               the paint's absorption over scattering;
 *   a    = 1 + K/S,  b = √(a² − 1)
 *   SX   = c / (1 − c)                                       the layer's scattering thickness from the coverage c:
 *          chosen so that a film of the paint's scattering that absorbed nothing would send back c of the light
 *          over black (KM: R₀ = SX / (1 + SX)) — coverage is the share of light the layer turns back before it
 *          reaches the skin. The same SX at every wavelength (the paint's scattering taken as grey, the usual
 *          single-constant assumption for pigmented layers);
 *   R    = (1 − Rg·(a − b·coth(b·SX))) / (a − Rg + b·coth(b·SX))     Kubelka 1948, Rg the surface under it.
 * c = 0 gives Rg exactly and c = 1 the paint's reflectance exactly (both returned as given, so a measured
 * paint above 1 keeps its value at full cover); in between R moves monotonically from Rg to R∞.
 */
import { GRID_SIZE } from './policy';
import { makeSpectrum, onGrid } from './spectrum';
import type { Spectrum } from './types';

const R_MIN = 1e-6;
const R_MAX = 1 - 1e-9;

/** b·coth(b·x), with its limit 1/x + b²x/3 where b·x is small (a paint that absorbs nothing). */
function bCoth(b: number, x: number): number {
  const bx = b * x;
  if (bx < 1e-4) return 1 / x + (b * b * x) / 3;
  if (bx > 20) return b;
  return b / Math.tanh(bx);
}

/**
 * Reflectance (on the working grid) of a paint layer of coverage 0..1 over a surface: Kubelka–Munk with the
 * paint's K/S from its own reflectance and the layer's hiding SX = c/(1 − c) (header). `under` and `paint` are
 * reflectances on any grid (put on the working grid); coverage 0 → `under`, 1 → `paint`, exactly.
 */
export function makeupOver(under: Spectrum, paint: Spectrum, coverage: number): Spectrum {
  const g = onGrid(under);
  const p = onGrid(paint);
  if (!(coverage > 0)) return g;
  if (coverage >= 1) return p;
  const sx = coverage / (1 - coverage);
  const out = new Float64Array(GRID_SIZE);
  for (let i = 0; i < GRID_SIZE; i++) {
    const rInf = Math.min(R_MAX, Math.max(R_MIN, p.values[i]));
    const rg = g.values[i];
    const ks = (1 - rInf) ** 2 / (2 * rInf);
    const a = 1 + ks;
    const bc = bCoth(Math.sqrt(a * a - 1), sx);
    out[i] = (1 - rg * (a - bc)) / (a - rg + bc);
  }
  return makeSpectrum(out);
}
