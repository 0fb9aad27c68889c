/**
 * The reflectance the engine computes with for a stored swatch: its measured one, the skin/makeup model's
 * (kept on the swatch when its parameters are set), or the engine's estimate from its colour (smooth
 * upsampling, shared/spectral/estimate.ts). Estimates are kept in a small in-memory cache keyed by colour,
 * since boards ask for the same swatches again and again; so are modelled reflectances that hold an
 * estimate (a makeup whose paint is a colour value), so their tone ranges are cached too (tone-ranges.ts).
 */
import type { Swatch } from '../../db/entities/swatch.entity';
import { reflectanceFromSrgb } from '../../../shared/spectral/compute';
import { needsUpsampleTable } from '../../../shared/spectral/sources';
import { spectrumFromStoredPairs, toPairs, type Spectrum } from '../../../shared/spectral/spectrum';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';
import type { SwatchOrigin } from '../../../shared/schemas/swatch';

const CACHE_MAX = 5000;
const estimates = new Map<string, Spectrum>();
const modelled = new Map<string, Spectrum>();

/** The engine's estimated reflectance (0..1 on the grid) of an sRGB hex colour, cached. */
export function estimatedSpectrum(hex: string, table: UpsampleTable): Spectrum {
  const key = hex.toLowerCase();
  let s = estimates.get(key);
  if (!s) {
    s = reflectanceFromSrgb(key, table);
    if (estimates.size >= CACHE_MAX) estimates.delete(estimates.keys().next().value!);
    estimates.set(key, s);
  }
  return s;
}

/** True for swatches whose reflectance comes from the skin or makeup model. */
export function isModelled(origin: SwatchOrigin): origin is Extract<SwatchOrigin, { type: 'skin' | 'makeup' }> {
  return origin.type === 'skin' || origin.type === 'makeup';
}

/**
 * Whether a stored swatch's spectrum is estimated: colour and photo swatches always; skin never (the
 * model's reflectance is all there is, so its tone has a zero-width range); makeup when its paint (or
 * anything under it) is a colour value, whose spectrum the engine estimated.
 */
export function originEstimated(origin: SwatchOrigin, hasReflectance: boolean): boolean {
  if (origin.type === 'skin') return false;
  if (origin.type === 'makeup') return needsUpsampleTable({ makeup: origin.makeup });
  return !hasReflectance;
}

/** FNV-1a over the stored pairs' values: a key for a modelled reflectance. */
function pairsKey(hex: string, pairs: [number, number][]): string {
  let h = 0x811c9dc5;
  for (const [nm, v] of pairs) {
    h = Math.imul(h ^ nm, 0x01000193);
    h = Math.imul(h ^ Math.round(v * 1e6), 0x01000193);
  }
  return `${hex}:${pairs.length}:${(h >>> 0).toString(36)}`;
}

/** A swatch's reflectance for the engine, and whether it is estimated. */
export function swatchSpectrum(s: Pick<Swatch, 'hex' | 'reflectance'> & { origin?: SwatchOrigin }, table: UpsampleTable): { reflectance: Spectrum; estimated: boolean } {
  if (!s.reflectance) return { reflectance: estimatedSpectrum(s.hex, table), estimated: true };
  const estimated = s.origin ? originEstimated(s.origin, true) : false;
  if (!estimated) return { reflectance: spectrumFromStoredPairs(s.reflectance, 'hold'), estimated };
  // one spectrum object per content, so the ranges cached against it (tone-ranges.ts) are found again
  const key = pairsKey(s.hex, s.reflectance);
  let r = modelled.get(key);
  if (!r) {
    r = spectrumFromStoredPairs(s.reflectance, 'hold');
    if (modelled.size >= CACHE_MAX) modelled.delete(modelled.keys().next().value!);
    modelled.set(key, r);
  }
  return { reflectance: r, estimated };
}

/** The estimate as `[nm, value]` pairs rounded for JSON. */
export function estimatedPairs(hex: string, table: UpsampleTable): [number, number][] {
  return toPairs(estimatedSpectrum(hex, table)).map(([nm, v]) => [nm, Math.round(v * 1e6) / 1e6]);
}
