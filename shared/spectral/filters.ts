/**
 * Filters: spectral transmittance 0..1 on the grid. Several stack by multiplication.
 * The parametric model (generic shapes, not any maker's data): logistic edges whose 50 % point is
 * the cut-on / cut-off wavelength and whose `slopeNm` is the 10 %–90 % rise width.
 */
import { GRID_NM } from './grid';
import { risingEdge } from './shapes';
import { constantSpectrum, makeSpectrum, multiply } from './spectrum';
import type { Spectrum } from './types';

/** Default 10–90 % edge width of the parametric filters, nm (a typical dyed filter edge). */
export const DEFAULT_SLOPE_NM = 20;

/** Long-pass: passes wavelengths above the cut-on. */
export interface LongPassParams {
  /** 50 % point of the edge, nm */
  cutOnNm: number;
  /** 10 %–90 % rise width, nm (default 20) */
  slopeNm?: number;
  /** transmittance in the pass band, 0..1 (default 1) */
  peak?: number;
}
/** Short-pass: passes wavelengths below the cut-off. */
export interface ShortPassParams {
  cutOffNm: number;
  slopeNm?: number;
  peak?: number;
}
/** Band-pass: passes a band `widthNm` wide (between the two 50 % points) around `centreNm`. */
export interface BandPassParams {
  centreNm: number;
  widthNm: number;
  slopeNm?: number;
  peak?: number;
}
/** Notch: blocks a band `widthNm` wide around `centreNm`; `peak` is the transmittance outside it. */
export type NotchParams = BandPassParams;

function fromFn(fn: (nm: number) => number): Spectrum {
  return makeSpectrum(Array.from(GRID_NM, (nm) => Math.min(1, Math.max(0, fn(nm)))));
}

/** Long-pass transmittance 0..1 on the grid. */
export function longPass({ cutOnNm, slopeNm = DEFAULT_SLOPE_NM, peak = 1 }: LongPassParams): Spectrum {
  return fromFn((nm) => peak * risingEdge(nm, cutOnNm, slopeNm));
}

/** Short-pass transmittance 0..1 on the grid. */
export function shortPass({ cutOffNm, slopeNm = DEFAULT_SLOPE_NM, peak = 1 }: ShortPassParams): Spectrum {
  return fromFn((nm) => peak * (1 - risingEdge(nm, cutOffNm, slopeNm)));
}

function band(nm: number, { centreNm, widthNm, slopeNm = DEFAULT_SLOPE_NM }: BandPassParams): number {
  return risingEdge(nm, centreNm - widthNm / 2, slopeNm) * (1 - risingEdge(nm, centreNm + widthNm / 2, slopeNm));
}

/** Band-pass transmittance 0..1 on the grid. */
export function bandPass(p: BandPassParams): Spectrum {
  const peak = p.peak ?? 1;
  return fromFn((nm) => peak * band(nm, p));
}

/** Notch (band-stop) transmittance 0..1 on the grid. */
export function notch(p: NotchParams): Spectrum {
  const peak = p.peak ?? 1;
  return fromFn((nm) => peak * (1 - band(nm, p)));
}

/** Neutral density of optical density `density` (T = 10^−D at every wavelength); 0.3 ≈ 1 stop. */
export function neutralDensity(density: number): Spectrum {
  return constantSpectrum(10 ** -density);
}

/** The combined transmittance of a stack of filters (1 everywhere for none). */
export function stackFilters(filters: readonly Spectrum[]): Spectrum {
  return filters.length ? multiply(constantSpectrum(1), ...filters) : constantSpectrum(1);
}
