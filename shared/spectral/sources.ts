/**
 * The engine's source forms: how a light, a filter, a medium and a swatch are given (zod schemas and
 * their types). Each source is an object with exactly one form key; samples are checked by the
 * engine's own readers (bases.ts), so a form, the server and the engine refuse the same things with
 * the same messages. The library (library.ts) stores its definitions in these forms, compute.ts
 * resolves them to spectra, and shared/schemas/simulate.ts builds the API payloads from them.
 * Units: wavelengths nm, temperatures K, transmittance and peaks 0..1, sRGB channels 0..255.
 */
import { z } from 'zod';
import { FILTER_BASES, MEDIUM_BASES, REFLECTANCE_BASES, filterFromPairs, lightFromPairs, mediumFromPairs, reflectanceFromPairs } from './bases';
import { SpectralInputError } from './errors';
import { BLACKBODY_K, CIE_ILLUMINANT_NAMES, DAYLIGHT_CCT_K, MAX_FILTERS, MAX_PAIRS } from './limits';

const nm = (what: string) => z.number().min(300, `${what} must be at least 300 nm`).max(1100, `${what} must be at most 1100 nm`);
const widthNm = (what: string) => z.number().positive(`${what} must be above 0 nm`).max(800, `${what} must be at most 800 nm`);
const fraction = z.number().min(0, 'must be 0..1').max(1, 'must be 0..1');

/** `[nm, value]` pairs (the engine checks order, duplicates, ranges and coverage). */
export const samplesSchema = z.array(z.tuple([z.number(), z.number()])).max(MAX_PAIRS, `at most ${MAX_PAIRS} points`);

/** Requires exactly one of `keys` to be present. */
function exactlyOne<T extends object>(keys: readonly (keyof T & string)[], what: string) {
  return (v: T, ctx: z.RefinementCtx) => {
    const present = keys.filter((k) => (v as Record<string, unknown>)[k] !== undefined);
    if (present.length !== 1) {
      ctx.addIssue({
        code: 'custom',
        message: present.length ? `a ${what} takes one of ${keys.join(', ')}, not both ${present.join(' and ')}` : `a ${what} needs one of ${keys.join(', ')}`,
      });
    }
  };
}

/** Runs the engine's reader on `samples` and reports its SpectralInputError on the right path. */
function checkSamples(read: () => unknown, ctx: z.RefinementCtx, key = 'samples') {
  try {
    read();
  } catch (err) {
    if (!(err instanceof SpectralInputError)) throw err;
    ctx.addIssue({ code: 'custom', message: err.reason, path: [key, ...err.path] });
  }
}

export const longPassSchema = z.strictObject({ cutOnNm: nm('cutOnNm'), slopeNm: widthNm('slopeNm').optional(), peak: fraction.optional() });
export const shortPassSchema = z.strictObject({ cutOffNm: nm('cutOffNm'), slopeNm: widthNm('slopeNm').optional(), peak: fraction.optional() });
export const bandSchema = z.strictObject({ centreNm: nm('centreNm'), widthNm: widthNm('widthNm'), slopeNm: widthNm('slopeNm').optional(), peak: fraction.optional() });

const FILTER_FORMS = ['samples', 'id', 'longPass', 'shortPass', 'bandPass', 'notch', 'neutralDensity'] as const;
/** A filter: measured samples (basis transmittance 0..1, percent, or optical density), a library id, or a parametric shape. */
export const filterSourceSchema = z
  .strictObject({
    samples: samplesSchema.optional(),
    basis: z.enum(FILTER_BASES).optional(),
    id: z.string().min(1).max(100).optional(),
    longPass: longPassSchema.optional(),
    shortPass: shortPassSchema.optional(),
    bandPass: bandSchema.optional(),
    notch: bandSchema.optional(),
    neutralDensity: z.number().min(0, 'optical density cannot be negative').max(10, 'optical density must be at most 10').optional(),
  })
  .superRefine(exactlyOne(FILTER_FORMS, 'filter'))
  .superRefine((f, ctx) => {
    if (f.basis !== undefined && f.samples === undefined) ctx.addIssue({ code: 'custom', message: 'basis goes with samples', path: ['basis'] });
    if (f.samples !== undefined) checkSamples(() => filterFromPairs(f.samples, f.basis), ctx);
  });
export type FilterSource = z.infer<typeof filterSourceSchema>;

export const ledSchema = z.strictObject({
  emitterNm: nm('emitterNm'),
  emitterWidthNm: widthNm('emitterWidthNm'),
  phosphorNm: nm('phosphorNm'),
  phosphorWidthNm: widthNm('phosphorWidthNm'),
  phosphorRatio: z.number().min(0).max(100),
});

