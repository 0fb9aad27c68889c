/**
 * Lights: relative spectral power on the grid, normalised to a peak of 1 (policy.ts).
 * Sources: CIE 015:2018 (tabulated illuminants, the daylight formula, the defining formula of A),
 * Planck's law with c2 = 1.4388e-2 m·K (ITS-90 value used by CIE 015).
 */
import { CIE_TABLES, DAYLIGHT_COMPONENTS, cieTable, type CieTableName } from './cie';
import { SpectralInputError } from './errors';
import { GRID_NM } from './grid';
import { BLACKBODY_K, DAYLIGHT_CCT_K, type CieIlluminantName } from './limits';
import { GRID_SIZE } from './policy';
import { gaussian } from './shapes';
import { makeSpectrum, multiply, normalisePeak } from './spectrum';
import type { Spectrum } from './types';

/** Second radiation constant, m·K (CIE 015:2018, ITS-90). */
export const C2_M_K = 1.4388e-2;
/** Correlated colour temperature at which the daylight formula gives D50, K (5000 × 1.4388/1.4380). */
export const D50_CCT_K = 5003;
/** … and D65, K (6500 × 1.4388/1.4380). */
export const D65_CCT_K = 6504;

/**
 * CIE daylight chromaticity (xD, yD) at a correlated colour temperature, K, 4000–25000
 * (CIE 015:2018, daylight formula).
 */
export function daylightChromaticity(cctK: number): { x: number; y: number } {
  if (!(cctK >= DAYLIGHT_CCT_K.min && cctK <= DAYLIGHT_CCT_K.max)) {
    throw new SpectralInputError(`daylight is defined for ${DAYLIGHT_CCT_K.min}–${DAYLIGHT_CCT_K.max} K, not ${cctK} K`);
  }
  const t = cctK;
  const x =
    t <= 7000
      ? -4.607e9 / t ** 3 + 2.9678e6 / t ** 2 + 0.09911e3 / t + 0.244063
      : -2.0064e9 / t ** 3 + 1.9018e6 / t ** 2 + 0.24748e3 / t + 0.23704;
  return { x, y: -3.0 * x * x + 2.87 * x - 0.275 };
}

/**
 * CIE daylight at `cctK` (4000–25000 K): S = S0 + M1·S1 + M2·S2 with M1, M2 from (xD, yD) rounded to
 * three decimals as CIE 015:2018 directs. Relative power, peak 1.
 */
export function daylight(cctK: number): Spectrum {
  const { x, y } = daylightChromaticity(cctK);
  const m = 0.0241 + 0.2562 * x - 0.7341 * y;
  const m1 = Math.round(((-1.3515 - 1.7703 * x + 5.9114 * y) / m) * 1000) / 1000;
  const m2 = Math.round(((0.03 - 31.4424 * x + 30.0717 * y) / m) * 1000) / 1000;
  const { s0, s1, s2 } = DAYLIGHT_COMPONENTS;
  const v = new Float64Array(GRID_SIZE);
  for (let i = 0; i < GRID_SIZE; i++) v[i] = s0.values[i] + m1 * s1.values[i] + m2 * s2.values[i];
  return normalisePeak(makeSpectrum(v), 'daylight');
}

/** Planck's spectral radiance shape at `nm` and `tempK`, arbitrary scale (c2 = 1.4388e-2 m·K). */
export function planck(nm: number, tempK: number, c2 = C2_M_K): number {
  const lambdaM = nm * 1e-9;
  return 1 / (lambdaM ** 5 * Math.expm1(c2 / (lambdaM * tempK)));
}

/** A blackbody (full radiator) at `tempK`, 1000–25000 K, by Planck's law. Relative power, peak 1. */
export function blackbody(tempK: number): Spectrum {
  if (!(tempK >= BLACKBODY_K.min && tempK <= BLACKBODY_K.max)) {
    throw new SpectralInputError(`a blackbody needs ${BLACKBODY_K.min}–${BLACKBODY_K.max} K, not ${tempK} K`);
  }
  return normalisePeak(makeSpectrum(Array.from(GRID_NM, (nm) => planck(nm, tempK))), 'blackbody');
}

/**
 * CIE standard illuminant A by its defining formula (CIE 015:2018; ISO/CIE 11664-2):
 * S(λ) = 100 (560/λ)^5 · (e^(1.435e7/(2848·560)) − 1) / (e^(1.435e7/(2848·λ)) − 1), λ in nm.
 * Returned relative to 1 at 560 nm (the table scale of data/cie/illuminant-a.json).
 */
export function illuminantARelative(nm: number): number {
  const c = 1.435e7;
  const t = 2848;
  return (560 / nm) ** 5 * (Math.expm1(c / (t * 560)) / Math.expm1(c / (t * nm)));
}

/** CIE illuminant A from the defining formula on the grid. Relative power, peak 1. */
export function illuminantA(): Spectrum {
  return normalisePeak(makeSpectrum(Array.from(GRID_NM, illuminantARelative)), 'illuminant A');
}

/**
 * A CIE illuminant by name. Relative power, peak 1. D65, F2, F7, F11 from the published tables (their
 * end values held beyond them, policy.ts); A from its defining formula, which holds at every wavelength;
 * D50 from the daylight formula at 5003 K (the way CIE defines it; the only D50 table at hand is
 * printed to 3 decimals, see data/cie/illuminant-d50.json).
 */
export function cieIlluminant(name: CieIlluminantName): Spectrum {
  if (name === 'D50') return daylight(D50_CCT_K);
  if (name === 'A') return illuminantA();
  if (!(name in CIE_TABLES)) throw new SpectralInputError(`unknown CIE illuminant "${name}"`);
  return normalisePeak(cieTable(name as CieTableName), `illuminant ${name}`);
}

/** Parameters of the white LED model: a blue emitter plus a broad phosphor band, both Gaussian. */
export interface LedModel {
  /** emitter peak, nm (typically 445–460) */
  emitterNm: number;
  /** emitter full width at half maximum, nm */
  emitterWidthNm: number;
  /** phosphor peak, nm */
  phosphorNm: number;
  /** phosphor full width at half maximum, nm */
  phosphorWidthNm: number;
  /** phosphor peak height relative to the emitter peak (larger: warmer) */
  phosphorRatio: number;
}

/** A white LED: blue emitter + phosphor, each a Gaussian (generic model of a typical shape). Peak 1. */
export function whiteLed(p: LedModel): Spectrum {
  const v = Array.from(GRID_NM, (nm) => gaussian(nm, p.emitterNm, p.emitterWidthNm) + p.phosphorRatio * gaussian(nm, p.phosphorNm, p.phosphorWidthNm));
  return normalisePeak(makeSpectrum(v), 'LED');
}

/** A light through gels (filters on the lamp): E·ΠT, renormalised to peak 1. Grid spectra. */
export function lightThroughGel(light: Spectrum, ...gels: Spectrum[]): Spectrum {
  return normalisePeak(multiply(light, ...gels), 'light through the gel');
}
