/**
 * The exposure sheet of a look: GET /api/productions/:productionId/looks/:lookId/sheet (JSON, for the
 * printable page) and …/sheet.pdf (the same content as a PDF). Documented in docs/api-sheets.md.
 */
import { z } from 'zod';
import type { ToneRange } from './board';
import type { EiChainStepAnswer, ToneSettings } from './exposure';
import type { FilterPlace, LightBudgetAnswer } from './look';

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
  /** what to watch: under the shadow-detail threshold (lost), close to it or able to cross it, blown, or nothing */
  flag: SheetFlag | null;
  /** how far `stops` could move (same scale; zero width when measured) */
  range: ToneRange;
}

export interface ExposureSheet {
  production: { id: number; name: string };
  /** the light this look needs against the production's other looks (the first look is 1×); null when it cannot be said (e.g. the eye) */
  lightBudget: LightBudgetAnswer | null;
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
  /** every swatch of the boards on the sheet (and the key swatch), key first, then lightest to darkest; none left off */
  swatches: SheetSwatch[];
  /** the names of the boards on the sheet */
  boards: string[];
  /** every board of the production, to pick the sheet's boards from (`?boards=`) */
  boardChoices: SheetBoardChoice[];
  /** true when the boards were picked (`?boards=`); false: the boards that show the look */
  boardsPicked: boolean;
  notes: string;
  cautions: readonly { title: string; text: string }[];
  generatedAt: string;
}

/**
 * A swatch's flag on the sheet. `lost`: under the shadow-detail threshold (texture lost); `near-lost`:
 * within NEAR_THRESHOLD_STOPS of it, or its plausible range reaches under it; `blown`: over the highlight
 * roll-off; `near-blown`: the same, mirrored.
 */
export type SheetFlag = 'lost' | 'near-lost' | 'blown' | 'near-blown';
/**
 * Within this many stops of a threshold a swatch is "near" it. Fact of the trade (common practice): shadow
 * detail holds about 4 stops under the key on a classic negative and about 5 on a modern one, so the limit
 * itself is known to about a stop.
 */
export const NEAR_THRESHOLD_STOPS = 1;
/** The words of each flag, for the page and the PDF. */
export const SHEET_FLAG_WORDS: Readonly<Record<SheetFlag, string>> = Object.freeze({
  lost: 'texture lost',
  'near-lost': 'near shadow limit',
  blown: 'blown',
  'near-blown': 'near highlight limit',
});

export interface SheetBoardChoice {
  id: number;
  name: string;
  department: string;
  swatchCount: number;
  /** the board shows the look (one of its up to four looks) */
  showsLook: boolean;
  /** its swatches are on this sheet */
  onSheet: boolean;
}

/** At most this many looks in one PDF of the day's sheets. */
export const MAX_DAY_SHEETS = 24;

/** A query parameter of comma-separated ids, e.g. "1,2,3" → [1, 2, 3] (repeats dropped, order kept); "" → []. */
const idList = (what: string) =>
  z.string().trim().refine((v) => v === '' || /^\d+(\s*,\s*\d+)*$/.test(v), `Give ${what} ids as numbers separated by commas, e.g. 1,2,3.`)
    .transform((v) => [...new Set(v === '' ? [] : v.split(',').map((x) => Number(x.trim())))])
    .refine((a) => a.every((n) => Number.isSafeInteger(n) && n > 0), `Give ${what} ids as positive whole numbers.`);

/** GET …/looks/:lookId/sheet(.pdf)?boards=1,2: the boards whose swatches the sheet lists (absent: the boards that show the look). */
export const sheetQuerySchema = z.object({ boards: idList('board').optional() });
/** GET /api/productions/:id/sheets.pdf?looks=1,2,3: the looks, one sheet after another. */
export const daySheetsQuerySchema = z.object({
  looks: z.string({ error: 'Choose the looks: looks=1,2,3.' }).pipe(idList('look'))
    .refine((a) => a.length > 0, 'Choose at least one look.')
    .refine((a) => a.length <= MAX_DAY_SHEETS, `At most ${MAX_DAY_SHEETS} looks in one PDF.`),
});
