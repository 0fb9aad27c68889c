/**
 * The tone pipeline: a medium exposure m (linear, 0.18 = middle grey, from the spectral engine after the
 * filter factor is opened up) → key placement → characteristic curve with development → print (or, for
 * a sensor, a display curve) → sRGB grey; with density, print grey, zone and lost/blown flags.
 *
 * Negatives: the film is exposed at the rated EI (box speed · 2^ratingStops) under the key light, so a
 * middle grey gets H = q·0.18·C / (π·EI) lux·s (ISO 2720 incident metering); the print is timed so that
 * zone V prints at 18 % of paper white, then moved by the print exposure.
 * Sensors use the display curve (grade = contrast, print exposure = display exposure); the eye is shown
 * linearly (Y = m, sRGB-encoded; print exposure applies, grade does not).
 * Effective thresholds: rating slower, or pushing (its real speed gain), gives the shadows that many
 * more stops of room; a sensor rated slower loses as much highlight headroom as it gains shadow room.
 */
import { srgbEncode } from '../spectral/colour';
import { MIDDLE_GREY } from '../spectral/limits';
import { type CharacteristicCurve, type CurveShape, density } from './characteristic-curve';
import { type DevelopmentModel, DEFAULT_DEVELOPMENT_MODEL, developCurve, developmentSpeedStops } from './development';
import { curveForIsoSpeed } from './iso-speed';
import { middleGreyExposureLuxSeconds } from './light-level';
import { type MediumToneDefaults, mediumToneDefaults } from './media-tone';
import {
  DEFAULT_PAPER_SHAPE,
  type DisplayCurve,
  type PrintMapping,
  displayGrey,
  paperCurve,
  printDensity,
  printGrey,
  timePrint,
  to8bit,
} from './print';
import { ZONE_NUMERALS, stopsFromMiddleGrey, stopsFromZone, toneFlags, zoneFromStops, zoneNumeral } from './zones';

/** The tone settings a look carries (the shape of shared/schemas/exposure toneSettingsSchema's output). */
export interface ToneSettingsLike {
  /** push (+) / pull (−), stops */
  developmentStops: number;
  /** rating adjustment from box speed, stops (− = rated slower) */
  ratingStops: number;
  /** print contrast grade, −1..5 (2 normal) */
  printGrade: number;
  /** print exposure, stops (+ = darker print) */
  printExposureStops: number;
  /** shadow-detail threshold, stops under zone V; null = the medium's default */
  shadowDetailStops: number | null;
  /** highlight roll-off, stops over zone V; null = the medium's default */
  highlightRollOffStops: number | null;
}

/** Normal development, box rating, grade 2, no print correction, the medium's thresholds. */
export const DEFAULT_TONE_SETTINGS: ToneSettingsLike = Object.freeze({
  developmentStops: 0,
  ratingStops: 0,
  printGrade: 2,
  printExposureStops: 0,
  shadowDetailStops: null,
  highlightRollOffStops: null,
});

export interface TonePipelineOptions {
  mediumId: string;
  settings?: Partial<ToneSettingsLike>;
  /**
   * stops every tone is moved by (stops after key = stops before key + offsetStops): the key placement,
   * keyOffsetStops(keyStopsBeforeKey, keyZone) from zones.ts, where keyStopsBeforeKey is the key swatch's
   * medium stops as metered (0 for middle grey); default 0
   */
  offsetStops?: number;
  /** box speed override (else the medium's default) */
  boxSpeed?: number;
  development?: DevelopmentModel;
  paperShape?: CurveShape;
}

