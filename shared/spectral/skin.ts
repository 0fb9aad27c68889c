/**
 * Skin reflectance from physics: a thin absorbing epidermis over a Kubelka–Munk dermis
 * (README "Skin, blood and makeup from physics"). Every wavelength λ in nm, every coefficient in cm⁻¹.
 *
 * Epidermis (melanin, carotene, baseline), a two-way transmittance:
 *   μa,eu(λ)   = 6.6e11 · λ^−3.33                     eumelanin-like melanosome interior
 *                (S. L. Jacques, "Skin optics", Oregon Medical Laser Center News, Jan 1998; the same law in
 *                mm⁻¹ as 6.6e10 · λ^−3.33 in C. Donner, H. W. Jensen, "A spectral BSSRDF for shading human
 *                skin", Eurographics Symposium on Rendering 2006)
 *   μa,pheo(λ) = 2.9e15 · λ^−4.75                     pheomelanin (Donner & Jensen 2006 give 2.9e14 · λ^−4.75
 *                in mm⁻¹, beside their eumelanin law in mm⁻¹; ×10 for cm⁻¹)
 *   μa,base(λ) = 0.244 + 85.3 · exp(−(λ − 154)/66.2)  bloodless, melanin-free tissue (Jacques 1998)
 *   μa,car(λ)  = ln 10 · ε_car(λ) · c_car             β-carotene, ε_car three Gaussian bands (below; from memory)
 *   μa,epi = m·((1 − p)·μa,eu + p·μa,pheo) + (1 − m)·μa,base + μa,car      m melanin, p pheomelanin share
 *   T²(λ)  = exp(−2 · μa,epi · d),  d = EPIDERMIS_CM (0.01 cm = 100 µm: Jacques 1998's epidermis is 60–100 µm;
 *            the face's is at the thin end of the 50–150 µm anatomy gives).
 * Dermis (blood, bilirubin, baseline), semi-infinite Kubelka–Munk:
 *   μa,oxy(λ) = ln 10 · e_HbO2(λ) · 150 g/L / 64,500 g/mol  (and the same for deoxy-haemoglobin), e from
 *               S. Prahl's tabulated molar extinction (OMLC 1998; data/skin/haemoglobin-prahl-1998.json); whole
 *               blood's 150 g/L and the 64,500 g/mol molar mass are Prahl's
 *   μa,der = B·(S·μa,oxy + (1 − S)·μa,deoxy) + (1 − B)·μa,base + μa,bil      B blood fraction, S oxygenation
 *   μs′(λ) = 2e5 · λ^−1.5 + 2e12 · λ^−4              dermal reduced scattering, Mie + Rayleigh (Jacques 1998)
 *   K = 2·μa,der, S_KM = ¾·μs′                        the two-flux ↔ diffusion relation (W. M. Star,
 *               J. P. A. Marijnissen, M. J. C. van Gemert, Phys. Med. Biol. 33(4), 1988; from memory; their full
 *               form is S = ¾μs′ − ¼μa, whose correction goes negative where μa > 3μs′ in the Soret band, so it
 *               is dropped; the relation wants μa well below μs′, as holds from about 480 to 900 nm for blood up
 *               to 10 %; in the Soret band, where it does not, the reflectance is near zero either way)
 *   R∞ = 1 + K/S − √((K/S)² + 2·K/S)                  Kubelka–Munk, semi-infinite layer
 * Surface: R = r_s + (1 − r_s) · T² · R∞, r_s = 0.028, Fresnel reflection at normal incidence for a
 *   tissue index n = 1.4 (Jacques 1998's skin index) in air; the internal reflection at the surface that
 *   sends some light back down is not modelled (it would raise R a little where skin absorbs little).
 * Bilirubin, a dermal absorber (a bruise's yellow): ε_bil one Gaussian band, peak 55,600 cm⁻¹/M, centre 460 nm,
 *   FWHM 90 nm (the peak value as OMLC's bilirubin page gives it in chloroform, at 451 nm there; centred at 460 nm
 *   as albumin-bound bilirubin in tissue; centre, width and value all from memory).
 * β-carotene: bands at 425, 451, 478 nm of relative heights 0.72, 1, 0.87, each FWHM 28 nm, scaled to a peak
 *   ε = 139,500 cm⁻¹/M (in hexane, as OMLC's β-carotene page gives it; band shape and value from memory).
 *
 * This is the one-dimensional layered model of the issue, not a Monte Carlo of skin: the epidermis
 * is taken to absorb only (its scattering folded into the dermis), and light crosses it twice at normal
 * incidence. It reproduces what a makeup artist and a cinematographer need from skin — the haemoglobin
 * bands, melanin's slope, the red that blood takes away and gives back — not a clinical measurement.
 */
