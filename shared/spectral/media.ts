/**
 * Media: relative spectral sensitivity per unit energy on the grid, peak 1.
 * The built-in emulsions and sensor are generic models of typical shapes (data/library/media.json),
 * never a manufacturer's data: a sum of Gaussian lobes, optionally bounded by logistic edges, on an
 * energy or photon (quantum) basis. The eye is the CIE 1931 ȳ(λ) (CIE 015:2018).
 */
import { toEnergyBasis } from './bases';
import { CMF } from './cie';
import { GRID_NM } from './grid';
import { gaussian, risingEdge } from './shapes';
import { makeSpectrum, normalisePeak } from './spectrum';
import type { Spectrum } from './types';

/** One sensitivity lobe: a Gaussian of relative height `weight`. */
export interface MediumLobe {
  centreNm: number;
  /** full width at half maximum, nm */
  widthNm: number;
  weight: number;
}

/** The parametric medium model. */
export interface MediumModel {
  /** the basis the lobes are drawn on: energy, or quantum efficiency (converted × λ) */
  basis: 'energy' | 'quantum';
  lobes: MediumLobe[];
  /** long-wavelength limit of the sensitisation (50 % point), nm, and its 10–90 % width */
  redEdgeNm?: number;
  redEdgeWidthNm?: number;
  /** short-wavelength limit (gelatin, glass), nm, and its width */
  blueEdgeNm?: number;
  blueEdgeWidthNm?: number;
}

/** Evaluates the parametric model on the grid: energy basis, peak 1. */
export function mediumFromModel(m: MediumModel): Spectrum {
  const v = Array.from(GRID_NM, (nm) => {
    let s = 0;
    for (const l of m.lobes) s += l.weight * gaussian(nm, l.centreNm, l.widthNm);
    if (m.redEdgeNm !== undefined) s *= 1 - risingEdge(nm, m.redEdgeNm, m.redEdgeWidthNm ?? 20);
    if (m.blueEdgeNm !== undefined) s *= risingEdge(nm, m.blueEdgeNm, m.blueEdgeWidthNm ?? 20);
    return s;
  });
  return toEnergyBasis(makeSpectrum(v), m.basis);
}

/** The reference medium: the eye, CIE 1931 ȳ(λ) (photopic luminous efficiency), peak 1. */
export function eyeMedium(): Spectrum {
  return normalisePeak(CMF.y, 'ȳ');
}
