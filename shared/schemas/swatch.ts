import { z } from 'zod';
import './messages';
import { itemNameSchema, type ItemView } from './item';
import { optionalNameText } from './names';
import { makeupParamsSchema, skinParamsSchema, type MakeupParams, type SkinParams } from '../spectral/sources';
import { departmentSchema, type Department } from './roles';

/** Largest text of a measured-reflectance file accepted, characters. */
export const MAX_TABLE_CHARS = 500_000;
/** At most this many `[nm, value]` pairs given directly. */
export const MAX_TABLE_PAIRS = 4000;

/** The name of a production item (swatch, curve, …). */
const name = itemNameSchema;
const notes = z.string().max(4000, 'Notes take at most 4000 characters.');
const pair = z.tuple([z.number(), z.number()]);
export const pairsSchema = z.array(pair).min(3, 'At least 3 points.').max(MAX_TABLE_PAIRS, `At most ${MAX_TABLE_PAIRS} points.`);

export const hexSchema = z
  .string()
  .trim()
  .regex(/^#([0-9a-fA-F]{6}|[0-9a-fA-F]{3})$/, 'A colour like #a33b3b.')
  .transform((s) => s.toLowerCase());

const rgbChannel = z.number().min(0, 'RGB values go from 0 to 255.').max(255, 'RGB values go from 0 to 255.');
const labL = z.number().min(0, 'L* goes from 0 (black) to 100 (white).').max(100, 'L* goes from 0 (black) to 100 (white).');
const labAB = z.number().min(-128, 'a* and b* go from −128 to 128.').max(128, 'a* and b* go from −128 to 128.');

/** A colour given by a person: sRGB hex, sRGB 0..255, or CIE L*a*b* (D65) inside the sRGB gamut. */
export const colourInputSchema = z.discriminatedUnion('space', [
  z.object({ space: z.literal('hex'), hex: hexSchema }),
  z.object({ space: z.literal('rgb'), rgb: z.tuple([rgbChannel, rgbChannel, rgbChannel]) }),
  z.object({ space: z.literal('lab'), lab: z.tuple([labL, labAB, labAB]) }),
]);
export type ColourInput = z.infer<typeof colourInputSchema>;

export const REFLECTANCE_BASES = ['fraction', 'percent'] as const;
export const reflectanceBasisSchema = z.enum(REFLECTANCE_BASES);

/** A table of wavelength and value: the text of a CSV/TSV/semicolon file, or pairs. Exactly one. */
export const tableInputSchema = z
  .object({
    text: z.string().max(MAX_TABLE_CHARS, 'The file is too large.').optional(),
    samples: pairsSchema.optional(),
    fileName: optionalNameText(200).optional(),
    /** 0-based column of the values in the file (default 1) */
    valueColumn: z.number().int().min(1).max(20).optional(),
    /** in a CGATS file of several samples, the one to read: its SAMPLE_ID, SAMPLE_NAME or 1-based index */
    sample: z.string().trim().min(1).max(200).optional(),
  })
  .refine((t) => (t.text === undefined) !== (t.samples === undefined), { message: 'Give either the file text or the samples.', path: ['text'] });

/** How a swatch is given. */
export const swatchOriginInputSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('colour'), colour: colourInputSchema }),
  z.object({ type: z.literal('measured'), basis: reflectanceBasisSchema, table: tableInputSchema }),
  z.object({
    type: z.literal('photo'),
    photoId: z.number().int().positive(),
    /** region in the photo's pixels: x, y, width, height */
    rect: z.tuple([z.number().int().min(0), z.number().int().min(0), z.number().int().positive(), z.number().int().positive()]),
    /** the region's mean colour */
    colour: colourInputSchema,
  }),
  /** skin from the physical model (shared/spectral/skin.ts): volume fractions and saturation 0..1 */
  z.object({ type: z.literal('skin'), skin: skinParamsSchema }),
  /** a layer of paint over a surface with a coverage 0..1 (shared/spectral/makeup.ts) */
  z.object({ type: z.literal('makeup'), makeup: makeupParamsSchema }),
]);
export type SwatchOriginInput = z.infer<typeof swatchOriginInputSchema>;