import { z } from 'zod';
import haemoglobinJson from '../../data/skin/haemoglobin-prahl-1998.json';
import { GRID_NM } from './grid';
import { onWorkingGrid } from './policy';
import type { SkinParams } from './sources';
import { makeSpectrum } from './spectrum';
import type { Spectrum } from './types';

/** Defaults of the optional parameters: pheomelanin share 0.2 (most skin's melanin is mostly eumelanin; from memory), no bilirubin, no carotene. */
export const SKIN_DEFAULTS = { pheomelanin: 0.2, bilirubin: 0, carotene: 0 } as const;

/** Epidermal thickness, cm (100 µm; Jacques 1998). */
export const EPIDERMIS_CM = 0.01;
/** Surface (Fresnel) reflection at normal incidence, n = 1.4 in air: ((n − 1)/(n + 1))². */
export const SURFACE_REFLECTION = ((1.4 - 1) / (1.4 + 1)) ** 2;
/** Haemoglobin in whole blood, g/L (Prahl, OMLC hemoglobin summary). */
export const HAEMOGLOBIN_G_PER_L = 150;
/** Molar mass of haemoglobin, g/mol (Prahl, OMLC hemoglobin summary). */
export const HAEMOGLOBIN_G_PER_MOL = 64500;

const LN10 = Math.log(10);

const haemoglobinTable = z.object({
  name: z.string().min(1),
  source: z.string().min(1),
  units: z.string().min(1),
  wavelengthsNm: z.array(z.number()).min(3),
  oxy: z.array(z.number().nonnegative()).min(3),
  deoxy: z.array(z.number().nonnegative()).min(3),
});

/** Prahl's table checked where it loads: equal lengths, increasing wavelengths covering the working grid. */
function loadHaemoglobin() {
  const t = haemoglobinTable.parse(haemoglobinJson);
  if (t.oxy.length !== t.wavelengthsNm.length || t.deoxy.length !== t.wavelengthsNm.length) throw new Error('haemoglobin table: columns of different lengths');
  for (let i = 1; i < t.wavelengthsNm.length; i++) if (!(t.wavelengthsNm[i] > t.wavelengthsNm[i - 1])) throw new Error('haemoglobin table: wavelengths not increasing');
  if (t.wavelengthsNm[0] > GRID_NM[0] || t.wavelengthsNm[t.wavelengthsNm.length - 1] < GRID_NM[GRID_NM.length - 1]) throw new Error('haemoglobin table: does not cover the working grid');
  const toBlood = LN10 * (HAEMOGLOBIN_G_PER_L / HAEMOGLOBIN_G_PER_MOL);
  // inside the table's range the policy's linear interpolation applies; the table covers 250–1000 nm, so nothing is held
  return {
    oxy: onWorkingGrid(t.wavelengthsNm, t.oxy.map((e) => e * toBlood), 'hold'),
    deoxy: onWorkingGrid(t.wavelengthsNm, t.deoxy.map((e) => e * toBlood), 'hold'),
  };
}

const gaussian = (nm: number, centre: number, fwhm: number) => Math.exp(-4 * Math.LN2 * ((nm - centre) / fwhm) ** 2);

const HB = loadHaemoglobin();
const N = GRID_NM.length;
const grid = (fn: (nm: number) => number) => Float64Array.from(GRID_NM, fn);

