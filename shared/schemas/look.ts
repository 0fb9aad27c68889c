import { z } from 'zod';
import { toneSettingsSchema, type ToneSettings } from './exposure';
import { filterRefSchema, lightRefSchema, mediumRefSchema, type LightRef, type MediumRef } from './curve';
import { itemNameSchema } from './item';

/** Where a filter of a look sits: on the lens (the camera sees through it) or on the light (a gel on the lamps). */
export const FILTER_PLACES = ['lens', 'light'] as const;
export type FilterPlace = (typeof FILTER_PLACES)[number];

/** At most this many filters in a look's lightPath. */
export const MAX_LOOK_FILTERS = 8;
/** Compare at most this many looks side by side. */
export const MAX_COMPARE_LOOKS = 4;

export const lookFilterSchema = z.strictObject({ filter: filterRefSchema, on: z.enum(FILTER_PLACES).default('lens') });
export type LookFilter = z.infer<typeof lookFilterSchema>;
export type LookLight = LightRef;
export type LookMedium = MediumRef;

const name = itemNameSchema;

/** The light path of a look: light → (surface) → ordered filters → medium; tone settings carry development and print. */
export const lookDefinitionSchema = z.strictObject({
  light: lightRefSchema,
  filters: z.array(lookFilterSchema).max(MAX_LOOK_FILTERS, `At most ${MAX_LOOK_FILTERS} filters.`).default([]),
  medium: mediumRefSchema,
  tone: toneSettingsSchema.default(toneSettingsSchema.parse({})),
});
export type LookDefinition = z.infer<typeof lookDefinitionSchema>;
export type LookDefinitionInput = z.input<typeof lookDefinitionSchema>;

export const lookCreateSchema = lookDefinitionSchema.extend({ name, notes: z.string().max(4000).default('') });
export type LookCreateInput = z.input<typeof lookCreateSchema>;

/** A change to a look's tone settings: only the fields sent change; the rest keep their saved values. */
export const toneSettingsPatchSchema = z.strictObject(
  Object.fromEntries(
    Object.entries(toneSettingsSchema.shape as Record<string, z.ZodType>).map(([k, v]) => [k, (v instanceof z.ZodDefault ? (v as z.ZodDefault<z.ZodType>).unwrap() : v).optional()]),
  ),
) as unknown as z.ZodType<Partial<ToneSettings>>;

export const lookUpdateSchema = z
  .strictObject({
    name: name.optional(),
    notes: z.string().max(4000).optional(),
    light: lightRefSchema.optional(),
    filters: z.array(lookFilterSchema).max(MAX_LOOK_FILTERS, `At most ${MAX_LOOK_FILTERS} filters.`).optional(),
    medium: mediumRefSchema.optional(),
    tone: toneSettingsPatchSchema.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change.' });
export type LookUpdateInput = z.input<typeof lookUpdateSchema>;

export const lookDuplicateSchema = z.strictObject({ name: name.optional() });

/** Body of POST …/looks/analyse: an unsaved look (the bench while it is edited), optionally with a board's swatches. */
export const lookAnalyseSchema = z.strictObject({ look: lookDefinitionSchema, boardId: z.number().int().positive().optional() });
export type LookAnalyseInput = z.input<typeof lookAnalyseSchema>;

export interface LookView {
  id: number;
  name: string;
  notes: string;
  light: LightRef;
  filters: LookFilter[];
  medium: MediumRef;
  tone: ToneSettings;
  createdBy: { id: number; name: string } | null;
  createdAt: string;
  updatedAt: string;
}

/** A curve of the light path on the grid, for the sparkline and the chart. */
export interface PathCurve {
  /** 'light' | 'filter' | 'medium' | 'eye' | 'product' */
  role: 'light' | 'filter' | 'medium' | 'eye' | 'product';
  label: string;
  /** where it came from (library item, production curve, inline) */
  source: string;
  /** filters only */
  on?: FilterPlace;
  /** values on the working grid (350–900 nm, 1 nm), as the engine holds them */
  values: number[];
}

/** Filter factor of the look's filters for one light. */
export interface FactorForLight {
  light: string;
  factor: number;
  stops: number;
  opaque: boolean;
}

/** Answer of GET …/looks/:id/analysis and POST …/looks/analyse. */
export interface LookAnalysis {
  /** wavelengths of `values`, nm */
  nm: number[];
  curves: PathCurve[];
  /** for the look's own light, and for daylight and tungsten */
  factor: FactorForLight;
  daylight: FactorForLight;
  tungsten: FactorForLight;
  /** the medium's tone model: negative (curve + print), sensor (display) or eye */
  toneKind: 'negative' | 'sensor' | 'eye';
  /** rated EI (box speed with the rating), when the medium has one */
  ratedEI: number | null;
  ms: number;
}

/** At most this many looks in one light budget. */
export const MAX_LIGHT_BUDGET_LOOKS = 24;

const cameraField = <T extends z.ZodType>(f: z.ZodDefault<T>) => f.unwrap().optional();

/**
 * Body of POST …/looks/light-budget: the looks to compare (the first is the reference) and, optionally,
 * the camera the light levels are for; what is left out comes from the FIRST look's tone settings
 * (its T-stop, fps, shutter angle and meter constant), for every look, so the levels compare.
 */
export const lightBudgetRequestSchema = z.strictObject({
  lookIds: z.array(z.number().int().positive(), { error: 'Give lookIds as a list of look ids, e.g. [1, 2].' })
    .min(1, 'Give at least one look.')
    .max(MAX_LIGHT_BUDGET_LOOKS, `At most ${MAX_LIGHT_BUDGET_LOOKS} looks.`)
    .refine((a) => new Set(a).size === a.length, 'Give each look once.'),
  tStop: cameraField(toneSettingsSchema.shape.tStop),
  fps: cameraField(toneSettingsSchema.shape.fps),
  shutterAngle: cameraField(toneSettingsSchema.shape.shutterAngle),
});
export type LightBudgetRequest = z.input<typeof lightBudgetRequestSchema>;

/** One look of a light budget; the figures are null for a look without an exposure index (the eye). */
export interface LightBudgetLook {
  lookId: number;
  name: string;
  /** effective EI (box speed, rating / development, every filter for its own light and medium), ISO third-stop label */
  effectiveEI: number | null;
  /** the same before rounding to the series */
  exactEI: number | null;
  /** incident light needed at the camera setting (ISO 2720), lux */
  lux: number | null;
  footcandles: number | null;
  /** light needed relative to the first look: effective EI of the first / effective EI of this one (= ratio of the lux) */
  relative: number | null;
  /** log2(relative), stops */
  stops: number | null;
  /** the same ratio from the unrounded chains: 2^(stops between them), before the third-stop labels */
  exactRelative: number | null;
  /** the look's filters pass almost nothing its medium sees */
  opaque: boolean;
}

/** Answer of POST …/looks/light-budget. */
export interface LightBudgetAnswer {
  looks: LightBudgetLook[];
  /** the camera and meter the levels are for, and where each value came from */
  camera: {
    tStop: number;
    fps: number;
    shutterAngle: number;
    /** incident-meter constant C, lux·s (the first look's) */
    calibrationConstant: number;
    exposureSeconds: number;
    /** the look whose tone settings filled what the request left out (the first look) */
    defaultsFrom: { lookId: number; name: string };
    /** the fields taken from that look */
    defaulted: ('tStop' | 'fps' | 'shutterAngle' | 'calibrationConstant')[];
  };
}
