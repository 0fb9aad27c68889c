/**
 * The light a set needs, from the incident-light exposure equation of ISO 2720:
 *   N² / t = E · S / C    →    E = C · N² / (t · S)
 * N: f-number (here the T-stop, as cine lenses and meters are read), t: exposure time in s,
 * S: ISO arithmetic speed (the exposure index), E: illuminance in lux, C: the incident-meter calibration
 * constant in lux·s. ISO 2720 gives C = 240…400 for a flat receptor and 320…540 for a hemispherical
 * one; Grisaille's default is C = 250 (flat receptor, the commonly used value). The foot-candle form of
 * the same equation uses C / 10.764.
 */
import { MIDDLE_GREY } from '../spectral/limits';

/** 1 foot-candle = 1 lm/ft² = 1 / 0.3048² lux ≈ 10.764 lux (definition; the international foot is 0.3048 m). */
export const LUX_PER_FOOTCANDLE = 1 / 0.3048 ** 2;
/** ISO 2720 flat-receptor incident constant, commonly used value, lux·s. */
export const INCIDENT_C_FLAT = 250;
/** ISO 2720 hemispherical-receptor incident constant, a typical value inside 320…540, lux·s. */
export const INCIDENT_C_HEMISPHERICAL = 330;
/** Grisaille's default meter calibration constant: the flat receptor's 250 lux·s. */
export const DEFAULT_INCIDENT_C = INCIDENT_C_FLAT;
/** A short description of the default constant, for answers and sheets. */
export const DEFAULT_INCIDENT_C_NOTE = 'ISO 2720 incident-light constant for a flat receptor, C = 250 (E in lux)';

/** Exposure time, s, of a rotary shutter: t = angle / (360 · fps). 180° at 24 fps → 1/48 s. */
export function shutterTimeSeconds(fps: number, shutterAngleDeg: number): number {
  if (!(fps > 0)) throw new RangeError('fps must be positive');
  if (!(shutterAngleDeg > 0 && shutterAngleDeg <= 360)) throw new RangeError('shutter angle must be in (0, 360] degrees');
  return shutterAngleDeg / (360 * fps);
}

/** Incident illuminance in lux for T-stop `tStop`, time `seconds`, exposure index `ei`, constant `c` (lux·s). */
export function incidentLux(ei: number, tStop: number, seconds: number, c: number = DEFAULT_INCIDENT_C): number {
  if (!(ei > 0)) throw new RangeError('ei must be positive');
  if (!(tStop > 0)) throw new RangeError('tStop must be positive');
  if (!(seconds > 0)) throw new RangeError('exposure time must be positive');
  if (!(c > 0)) throw new RangeError('calibration constant must be positive');
  return (c * tStop * tStop) / (seconds * ei);
}

/** Lux → foot-candles. */
export function luxToFootcandles(lux: number): number {
  return lux / LUX_PER_FOOTCANDLE;
}
/** Foot-candles → lux. */
export function footcandlesToLux(fc: number): number {
  return fc * LUX_PER_FOOTCANDLE;
}

export interface LightLevelInput {
  ei: number;
  tStop: number;
  fps: number;
  shutterAngle: number;
  /** meter calibration constant, lux·s; default DEFAULT_INCIDENT_C */
  calibrationConstant?: number;
}

export interface LightLevel {
  /** exposure time, s */
  exposureSeconds: number;
  /** the constant used, lux·s */
  calibrationConstant: number;
  lux: number;
  footcandles: number;
}

/** The incident light (lux and foot-candles) needed at an EI, T-stop, frame rate and shutter angle. */
export function lightLevel(input: LightLevelInput): LightLevel {
  const c = input.calibrationConstant ?? DEFAULT_INCIDENT_C;
  const t = shutterTimeSeconds(input.fps, input.shutterAngle);
  const lux = incidentLux(input.ei, input.tStop, t, c);
  return { exposureSeconds: t, calibrationConstant: c, lux, footcandles: luxToFootcandles(lux) };
}

export interface LightCost {
  /** how many times the light of the reference the look needs (2 = twice the light) */
  ratio: number;
  /** the same in stops, log2(ratio) */
  stops: number;
}

/**
 * Cost of a look in light against a reference, from the two exposure indices (same T-stop and shutter):
 * ratio = referenceEI / lookEI (light scales as 1 / EI).
 */
export function lightCost(lookEI: number, referenceEI: number): LightCost {
  if (!(lookEI > 0) || !(referenceEI > 0)) throw new RangeError('exposure indices must be positive');
  const ratio = referenceEI / lookEI;
  return { ratio, stops: Math.log2(ratio) };
}

/** Plain words for a light cost: "needs 3.2× the light of the unfiltered one" (ratio with two figures). */
export function describeLightCost(ratio: number, reference = 'the unfiltered one'): string {
  if (!(ratio > 0)) throw new RangeError('ratio must be positive');
  const shown = ratio >= 10 ? ratio.toFixed(0) : Number(ratio.toPrecision(2)).toString();
  if (Math.abs(ratio - 1) < 0.005) return `needs the same light as ${reference}`;
  return `needs ${shown}× the light of ${reference}`;
}

/** ISO 2720 camera-exposure factor q = 0.65 (lens transmission, vignetting and flare; standard value). */
export const CAMERA_EXPOSURE_Q = 0.65;

/**
 * Exposure (lux·s) at the film plane of a middle-grey (18 %) surface lit by the meter's recommended
 * incident light at exposure index `ei`: H = q · 0.18 · C / (π · EI) (ISO 2720 incident metering, a
 * matte surface of reflectance MIDDLE_GREY = 0.18). 9.31 / EI lux·s with the defaults.
 */
export function middleGreyExposureLuxSeconds(ei: number, c: number = DEFAULT_INCIDENT_C): number {
  if (!(ei > 0)) throw new RangeError('ei must be positive');
  return (CAMERA_EXPOSURE_Q * MIDDLE_GREY * c) / (Math.PI * ei);
}
