/**
 * Skin presets and the makeup department's controls for the skin model (skin.ts): a range of skin
 * tones, calm, flushed, pale and bruised skin, fresh and dried stage blood on skin, and the sliders in the
 * department's words with the physical value each moves. README "Skin, blood and makeup from physics".
 *
 * Calm skin: dermal blood 2 % by volume (Jacques 1998, "Skin optics": 0.2–7 %), oxygen saturation 0.75
 * (a mix of arterial, about 0.97, and venous, about 0.6–0.7, blood; from memory). Flushed: the blood ×4
 * (8 %), the saturation unchanged. Pale: the blood ÷4 (0.5 %). Skin tones: melanin volume fractions chosen so
 * that the model's ITA° (under D65) falls in each class of the individual typology angle (J. Chardon et al.
 * 1991, extended to six classes by S. Del Bino et al. 2006, from memory: very light > 55°, light 41–55°,
 * intermediate 28–41°, tan 10–28°, brown −30–10°, dark < −30°); the figures are in tests/reference/skin.
 */
import { SKIN_LIMITS, type NestedSwatchSource, type SkinParams } from './sources';

/** A skin preset: the model's parameters with a name and a note in the department's words. */
export interface SkinPreset {
  id: string;
  name: string;
  note: string;
  skin: SkinParams;
}

/** A stage-blood preset: a makeup layer of blood over skin. */
export interface BloodPreset {
  id: string;
  name: string;
  note: string;
  makeup: { over: { skin: SkinParams }; colour: NestedSwatchSource; coverage: number };
}

/** Calm dermal blood volume fraction (2 %, inside the 0.2–7 % Jacques 1998 gives; from memory) and its saturation (0.75, from memory). */
export const CALM_BLOOD = 0.02;
export const CALM_OXYGENATION = 0.75;

/**
 * The bruise-age control: skin `base` with a bruise `days` old (0..14), an approximation from memory of
 * how bruises change colour (red-purple the first day, blue-purple for a few days, green-yellow from about
 * day 3 as haemoglobin breaks down to biliverdin and bilirubin, gone in one to two weeks) — not a forensic
 * dating tool:
 *   extravasated blood  Bx(t) = 0.12 · exp(−t / 4 d)          volume fraction added to the dermis
 *   its saturation      Sx(t) = 0.15 + 0.45 · exp(−t / 0.5 d)  pooled blood loses its oxygen within a day
 *   bilirubin           c(t)  = 250 µmol/L · (t / 5 d) · exp(1 − t / 5 d)   peaks on day 5
 * The dermis then holds B = B0 + Bx at saturation (B0·S0 + Bx·Sx)/B. Biliverdin's green is not modelled
 * (no absorption table for it here): the few-days-old bruise is the yellow-brown part of the story.
 */
export function bruiseAt(days: number, base: SkinParams): SkinParams {
  const t = Math.max(0, days);
  const bx = 0.12 * Math.exp(-t / 4);
  const sx = 0.15 + 0.45 * Math.exp(-t / 0.5);
  const blood = Math.min(SKIN_LIMITS.blood.max, base.blood + bx);
  const oxygenation = blood > 0 ? (base.blood * base.oxygenation + bx * sx) / (base.blood + bx) : base.oxygenation;
  const bilirubin = Math.min(SKIN_LIMITS.bilirubin.max, (base.bilirubin ?? 0) + 250 * (t / 5) * Math.exp(1 - t / 5));
  return { ...base, blood, oxygenation, bilirubin };
}

const tone = (melanin: number) => ({ melanin, blood: CALM_BLOOD, oxygenation: CALM_OXYGENATION });
/** The calm light skin the flush, pallor and bruises are made on. */
export const CALM_SKIN: SkinParams = tone(0.03);

/** Skin presets: tones light to dark, then calm, flushed, pale and bruised light skin. */
export const SKIN_PRESETS: readonly SkinPreset[] = Object.freeze([
  { id: 'skin-very-light', name: 'Very light skin', note: 'melanin 1 %, calm blood; ITA° above 55 (very light)', skin: tone(0.01) },
  { id: 'skin-light', name: 'Light skin', note: 'melanin 3 %, calm blood; ITA° 41–55 (light)', skin: tone(0.03) },
  { id: 'skin-intermediate', name: 'Intermediate skin', note: 'melanin 5 %, calm blood; ITA° 28–41 (intermediate)', skin: tone(0.05) },
  { id: 'skin-tan', name: 'Tan skin', note: 'melanin 9 %, calm blood; ITA° 10–28 (tan)', skin: tone(0.09) },
  { id: 'skin-brown', name: 'Brown skin', note: 'melanin 16 %, calm blood; ITA° −30 to 10 (brown)', skin: tone(0.16) },
  { id: 'skin-dark', name: 'Dark skin', note: 'melanin 30 %, calm blood; ITA° below −30 (dark)', skin: tone(0.3) },
  { id: 'skin-very-dark', name: 'Very dark skin', note: 'melanin 45 %, calm blood; ITA° far below −30', skin: tone(0.45) },
  { id: 'skin-calm', name: 'Calm skin', note: 'light skin at rest: blood 2 %, oxygen 0.75', skin: CALM_SKIN },
  { id: 'skin-flushed', name: 'Flushed skin', note: 'the calm skin with four times the blood (8 %): a flush, a hung-over cheek', skin: { ...CALM_SKIN, blood: CALM_BLOOD * 4 } },
  { id: 'skin-pale', name: 'Pale skin', note: 'the calm skin with a quarter of the blood (0.5 %): cold, shock, illness', skin: { ...CALM_SKIN, blood: CALM_BLOOD / 4 } },
  { id: 'skin-bruise-fresh', name: 'Fresh bruise', note: 'half a day old: pooled blood, losing its oxygen (bruise age 0.5 days)', skin: bruiseAt(0.5, CALM_SKIN) },
  { id: 'skin-bruise-old', name: 'Bruise, a few days old', note: 'five days old: less blood, deoxygenated, bilirubin yellowing (bruise age 5 days)', skin: bruiseAt(5, CALM_SKIN) },
]);