const LIGHT_FORMS = ['cie', 'daylight', 'blackbody', 'samples', 'id', 'led'] as const;
/** A light: CIE illuminant, daylight or blackbody at a CCT (K), samples (relative power), library id, or LED model; optional gels on it. */
export const lightSourceSchema = z
  .strictObject({
    cie: z.enum(CIE_ILLUMINANT_NAMES).optional(),
    daylight: z.number().min(DAYLIGHT_CCT_K.min, `daylight needs ${DAYLIGHT_CCT_K.min}–${DAYLIGHT_CCT_K.max} K`).max(DAYLIGHT_CCT_K.max, `daylight needs ${DAYLIGHT_CCT_K.min}–${DAYLIGHT_CCT_K.max} K`).optional(),
    blackbody: z.number().min(BLACKBODY_K.min, `a blackbody needs ${BLACKBODY_K.min}–${BLACKBODY_K.max} K`).max(BLACKBODY_K.max, `a blackbody needs ${BLACKBODY_K.min}–${BLACKBODY_K.max} K`).optional(),
    samples: samplesSchema.optional(),
    id: z.string().min(1).max(100).optional(),
    led: ledSchema.optional(),
    /** filters on the lamp (light × gel) */
    gels: z.array(filterSourceSchema).max(MAX_FILTERS, `at most ${MAX_FILTERS} gels`).optional(),
  })
  .superRefine(exactlyOne(LIGHT_FORMS, 'light'))
  .superRefine((l, ctx) => {
    if (l.samples !== undefined) checkSamples(() => lightFromPairs(l.samples), ctx);
  });
export type LightSource = z.infer<typeof lightSourceSchema>;

/** A medium: samples (basis energy, log10 or quantum) or a library id. */
export const mediumSourceSchema = z
  .strictObject({
    samples: samplesSchema.optional(),
    basis: z.enum(MEDIUM_BASES).optional(),
    id: z.string().min(1).max(100).optional(),
  })
  .superRefine(exactlyOne(['samples', 'id'] as const, 'medium'))
  .superRefine((m, ctx) => {
    if (m.basis !== undefined && m.samples === undefined) ctx.addIssue({ code: 'custom', message: 'basis goes with samples', path: ['basis'] });
    if (m.samples !== undefined) checkSamples(() => mediumFromPairs(m.samples, m.basis), ctx);
  });
export type MediumSource = z.infer<typeof mediumSourceSchema>;

const channel = z.number().min(0, 'must be 0..255').max(255, 'must be 0..255');

/** A number in [min, max] whose refusal names the quantity and its range (the issue's path names the field). */
const ranged = (what: string, min: number, max: number, unit = '') => {
  const msg = `${what} goes from ${min} to ${max}${unit ? ` ${unit}` : ''}`;
  return z.number(msg).min(min, msg).max(max, msg);
};

/**
 * Ranges of the skin model's parameters (shared/spectral/skin.ts; README "Skin, blood and makeup from
 * physics"). melanin: epidermal melanin volume fraction, up to 0.5 (Donner & Jensen 2006 let it run to
 * 50 %, from memory); blood: dermal blood volume fraction, up to 0.3 (physiological skin 0.2–7 %, Jacques 1998, from memory;
 * the top of the range is for bruises and stage blood); oxygenation: haemoglobin oxygen saturation; pheomelanin: the
 * share of the melanin that is pheomelanin; bilirubin: dermal concentration, µmol/L (a bruise's yellow);
 * carotene: epidermal β-carotene concentration, µmol/L.
 */
export const SKIN_LIMITS = {
  melanin: { min: 0, max: 0.5 },
  blood: { min: 0, max: 0.3 },
  oxygenation: { min: 0, max: 1 },
  pheomelanin: { min: 0, max: 1 },
  bilirubin: { min: 0, max: 1000 },
  carotene: { min: 0, max: 300 },
} as const;

/** Parameters of the skin model (skin.ts); omitted optional values take the model's defaults (SKIN_DEFAULTS there). */
export const skinParamsSchema = z.strictObject({
  /** epidermal melanin volume fraction 0..0.5 */
  melanin: ranged('melanin (epidermal melanin volume fraction)', SKIN_LIMITS.melanin.min, SKIN_LIMITS.melanin.max),
  /** dermal blood volume fraction 0..0.3 */
  blood: ranged('blood (dermal blood volume fraction)', SKIN_LIMITS.blood.min, SKIN_LIMITS.blood.max),
  /** haemoglobin oxygen saturation 0..1 */
  oxygenation: ranged('oxygenation (haemoglobin oxygen saturation)', SKIN_LIMITS.oxygenation.min, SKIN_LIMITS.oxygenation.max),
  /** share of the melanin that is pheomelanin 0..1 (default 0.2) */
  pheomelanin: ranged('pheomelanin (share of the melanin)', SKIN_LIMITS.pheomelanin.min, SKIN_LIMITS.pheomelanin.max).optional(),
  /** dermal bilirubin, µmol/L 0..1000 (default 0) */
  bilirubin: ranged('bilirubin', SKIN_LIMITS.bilirubin.min, SKIN_LIMITS.bilirubin.max, 'µmol/L').optional(),
  /** epidermal β-carotene, µmol/L 0..300 (default 0) */
  carotene: ranged('carotene', SKIN_LIMITS.carotene.min, SKIN_LIMITS.carotene.max, 'µmol/L').optional(),
});
export type SkinParams = z.infer<typeof skinParamsSchema>;