export interface ToneResult {
  /** the medium exposure given, before key placement (linear, 0.18 = middle grey; values under 1e-6 are taken as 1e-6) */
  m: number;
  /** stops from middle grey after key placement */
  stops: number;
  /** zone after key placement: 5 + stops, unrounded */
  zone: number;
  /** nearest zone, '0'..'X' */
  numeral: string;
  /** log10 exposure at the film, lux·s (negatives only) */
  logH: number | null;
  /** negative density, total (negatives only) */
  density: number | null;
  /** print density, total (negatives only) */
  printDensity: number | null;
  /** the print's (or display's) relative luminance, 0..1, white = 1 */
  printGrey: number;
  /** sRGB-encoded grey, 0..1 (IEC 61966-2-1) */
  srgb: number;
  /** sRGB grey, 0..255 */
  srgb8: number;
  lost: boolean;
  blown: boolean;
}

export interface ZoneMark {
  zone: number;
  numeral: string;
  /** log10 exposure, lux·s */
  logH: number;
  /** negative density */
  density: number;
}

export interface TonePipeline {
  mediumId: string;
  defaults: MediumToneDefaults;
  settings: ToneSettingsLike;
  /** the rated EI (box · 2^rating), unrounded; null for the eye */
  ratedEI: number | null;
  /** the developed curve (negatives only) */
  curve: CharacteristicCurve | null;
  /** the timed print (negatives only) */
  print: PrintMapping | null;
  /** the display curve (sensors only), headroom already moved by the rating */
  display: DisplayCurve | null;
  /** thresholds in force, stops from zone V (positive numbers) */
  shadowDetailStops: number;
  highlightRollOffStops: number;
  /** renders a medium exposure m as metered (linear, 0.18 = middle grey; before key placement) */
  render(m: number): ToneResult;
  /** renders a tone given in stops from middle grey before key placement */
  renderStops(stopsBeforeKey: number): ToneResult;
  /**
   * renderStops(stopsBeforeKey).srgb alone, the same arithmetic in the same order (so the same bits) without
   * the rest of the result: for tabulating the tone curve (shared/look/tone-curve-table.ts), 1,025 samples
   * per look composed
   */
  srgbOfStops(stopsBeforeKey: number): number;
  /** renderStops(stopsBeforeKey).stops alone (stops after key placement, the same bits) */
  stopsAfterKey(stopsBeforeKey: number): number;
  /** zones 0..X on the curve's log H axis, for charts (empty unless a negative) */
  zoneMarks(): ZoneMark[];
}

const M_FLOOR = 1e-6;

