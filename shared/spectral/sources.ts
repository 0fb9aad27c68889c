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
const SWATCH_FORMS = ['reflectance', 'srgb', 'rgb', 'lab'] as const;
/** A surface: measured reflectance (fraction or percent), or a colour (sRGB hex, sRGB 0..255, L*a*b* against D65) whose spectrum is estimated. */
export const swatchSourceSchema = z
  .strictObject({
    name: z.string().trim().min(1, 'give the swatch a name').max(200, 'at most 200 characters'),
    reflectance: samplesSchema.optional(),
    basis: z.enum(REFLECTANCE_BASES).optional(),
    srgb: z.string().regex(/^#([0-9a-fA-F]{6}|[0-9a-fA-F]{3})$/, 'an sRGB colour like #a33b3b').optional(),
    rgb: z.tuple([channel, channel, channel]).optional(),
    lab: z.tuple([z.number().min(0).max(100), z.number().min(-200).max(200), z.number().min(-200).max(200)]).optional(),
  })
  .superRefine(exactlyOne(SWATCH_FORMS, 'swatch'))
  .superRefine((s, ctx) => {
    if (s.basis !== undefined && s.reflectance === undefined) ctx.addIssue({ code: 'custom', message: 'basis goes with reflectance', path: ['basis'] });
    if (s.reflectance !== undefined) checkSamples(() => reflectanceFromPairs(s.reflectance, s.basis), ctx, 'reflectance');
  });
export type SwatchSource = z.infer<typeof swatchSourceSchema>;