/** What a swatch keeps of its origin (the measured pairs themselves are kept on the swatch). */
export type SwatchOrigin =
  | { type: 'colour'; colour: ColourInput }
  | { type: 'measured'; basis: (typeof REFLECTANCE_BASES)[number]; fileName: string | null; points: number }
  | { type: 'photo'; photoId: number; rect: [number, number, number, number]; colour: ColourInput }
  | { type: 'skin'; skin: SkinParams }
  | { type: 'makeup'; makeup: MakeupParams };

/** A surface's own light against the key, stops: + lit hotter, − under (the white wall +1, a face in fill −2). */
export const MAX_LIGHT_STOPS = 4;
export const lightStopsSchema = z
  .number()
  .min(-MAX_LIGHT_STOPS, `The light on the surface goes from −${MAX_LIGHT_STOPS} to +${MAX_LIGHT_STOPS} stops.`)
  .max(MAX_LIGHT_STOPS, `The light on the surface goes from −${MAX_LIGHT_STOPS} to +${MAX_LIGHT_STOPS} stops.`);

export const swatchCreateSchema = z.object({
  name,
  /** default: the creator's department */
  department: departmentSchema.optional(),
  notes: notes.default(''),
  origin: swatchOriginInputSchema,
  /** its own light against the key, stops (default 0: lit as the key) */
  lightStops: lightStopsSchema.default(0),
});
export type SwatchCreateInput = z.input<typeof swatchCreateSchema>;

export const swatchUpdateSchema = z
  .object({
    name: name.optional(),
    department: departmentSchema.optional(),
    notes: notes.optional(),
    origin: swatchOriginInputSchema.optional(),
    lightStops: lightStopsSchema.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change.' });
export type SwatchUpdateInput = z.input<typeof swatchUpdateSchema>;

/** A swatch as the API answers it. */
export interface SwatchView extends ItemView {
  department: Department;
  origin: SwatchOrigin;
  /** its colour to the eye, sRGB */
  hex: string;
  /**
   * 'measured' when a reflectance was given; 'modelled' for skin and makeup (the physical model's
   * reflectance; a makeup whose paint is a colour value is still estimated in its tones' ranges);
   * else the spectrum is estimated from the colour
   */
  spectrum: 'measured' | 'modelled' | 'estimated';
  /** its own light against the key, stops (+ hotter, − under); tones move by it */
  lightStops: number;
  /** the reflectance on the grid ([nm, 0..1]); measured, or the estimate */
  reflectance?: [number, number][];
}

/** Largest spectrophotometer file (CGATS.17, Argyll .sp/.ti3) accepted for a swatch import, bytes. */
export const MAX_IMPORT_BYTES = 4 * 1024 * 1024;
/** Most samples one import may add. */
export const MAX_IMPORT_SAMPLES = 500;

/** An empty form field is no value. */
const blankAsMissing = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);

/**
 * The form fields beside the `file` part of `POST …/swatches/import` (and `/import/preview`): the department
 * of the new swatches (default: the board's, else the importer's) and a board of the production to put them on.
 */
export const swatchImportFieldsSchema = z.object({
  department: z.preprocess(blankAsMissing, departmentSchema.optional()),
  boardId: z.preprocess(blankAsMissing, z.coerce.number().int('A board id.').positive('A board id.').optional()),
});
export type SwatchImportFields = z.input<typeof swatchImportFieldsSchema>;

/** One sample of an import preview. */
export interface SwatchImportPreviewSample {
  name: string;
  /** its colour under D65, sRGB */
  hex: string;
  /** measured points in the file */
  points: number;
  firstNm: number;
  lastNm: number;
  /** the 1-based line of its set in the file */
  line: number;
}

/** What `POST …/swatches/import/preview` answers: nothing is written. */
export interface SwatchImportPreview {
  fileType: string;
  /** what the values were taken to be (fraction or percent) and why */
  assumption: string;
  count: number;
  samples: SwatchImportPreviewSample[];
}
