/**
 * The exposure sheet of a look: GET /api/productions/:productionId/looks/:lookId/sheet (JSON, for the
 * printable page) and …/sheet.pdf (the same content as a PDF). Documented in docs/api-sheets.md.
 */
import type { ToneRange } from './board';
import type { EiChainStepAnswer, ToneSettings } from './exposure';
import type { FilterPlace } from './look';

/** The cautions every sheet carries (common practice on set; the production's own rules come first). */
export const SHEET_CAUTIONS: readonly { title: string; text: string }[] = Object.freeze([
  {
    title: 'Eyes',
    text: 'Very high light levels near performers’ eyes cause discomfort and can harm sight: keep the brightest units off eye lines, give breaks from the light and warn before strikes.',
  },
  {
    title: 'Heat and load',
    text: 'Large tungsten units run very hot and draw heavy current: keep clear of fabric, hair, set dressing and water, and leave the power plan and distribution to licensed electricians.',
  },
  {
    title: 'Rigging and wind',
    text: 'Lamps, stands, frames and large filter or diffusion frames act as sails: sandbag, tie off and lower them in wind, and use safety cables on every rigged unit.',
  },
  {
    title: 'Authority',
    text: 'These figures are planning aids, not safety advice. Defer to the production’s safety officer, licensed electricians and local codes.',
  },
]);

/** The one-line form of the cautions, for the bench. */
export const SHORT_CAUTION =
  'Light at these levels is hot and bright: keep big units off performers’ eyes, mind the heat and electrical load of large tungsten units, and rig lamps and frames safely against wind. Defer to the safety officer, licensed electricians and local codes.';

export interface SheetFactor {
  /** "Daylight" | "Tungsten" | "This look's light" */
  label: string;
  /** the light it is for, e.g. "Tungsten 3200 K" */
  light: string;
  /** filter factor F (×) */
  factor: number;
  /** log2 F, stops */
  stops: number;
  opaque: boolean;
}

export interface SheetSwatch {
  swatchId: number;
  name: string;
  /** colour to the eye, sRGB hex */
  hex: string;
  /** the board it comes from */
  board: string;
  /** stops from middle grey on the medium, key placed */
  stops: number;
  /** 5 + stops, unrounded */
  zone: number;
  numeral: string;
  /** rendered grey, sRGB 0..255 */
  grey: number;
  /** stops on the medium minus stops to the eye */
  shift: number;
  lost: boolean;
  blown: boolean;
  /** the look's key swatch */
  key: boolean;
  /** how far `stops` could move (same scale; zero width when measured) */
  range: ToneRange;
}

export interface ExposureSheet {
  production: { id: number; name: string };
  look: { id: number; name: string; notes: string; updatedAt: string };
  /** light → filters (lens or light) → medium → development → print */
  lightPath: {
    light: string;
    filters: { label: string; on: FilterPlace }[];
    medium: string;
    /** "negative" (curve + print), "sensor" (display) or "eye" */
    toneKind: 'negative' | 'sensor' | 'eye';
    development: string;
    print: string;
  };
  /** the tone model's medium id and the look's tone settings (the page draws the curve from them) */
  toneMediumId: string;
  tone: ToneSettings;
  /** filter factors: the look's own light, daylight and tungsten */
  factors: SheetFactor[];
  /** the EI chain for the look's own light (null for the eye, which has no EI) */
  chain: {
    boxSpeed: number;
    steps: EiChainStepAnswer[];
    totalStops: number;
    unfilteredEI: number;
    effectiveEI: number;
    /** effective EI under daylight and under tungsten */
    byLight: { label: string; light: string; filterStops: number; effectiveEI: number }[];
  } | null;
  /** camera and meter the light levels are for */
  camera: { tStop: number; fps: number; shutterAngle: number; exposureSeconds: number; calibrationConstant: number; calibrationNote: string };
  /** incident light needed at the effective EI for common T-stops (the look's own T-stop included) */
  lightLevels: { tStop: number; lux: number; footcandles: number; unfilteredFootcandles: number }[];
  /** cost of the filter in light against the same look unfiltered */
  cost: { ratio: number; stops: number; text: string } | null;
  key: { description: string; zone: number; numeral: string };
  thresholds: { shadowDetailStops: number; highlightRollOffStops: number };
  /** swatches of the boards that use this look, key first, then lightest to darkest */
  swatches: SheetSwatch[];
  /** swatches left off the sheet for room */
  swatchesLeftOff: number;
  /** the boards they come from */
  boards: string[];
  notes: string;
  cautions: readonly { title: string; text: string }[];
  generatedAt: string;
}