/**
 * Stage blood on skin, as makeup layers. The blood layer itself is the skin model with no melanin and the
 * most blood it takes (30 %): a thick, scattering red film — stage blood is a dye in a syrup, chosen to look
 * like blood, so its spectrum is modelled on blood's. Fresh: fully oxygenated (bright arterial red).
 * Dried: blood darkens to brown as its haemoglobin oxidises to methaemoglobin and haemichromes; no table
 * of those is carried, so the dried layer uses deoxyhaemoglobin (saturation 0) plus a broad brown absorber
 * standing in for their absorption rising toward the blue — the eumelanin power law at 10 % (an approximation
 * of the colour, not of the chemistry: methaemoglobin's band at 630 nm is missing).
 */
export const BLOOD_PRESETS: readonly BloodPreset[] = Object.freeze([
  {
    id: 'blood-fresh',
    name: 'Fresh stage blood on skin',
    note: 'a wet layer of bright red blood (oxygenated) over calm light skin, coverage 0.9',
    makeup: { over: { skin: CALM_SKIN }, colour: { skin: { melanin: 0, blood: 0.3, oxygenation: 1 } }, coverage: 0.9 },
  },
  {
    id: 'blood-dried',
    name: 'Dried stage blood on skin',
    note: 'a thinner dried brown crust over calm light skin, coverage 0.75 (deoxygenated blood with a brown absorber standing in for methaemoglobin)',
    makeup: { over: { skin: CALM_SKIN }, colour: { skin: { melanin: 0.1, pheomelanin: 0, blood: 0.3, oxygenation: 0 } }, coverage: 0.75 },
  },
]);

/** One slider of the skin model in the department's words, with the physical quantity it moves. */
export interface SkinControl {
  key: keyof SkinParams | 'bruiseAgeDays';
  label: string;
  min: number;
  max: number;
  step: number;
  unit: string;
  note: string;
  /** true for a control that sets other parameters (bruise age → blood, oxygenation, bilirubin by `bruiseAt`) */
  derived?: boolean;
}

/** The skin model's controls for the UI (ranges from SKIN_LIMITS in sources.ts). */
export const SKIN_CONTROLS: readonly SkinControl[] = Object.freeze([
  { key: 'melanin', label: 'Pigment', ...SKIN_LIMITS.melanin, step: 0.005, unit: 'volume fraction', note: 'epidermal melanin: very light skin about 0.01, light 0.03, tan 0.09, brown 0.16, dark 0.3–0.45' },
  { key: 'blood', label: 'Flush', ...SKIN_LIMITS.blood, step: 0.005, unit: 'volume fraction', note: 'dermal blood: pale 0.005, calm 0.02, flushed 0.08; bruises and blood layers higher' },
  { key: 'oxygenation', label: 'Oxygen', ...SKIN_LIMITS.oxygenation, step: 0.01, unit: 'saturation 0..1', note: 'the blood’s oxygen: high is bright red (arterial 0.97), low is blue-purple (cold, bruised 0.2–0.5); calm 0.75' },
  { key: 'pheomelanin', label: 'Red-yellow pigment', ...SKIN_LIMITS.pheomelanin, step: 0.05, unit: 'share of the melanin', note: 'the share of the pigment that is pheomelanin (freckles, red hair); default 0.2' },
  { key: 'bilirubin', label: 'Yellowing', ...SKIN_LIMITS.bilirubin, step: 5, unit: 'µmol/L', note: 'bilirubin in the skin: the yellow of an old bruise or jaundice; 0 by default' },
  { key: 'carotene', label: 'Carotene', ...SKIN_LIMITS.carotene, step: 5, unit: 'µmol/L', note: 'β-carotene in the outer skin: a golden cast; 0 by default' },
  {
    key: 'bruiseAgeDays',
    label: 'Bruise age',
    min: 0,
    max: 14,
    step: 0.5,
    unit: 'days',
    note: 'adds a bruise of this age to the skin: pooled blood 0.12·e^(−t/4 d) losing its oxygen, bilirubin peaking on day 5 (bruiseAt)',
    derived: true,
  },
]);