/** Absorption coefficient of whole blood, fully oxygenated, cm⁻¹ (Prahl's e × 150 g/L / 64,500 g/mol × ln 10). */
export const MUA_OXY_BLOOD: Float64Array = Float64Array.from(HB.oxy);
/** Absorption coefficient of whole blood, fully deoxygenated, cm⁻¹. */
export const MUA_DEOXY_BLOOD: Float64Array = Float64Array.from(HB.deoxy);
/** Eumelanin-like melanosome interior, cm⁻¹: 6.6e11 · λ^−3.33 (Jacques 1998). */
export const MUA_EUMELANIN: Float64Array = grid((nm) => 6.6e11 * nm ** -3.33);
/** Pheomelanin, cm⁻¹: 2.9e15 · λ^−4.75 (Donner & Jensen 2006, 2.9e14 in mm⁻¹). */
export const MUA_PHEOMELANIN: Float64Array = grid((nm) => 2.9e15 * nm ** -4.75);
/** Baseline absorption of bloodless, melanin-free skin, cm⁻¹: 0.244 + 85.3·exp(−(λ − 154)/66.2) (Jacques 1998). */
export const MUA_BASELINE: Float64Array = grid((nm) => 0.244 + 85.3 * Math.exp(-(nm - 154) / 66.2));
/** Dermal reduced scattering, cm⁻¹: 2e5·λ^−1.5 + 2e12·λ^−4 (Jacques 1998). */
export const MUS_REDUCED_DERMIS: Float64Array = grid((nm) => 2e5 * nm ** -1.5 + 2e12 * nm ** -4);
/** Bilirubin absorption per µmol/L, cm⁻¹: ln 10 · 55,600 cm⁻¹/M · 1e-6 M, Gaussian at 460 nm, FWHM 90 nm (from memory). */
export const MUA_BILIRUBIN_PER_UMOL: Float64Array = grid((nm) => LN10 * 55600e-6 * gaussian(nm, 460, 90));
/** β-carotene absorption per µmol/L, cm⁻¹: ln 10 · 139,500 cm⁻¹/M · 1e-6 M at the peak, bands at 425/451/478 nm (from memory). */
export const MUA_CAROTENE_PER_UMOL: Float64Array = (() => {
  const shape = grid((nm) => 0.72 * gaussian(nm, 425, 28) + gaussian(nm, 451, 28) + 0.87 * gaussian(nm, 478, 28));
  const peak = shape.reduce((a, v) => Math.max(a, v), 0);
  return shape.map((v) => (LN10 * 139500e-6 * v) / peak);
})();

/** Kubelka–Munk reflectance of a semi-infinite layer from K/S: R∞ = 1 + K/S − √((K/S)² + 2K/S). */
export function kubelkaMunkRInfinity(kOverS: number): number {
  return 1 + kOverS - Math.sqrt(kOverS * kOverS + 2 * kOverS);
}

/** The optional parameters filled with SKIN_DEFAULTS. */
export function withSkinDefaults(p: SkinParams): Required<SkinParams> {
  return {
    melanin: p.melanin,
    blood: p.blood,
    oxygenation: p.oxygenation,
    pheomelanin: p.pheomelanin ?? SKIN_DEFAULTS.pheomelanin,
    bilirubin: p.bilirubin ?? SKIN_DEFAULTS.bilirubin,
    carotene: p.carotene ?? SKIN_DEFAULTS.carotene,
  };
}

/**
 * Reflectance (0..1) of skin on the working grid (350–900 nm at 1 nm) from its parameters: melanin and
 * blood volume fractions, oxygen saturation 0..1, pheomelanin share 0..1, bilirubin and carotene in
 * µmol/L — a thin absorbing epidermis over a Kubelka–Munk dermis, equations and sources in this file's header.
 * Parameters are taken as validated (shared/spectral/sources.ts skinParamsSchema); values are clamped to 0..1.
 */
export function skinReflectance(p: SkinParams): Spectrum {
  const q = withSkinDefaults(p);
  const m = q.melanin;
  const b = q.blood;
  const s = q.oxygenation;
  const out = new Float64Array(N);
  for (let i = 0; i < N; i++) {
    const base = MUA_BASELINE[i];
    const epi = m * ((1 - q.pheomelanin) * MUA_EUMELANIN[i] + q.pheomelanin * MUA_PHEOMELANIN[i]) + (1 - m) * base + q.carotene * MUA_CAROTENE_PER_UMOL[i];
    const t2 = Math.exp(-2 * epi * EPIDERMIS_CM);
    const der = b * (s * MUA_OXY_BLOOD[i] + (1 - s) * MUA_DEOXY_BLOOD[i]) + (1 - b) * base + q.bilirubin * MUA_BILIRUBIN_PER_UMOL[i];
    const rInf = kubelkaMunkRInfinity((2 * der) / (0.75 * MUS_REDUCED_DERMIS[i]));
    const r = SURFACE_REFLECTION + (1 - SURFACE_REFLECTION) * t2 * rInf;
    out[i] = Math.min(1, Math.max(0, r));
  }
  return makeSpectrum(out);
}