/** How deep makeup layers may nest (a layer over a layer over …): deeper sources are refused. */
export const MAX_SWATCH_NESTING = 8;

const hexColour = z.string().regex(/^#([0-9a-fA-F]{6}|[0-9a-fA-F]{3})$/, 'an sRGB colour like #a33b3b');

/** A layer of paint over a surface (makeup.ts): the base, the paint's colour (hex or a swatch source) and coverage 0..1. */
export interface MakeupParams {
  /** the surface under the layer (a swatch source without a name) */
  over: NestedSwatchSource;
  /** the paint: an sRGB hex colour (its spectrum estimated) or a swatch source without a name */
  colour: string | NestedSwatchSource;
  /** 0 = the bare surface, 1 = the paint's own reflectance (makeup.ts maps it to the layer's hiding) */
  coverage: number;
}

/** A swatch source without its name: what a makeup layer is put over, or painted with. */
export interface NestedSwatchSource {
  reflectance?: [number, number][];
  basis?: (typeof REFLECTANCE_BASES)[number];
  srgb?: string;
  rgb?: [number, number, number];
  lab?: [number, number, number];
  skin?: SkinParams;
  makeup?: MakeupParams;
}

const SWATCH_FORMS = ['reflectance', 'srgb', 'rgb', 'lab', 'skin', 'makeup'] as const;

/** How many makeup layers deep a source goes (0 for a plain surface). */
export function makeupDepth(s: NestedSwatchSource): number {
  if (!s.makeup) return 0;
  const colour = typeof s.makeup.colour === 'string' ? 0 : makeupDepth(s.makeup.colour);
  return 1 + Math.max(makeupDepth(s.makeup.over), colour);
}

/** True when resolving the source needs the upsampling table (a colour value somewhere in it). */
export function needsUpsampleTable(s: NestedSwatchSource): boolean {
  if (s.srgb !== undefined || s.rgb !== undefined || s.lab !== undefined) return true;
  if (s.makeup) return typeof s.makeup.colour === 'string' || needsUpsampleTable(s.makeup.colour) || needsUpsampleTable(s.makeup.over);
  return false;
}

function swatchChecks(s: NestedSwatchSource, ctx: z.RefinementCtx) {
  if (s.basis !== undefined && s.reflectance === undefined) ctx.addIssue({ code: 'custom', message: 'basis goes with reflectance', path: ['basis'] });
  if (s.reflectance !== undefined) checkSamples(() => reflectanceFromPairs(s.reflectance, s.basis), ctx, 'reflectance');
}

const swatchForms = {
  reflectance: samplesSchema.optional(),
  basis: z.enum(REFLECTANCE_BASES).optional(),
  srgb: hexColour.optional(),
  rgb: z.tuple([channel, channel, channel]).optional(),
  lab: z.tuple([z.number().min(0).max(100), z.number().min(-200).max(200), z.number().min(-200).max(200)]).optional(),
  skin: skinParamsSchema.optional(),
  get makeup() {
    return makeupParamsSchema.optional();
  },
};

/** A swatch source without a name (inside a makeup layer): one of the forms of `swatchSourceSchema`. */
export const nestedSwatchSourceSchema: z.ZodType<NestedSwatchSource> = z
  .strictObject(swatchForms)
  .superRefine(exactlyOne(SWATCH_FORMS, 'swatch'))
  .superRefine(swatchChecks) as z.ZodType<NestedSwatchSource>;

/** A makeup layer: `{ over: <swatch source>, colour: '#rrggbb' | <swatch source>, coverage: 0..1 }` (sources without names). */
export const makeupParamsSchema: z.ZodType<MakeupParams> = z
  .strictObject({
    over: z.lazy(() => nestedSwatchSourceSchema),
    colour: z.union([hexColour, z.lazy(() => nestedSwatchSourceSchema)], 'colour is an sRGB colour like #a33b3b or a swatch source without a name'),
    coverage: ranged('coverage', 0, 1),
  })
  .superRefine((m, ctx) => {
    const depth = 1 + Math.max(makeupDepth(m.over), typeof m.colour === 'string' ? 0 : makeupDepth(m.colour));
    if (depth > MAX_SWATCH_NESTING) ctx.addIssue({ code: 'custom', message: `makeup layers nest at most ${MAX_SWATCH_NESTING} deep` });
  }) as z.ZodType<MakeupParams>;

/**
 * A surface: measured reflectance (fraction or percent); a colour (sRGB hex, sRGB 0..255, L*a*b* against
 * D65) whose spectrum is estimated; skin from its physical parameters (skin.ts); or a makeup layer over
 * another surface (makeup.ts).
 */
export const swatchSourceSchema = z
  .strictObject({
    name: z.string().trim().min(1, 'give the swatch a name').max(200, 'at most 200 characters'),
    ...swatchForms,
  })
  .superRefine(exactlyOne(SWATCH_FORMS, 'swatch'))
  .superRefine(swatchChecks);
export type SwatchSource = z.infer<typeof swatchSourceSchema>;
