/**
 * From the negative to what the eye sees: a print (paper curve, contrast grade, print exposure) or, for a
 * sensor, a display curve; then the IEC 61966-2-1 (sRGB) encoding of the resulting grey (srgbEncode, the
 * one sRGB transfer function, in shared/spectral/colour.ts; re-exported here).
 *
 * Print grey is the print's reflectance relative to the paper white (1 = paper white), i.e. a relative
 * luminance, which is shown as an sRGB grey with the paper white at 255.
 */
import { MIDDLE_GREY } from '../spectral/limits';
import { type CharacteristicCurve, type CurveShape, density, makeCurve, netDensity, solveIncreasing } from './characteristic-curve';

export { srgbDecode, srgbEncode } from '../spectral/colour';

/** An encoded sRGB value 0..1 as an 8-bit code 0..255 (rounded). */
export function to8bit(encoded: number): number {
  return Math.round(Math.min(1, Math.max(0, encoded)) * 255);
}

// ---------------------------------------------------------------- print

/** Contrast grades accepted: −1 (the extra-soft "00") to 5 (extra hard); 2 is normal. */
export const GRADE_RANGE: readonly [number, number] = [-1, 5];

/**
 * A generic glossy paper (Grisaille model, typical values): base 0.06, maximum density 2.10, a long toe
 * (the highlights' gentle roll-off) and a short shoulder. Softness in density units, as for the negative.
 */
export const DEFAULT_PAPER_SHAPE: CurveShape = Object.freeze({ baseFog: 0.06, dMax: 2.1, toe: 0.3, shoulder: 0.1 });

/** Paper exposure range at grade 2, log10 units (Grisaille model value, see gradeRange). */
export const GRADE_2_RANGE = 1.6;
/** Contrast (gamma) step between neighbouring grades (Grisaille model value). */
export const GRADE_GAMMA_STEP = 1.2;

/**
 * The paper's exposure range for a contrast grade, log10 units (end points as in paperRange). Model values:
 * 1.6 at grade 2, chosen so that a negative developed to the ISO 6 contrast prints its zones II..IX close to
 * the print greys the zone system usually gives them (common practice, from memory); each grade harder
 * divides the range (multiplies the paper gamma) by 1.2. Harder grade = shorter range = more contrast.
 */
export function gradeRange(grade: number): number {
  if (!Number.isFinite(grade) || grade < GRADE_RANGE[0] || grade > GRADE_RANGE[1]) {
    throw new RangeError(`contrast grade must be between ${GRADE_RANGE[0]} and ${GRADE_RANGE[1]}`);
  }
  return GRADE_2_RANGE / GRADE_GAMMA_STEP ** (grade - 2);
}

/**
 * The paper's useful exposure range of a curve, log10 units: from 0.04 above the base to 0.9 × its
 * maximum density (the ISO 6846 style end points).
 */
export function paperRange(paper: CharacteristicCurve): number {
  const lo = solveIncreasing((x) => netDensity(paper, x), 0.04);
  const hi = solveIncreasing((x) => density(paper, x), 0.9 * paper.dMax);
  return hi - lo;
}

/**
 * The paper curve for a contrast grade: its gamma is set so that paperRange equals gradeRange(grade).
 * The curve's x axis is log10 of the printing light reaching the paper (arbitrary origin: the inertia at 0).
 */
export function paperCurve(grade: number, shape: CurveShape = DEFAULT_PAPER_SHAPE): CharacteristicCurve {
  const unit = makeCurve({ ...shape, gamma: 1, inertiaLogH: 0 });
  // ranges on the x axis scale exactly as 1/gamma (the shape is fixed in density units)
  return makeCurve({ ...shape, gamma: paperRange(unit) / gradeRange(grade), inertiaLogH: 0 });
}

/** A print: the paper curve and the log10 printing light with which it is exposed. */
export interface PrintMapping {
  paper: CharacteristicCurve;
  /** log10 printing light at the paper through a negative of density 0 */
  printLightLog: number;
}

/**
 * The print's target for middle grey: its reflectance relative to paper white (a relative luminance 0..1),
 * 18 % — middle grey printed as middle grey, so the one MIDDLE_GREY (shared/spectral/limits.ts).
 */
export const PRINT_MIDDLE_GREY = MIDDLE_GREY;

/**
 * Times a print: finds the printing light that renders the negative density `greyDensity` (that of middle
 * grey at the key exposure) as 18 % of paper white, then adds `printExposureStops` stops of printing light
 * (+ = more light = a darker print; stops of printing light, not of camera exposure).
 */
export function timePrint(paper: CharacteristicCurve, greyDensity: number, printExposureStops = 0): PrintMapping {
  const xGrey = solveIncreasing((x) => netDensity(paper, x), -Math.log10(PRINT_MIDDLE_GREY));
  if (!Number.isFinite(xGrey)) throw new RangeError('the paper cannot print middle grey');
  return { paper, printLightLog: xGrey + greyDensity + printExposureStops * Math.log10(2) };
}

/** Print density (total) for a negative of total density `negativeDensity`. */
export function printDensity(p: PrintMapping, negativeDensity: number): number {
  return density(p.paper, p.printLightLog - negativeDensity);
}

/** Print grey: the print's reflectance relative to paper white, 0..1, for a negative density. */
export function printGrey(p: PrintMapping, negativeDensity: number): number {
  return 10 ** -(printDensity(p, negativeDensity) - p.paper.baseFog);
}

// ---------------------------------------------------------------- display (sensors)

/** A sensor shown on a display: linear signal clipped at `headroomStops` above middle grey, then a soft shoulder. */
export interface DisplayCurve {
  /** stops above middle grey (after key placement) at which the sensor clips */
  headroomStops: number;
  /** shoulder softness, stops */
  shoulderStops: number;
}

/** Stops from middle grey to display white: log2(1 / 0.18) ≈ 2.47. */
export const DISPLAY_WHITE_STOPS = Math.log2(1 / PRINT_MIDDLE_GREY);

/** Display contrast for a grade: 1 at grade 2, × 1.2 per grade harder, like the paper (Grisaille model). */
export function displayContrast(grade: number): number {
  gradeRange(grade);
  return GRADE_GAMMA_STEP ** (grade - 2);
}

/**
 * Display grey (relative luminance 0..1, display white = 1) of a sensor exposure `stopsAfterKey` stops from
 * middle grey (after key placement). Middle grey shows as 0.18; `displayExposureStops` (+ = darker) and
 * `grade` (contrast about middle grey) act like print exposure and paper grade; above the sensor clip the
 * signal no longer rises.
 */
export function displayGrey(stopsAfterKey: number, curve: DisplayCurve, grade = 2, displayExposureStops = 0): number {
  const k = curve.shoulderStops;
  const softplus = (z: number) => Math.max(z, 0) + Math.log1p(Math.exp(-Math.abs(z)));
  const softmin = (a: number) => DISPLAY_WHITE_STOPS - k * softplus((DISPLAY_WHITE_STOPS - a) / k);
  const s = Math.min(stopsAfterKey, curve.headroomStops) - displayExposureStops;
  const o = softmin(displayContrast(grade) * s) - softmin(0);
  return Math.min(1, PRINT_MIDDLE_GREY * 2 ** o);
}