/** Builds the tone pipeline of a medium id with a look's tone settings (see TonePipelineOptions). */
export function buildTonePipeline(opts: TonePipelineOptions): TonePipeline {
  const defaults = mediumToneDefaults(opts.mediumId);
  const settings: ToneSettingsLike = { ...DEFAULT_TONE_SETTINGS, ...stripUndefined(opts.settings ?? {}) };
  const offset = opts.offsetStops ?? 0;
  const shadowSetting = settings.shadowDetailStops ?? defaults.shadowDetailStops;
  const highlightSetting = settings.highlightRollOffStops ?? defaults.highlightRollOffStops;
  const rating = settings.ratingStops;

  let curve: CharacteristicCurve | null = null;
  let print: PrintMapping | null = null;
  let display: DisplayCurve | null = null;
  let ratedEI: number | null = null;
  let logHGrey = 0;
  let shadow = shadowSetting;
  let highlight = highlightSetting;

  if (defaults.kind === 'negative') {
    const box = opts.boxSpeed ?? defaults.boxSpeed;
    ratedEI = box * 2 ** rating;
    const model = opts.development ?? DEFAULT_DEVELOPMENT_MODEL;
    curve = developCurve(curveForIsoSpeed(defaults.shape, box), settings.developmentStops, model);
    logHGrey = Math.log10(middleGreyExposureLuxSeconds(ratedEI));
    print = timePrint(paperCurve(settings.printGrade, opts.paperShape ?? DEFAULT_PAPER_SHAPE), density(curve, logHGrey), settings.printExposureStops);
    shadow = shadowSetting - rating + developmentSpeedStops(settings.developmentStops, model);
  } else if (defaults.kind === 'sensor') {
    ratedEI = (opts.boxSpeed ?? defaults.boxSpeed) * 2 ** rating;
    display = { ...defaults.display, headroomStops: defaults.display.headroomStops + rating };
    shadow = shadowSetting - rating;
    highlight = highlightSetting + rating;
  }

  const renderStops = (stopsBeforeKeyGiven: number): ToneResult => {
    const stopsBeforeKey = Math.max(stopsBeforeKeyGiven, stopsFromMiddleGrey(M_FLOOR));
    const stops = stopsBeforeKey + offset; // after key placement
    const zone = zoneFromStops(stops);
    let logH: number | null = null;
    let dNeg: number | null = null;
    let dPrint: number | null = null;
    let grey: number;
    if (curve && print) {
      logH = logHGrey + stops * Math.log10(2);
      dNeg = density(curve, logH);
      dPrint = printDensity(print, dNeg);
      grey = printGrey(print, dNeg);
    } else if (display) {
      grey = displayGrey(stops, display, settings.printGrade, settings.printExposureStops);
    } else {
      grey = Math.min(1, MIDDLE_GREY * 2 ** (stops - settings.printExposureStops));
    }
    const srgb = srgbEncode(grey);
    return {
      m: MIDDLE_GREY * 2 ** stopsBeforeKey,
      stops,
      zone,
      numeral: zoneNumeral(zone),
      logH,
      density: dNeg,
      printDensity: dPrint,
      printGrey: grey,
      srgb,
      srgb8: to8bit(srgb),
      ...toneFlags(stops, shadow, highlight),
    };
  };

  const floorStops = stopsFromMiddleGrey(M_FLOOR);
  const log10Of2 = Math.log10(2);
  const stopsAfterKey = (stopsBeforeKeyGiven: number): number => Math.max(stopsBeforeKeyGiven, floorStops) + offset;
  // renderStops's grey and its encoding only: the same expressions in the same order (no density of the
  // print for the result, no zone, numeral, flags or result object)
  const srgbOfStops = (stopsBeforeKeyGiven: number): number => {
    const stops = Math.max(stopsBeforeKeyGiven, floorStops) + offset;
    let grey: number;
    if (curve && print) grey = printGrey(print, density(curve, logHGrey + stops * log10Of2));
    else if (display) grey = displayGrey(stops, display, settings.printGrade, settings.printExposureStops);
    else grey = Math.min(1, MIDDLE_GREY * 2 ** (stops - settings.printExposureStops));
    return srgbEncodeInline(grey);
  };

  return {
    mediumId: opts.mediumId,
    defaults,
    settings,
    ratedEI,
    curve,
    print,
    display,
    shadowDetailStops: shadow,
    highlightRollOffStops: highlight,
    render: (m: number) => renderStops(stopsFromMiddleGrey(Math.max(m, M_FLOOR))),
    renderStops,
    srgbOfStops,
    stopsAfterKey,
    zoneMarks: () => {
      const c = curve;
      if (!c) return [];
      return ZONE_NUMERALS.map((numeral, zone) => {
        const logH = logHGrey + stopsFromZone(zone) * Math.log10(2);
        return { zone, numeral, logH, density: density(c, logH) };
      });
    },
  };
}

/**
 * colour.ts srgbEncode (IEC 61966-2-1 encoding, clamped to 0..1) with culori's channel function written
 * out, the same operations in the same order (so the same bits; tests/unit/tone/tone-pipeline-lean.test.ts
 * checks it against srgbEncode), without the colour objects culori's converter makes per call: the tone
 * table encodes 1,025 greys per look composed. srgbEncode stays the one definition everything else calls.
 */
export function srgbEncodeInline(linear: number): number {
  const c = Math.min(1, Math.max(0, linear));
  const abs = Math.abs(c);
  if (abs > 0.0031308) return (Math.sign(c) || 1) * (1.055 * Math.pow(abs, 1 / 2.4) - 0.055);
  return c * 12.92;
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}
