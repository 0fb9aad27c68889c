/**
 * The basis every input names, and its conversion to the one the engine computes in.
 * Filters → transmittance 0..1; media → relative sensitivity per unit energy (peak 1); lights →
 * relative spectral power (peak 1); surfaces → reflectance 0..1. Values are read from pairs and
 * resampled first (policy.ts), so densities and log sensitivities are interpolated in their own
 * (logarithmic) scale, as data sheets draw them.
 */
import { GRID_NM } from './grid';
import { makeSpectrum, normalisePeak, spectrumFromPairs } from './spectrum';
import type { Spectrum } from './types';

/** How a filter's values are given: transmittance 0..1, transmittance in percent, or optical density (T = 10^−D). */
export type FilterBasis = 'transmittance' | 'percent' | 'density';
/** How a medium's values are given: relative sensitivity per unit energy; log10 of it (data-sheet form); or quantum efficiency per photon. */
export type MediumBasis = 'energy' | 'log10' | 'quantum';
/** How a surface's values are given: reflectance 0..1 or in percent. */
export type ReflectanceBasis = 'fraction' | 'percent';

export const FILTER_BASES: readonly FilterBasis[] = ['transmittance', 'percent', 'density'];
export const MEDIUM_BASES: readonly MediumBasis[] = ['energy', 'log10', 'quantum'];
export const REFLECTANCE_BASES: readonly ReflectanceBasis[] = ['fraction', 'percent'];

/** Largest reflectance accepted (fluorescent samples can exceed 1 a little), fraction. */
export const MAX_REFLECTANCE = 1.5;

/** Filter pairs → transmittance 0..1 on the grid. Density D in optical density units (T = 10^−D). */
export function filterFromPairs(pairs: unknown, basis: FilterBasis = 'transmittance'): Spectrum {
  if (basis === 'density') {
    const d = spectrumFromPairs(pairs, { min: 0, quantity: 'optical density' });
    return makeSpectrum(d.values.map((v) => 10 ** -v));
  }
  if (basis === 'percent') {
    const p = spectrumFromPairs(pairs, { min: 0, max: 100, quantity: 'transmittance (%)' });
    return makeSpectrum(p.values.map((v) => v / 100));
  }
  return spectrumFromPairs(pairs, {
    min: 0,
    max: 1,
    quantity: 'transmittance',
    overMaxHint: 'give transmittance as 0..1, or set basis "percent"',
  });
}

/** Converts relative sensitivity on `basis` (already on the grid) to the energy basis, peak 1. Quantum: × λ (nm). */
export function toEnergyBasis(values: Spectrum, basis: MediumBasis): Spectrum {
  const v = values.values;
  let e: Float64Array;
  if (basis === 'log10') e = v.map((x) => 10 ** x);
  else if (basis === 'quantum') e = v.map((x, i) => x * GRID_NM[i]);
  else e = Float64Array.from(v);
  return normalisePeak(makeSpectrum(e), 'sensitivity');
}

/** Medium pairs → relative sensitivity per unit energy on the grid, peak 1; zero beyond the data (policy.ts). */
export function mediumFromPairs(pairs: unknown, basis: MediumBasis = 'energy'): Spectrum {
  const raw =
    basis === 'log10'
      ? spectrumFromPairs(pairs, { quantity: 'log10 sensitivity', beyond: 'zero', outside: -Infinity })
      : spectrumFromPairs(pairs, { min: 0, quantity: basis === 'quantum' ? 'quantum efficiency' : 'sensitivity', beyond: 'zero' });
  return toEnergyBasis(raw, basis);
}

/** Light pairs (relative spectral power, any scale) → relative power on the grid, peak 1. */
export function lightFromPairs(pairs: unknown): Spectrum {
  return normalisePeak(spectrumFromPairs(pairs, { min: 0, quantity: 'power' }), 'light');
}

/** Surface pairs → reflectance (fraction) on the grid. */
export function reflectanceFromPairs(pairs: unknown, basis: ReflectanceBasis = 'fraction'): Spectrum {
  if (basis === 'percent') {
    const p = spectrumFromPairs(pairs, { min: 0, max: MAX_REFLECTANCE * 100, quantity: 'reflectance (%)' });
    return makeSpectrum(p.values.map((v) => v / 100));
  }
  return spectrumFromPairs(pairs, {
    min: 0,
    max: MAX_REFLECTANCE,
    quantity: 'reflectance',
    overMaxHint: 'give reflectance as 0..1, or set basis "percent"',
  });
}
