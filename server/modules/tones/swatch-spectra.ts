/**
 * The reflectance the engine computes with for a stored swatch: its measured one, or the engine's
 * estimate from its colour (smooth upsampling, shared/spectral/estimate.ts). Estimates are kept in a
 * small in-memory cache keyed by colour, since boards ask for the same swatches again and again.
 */
import type { Swatch } from '../../db/entities/swatch.entity';
import { reflectanceFromSrgb } from '../../../shared/spectral/compute';
import { spectrumFromStoredPairs, toPairs, type Spectrum } from '../../../shared/spectral/spectrum';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';

const CACHE_MAX = 5000;
const estimates = new Map<string, Spectrum>();

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

/** A swatch's reflectance for the engine, and whether it is estimated. */
export function swatchSpectrum(s: Pick<Swatch, 'hex' | 'reflectance'>, table: UpsampleTable): { reflectance: Spectrum; estimated: boolean } {
  if (s.reflectance) return { reflectance: spectrumFromStoredPairs(s.reflectance, 'hold'), estimated: false };
  return { reflectance: estimatedSpectrum(s.hex, table), estimated: true };
}

/** The estimate as `[nm, value]` pairs rounded for JSON. */
export function estimatedPairs(hex: string, table: UpsampleTable): [number, number][] {
  return toPairs(estimatedSpectrum(hex, table)).map(([nm, v]) => [nm, Math.round(v * 1e6) / 1e6]);
}
