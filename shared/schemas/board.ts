import { z } from 'zod';
import { departmentSchema, type Department } from './roles';
import { itemNameSchema } from './item';

/** Default merge thresholds: within ⅓ stop on the medium yet more than 10 ΔE00 apart to the eye. */
export const DEFAULT_MERGE_STOPS = 1 / 3;
export const DEFAULT_MERGE_DELTA_E = 10;
/** A board shows at most this many looks side by side. */
export const MAX_BOARD_LOOKS = 4;
/**
 * At most this many swatches on one board: a whole production's wardrobe or palette fits, and the board's
 * tones through four looks still answer in a few hundred ms (the bench's `board_2000x4_ms`).
 */
export const MAX_BOARD_SWATCHES = 2000;

const name = itemNameSchema;
const id = z.number().int().positive();
const lookIds = z.array(id).max(MAX_BOARD_LOOKS, `At most ${MAX_BOARD_LOOKS} looks.`).refine((a) => new Set(a).size === a.length, 'A look appears twice.');
const swatchIds = z.array(id).max(MAX_BOARD_SWATCHES, `At most ${MAX_BOARD_SWATCHES} swatches.`).transform((a) => [...new Set(a)]);
const mergeStops = z.number().min(0.01, 'At least 0.01 stop.').max(3, 'At most 3 stops.');
const mergeDeltaE = z.number().min(0, 'At least 0.').max(100, 'At most 100.');

export const boardCreateSchema = z.object({
  name,
  /** default: the creator's department */
  department: departmentSchema.optional(),
  notes: z.string().max(4000).default(''),
  lookIds: lookIds.default([]),
  swatchIds: swatchIds.default([]),
  mergeStops: mergeStops.default(DEFAULT_MERGE_STOPS),
  mergeDeltaE: mergeDeltaE.default(DEFAULT_MERGE_DELTA_E),
});
export type BoardCreateInput = z.input<typeof boardCreateSchema>;

export const boardUpdateSchema = z
  .object({
    name: name.optional(),
    department: departmentSchema.optional(),
    notes: z.string().max(4000).optional(),
    lookIds: lookIds.optional(),
    swatchIds: swatchIds.optional(),
    mergeStops: mergeStops.optional(),
    mergeDeltaE: mergeDeltaE.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change.' });
export type BoardUpdateInput = z.input<typeof boardUpdateSchema>;

/** Query of GET …/boards/:id/tones: look ids (comma-separated) to override the board's own, and thresholds. */
export const boardTonesQuerySchema = z.object({
  looks: z
    .string()
    .regex(/^\d+(,\d+)*$/, 'Look ids separated by commas.')
    .transform((s) => s.split(',').map(Number))
    .refine((a) => a.length <= MAX_BOARD_LOOKS, `At most ${MAX_BOARD_LOOKS} looks.`)
    .optional(),
  mergeStops: z.coerce.number().pipe(mergeStops).optional(),
  mergeDeltaE: z.coerce.number().pipe(mergeDeltaE).optional(),
});

export interface BoardView {
  id: number;
  name: string;
  department: Department;
  notes: string;
  lookIds: number[];
  swatchIds: number[];
  mergeStops: number;
  mergeDeltaE: number;
  createdBy: { id: number; name: string } | null;
  createdAt: string;
  updatedAt: string;
}

/** One swatch's tone through one look. */
export interface SwatchTone {
  swatchId: number;
  /** stops from middle grey on the medium (after the filter factor is opened up and the key placed) */
  stops: number;
  /** stops from middle grey to the eye under the look's light */
  eyeStops: number;
  /** stops − eyeStops (+ reads lighter than it looks) */
  shift: number;
  /** 5 + stops, unrounded */
  zone: number;
  /** nearest zone as '0'..'X' */
  numeral: string;
  /** the simulated grey, sRGB 0..255 */
  grey: number;
  /** texture lost in the shadows / blown in the highlights */
  lost: boolean;
  blown: boolean;
  /** L*a*b* to the eye under the look's light */
  lab: [number, number, number];
  /** how far `stops` could move (same scale): zero width for measured reflectance */
  range: ToneRange;
}

/**
 * How far a tone could move when the swatch's spectrum is estimated, in stops after key placement:
 * `possible` over every reflectance 0..1 with the colour, `plausible` over smooth, realistic ones (and the
 * estimate itself). See shared/spectral/metamer-range.ts.
 */
export interface ToneRange {
  possible: [number, number];
  plausible: [number, number];
}

/** A swatch this one merges with through a look: reads as the same grey on the medium, differs to the eye. */
export interface MergePartner {
  swatchId: number;
  /**
   * true: the plausible ranges of both lie within the threshold of each other entirely (they merge whatever
   * their spectra); false: some plausible spectra would merge them (measure to be sure)
   */
  certain: boolean;
  /** CIEDE2000 to the eye */
  deltaE: number;
}

/**
 * One swatch's merges through one look. `count` is every swatch it merges with (`certainCount` of them
 * certainly); `partners` holds at most MERGE_PARTNERS_KEPT of them, certain ones first, then the nearest on
 * the medium. How far apart on the medium: |stops| of the two tones.
 */
export interface SwatchMerges {
  swatchId: number;
  count: number;
  certainCount: number;
  partners: MergePartner[];
}

/** Partners listed per swatch and look (the counts are complete). */
export const MERGE_PARTNERS_KEPT = 4;

export interface LookTones {
  lookId: number;
  lookName: string;
  filterStops: number;
  /** true when the grey comes from the look's tone pipeline (curve + print), false for a plain display mapping */
  tonePipeline: boolean;
  tones: SwatchTone[];
  /** per swatch that merges with any other through this look (in the order of `tones`): see SwatchMerges */
  merges: SwatchMerges[];
  /** pairs of swatches that merge through this look, and how many of them certainly */
  mergeCount: number;
  certainMergeCount: number;
}

export interface BoardTones {
  boardId: number;
  mergeStops: number;
  mergeDeltaE: number;
  looks: LookTones[];
  /** compute time on the server, ms */
  ms: number;
}
