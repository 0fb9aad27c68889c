import { z } from 'zod';
import { FILTER_BASES, MEDIUM_BASES } from '../spectral/bases';
import { filterSourceSchema, lightSourceSchema, mediumSourceSchema } from './simulate';
import { tableInputSchema } from './swatch';
import { itemNameSchema, type ItemView } from './item';

/** What a production curve is. */
export const CURVE_KINDS = ['light', 'filter', 'medium'] as const;
export type CurveKind = (typeof CURVE_KINDS)[number];
export const curveKindSchema = z.enum(CURVE_KINDS);

/**
 * The basis a table is given in, per kind: filters as transmittance 0..1, in percent, or optical density;
 * lights as relative power; media as relative sensitivity (energy basis), log10 sensitivity, or quantum
 * efficiency (photon basis).
 */
export const CURVE_BASES = { filter: FILTER_BASES, light: ['power'] as const, medium: MEDIUM_BASES } as const;
export const ALL_CURVE_BASES = [...FILTER_BASES, 'power', ...MEDIUM_BASES] as const;
export type CurveBasis = (typeof ALL_CURVE_BASES)[number];
/** Words for each basis, for forms and the source line. */
export const CURVE_BASIS_LABELS: Record<CurveBasis, string> = {
  transmittance: 'transmittance 0..1',
  percent: 'transmittance in %',
  density: 'optical density',
  power: 'relative power',
  energy: 'relative sensitivity (energy basis)',
  log10: 'log10 sensitivity',
  quantum: 'quantum efficiency (photon basis)',
};

const id = z.number().int().positive();

/** A reference to a production curve (`curveId`) or an engine source (`source`): exactly one. */
function refOf<T extends z.ZodType>(source: T, what: string) {
  return z
    .strictObject({ curveId: id.optional(), source: source.optional() })
    .refine((r) => (r.curveId === undefined) !== (r.source === undefined), { message: `a ${what} takes either curveId (a production curve) or source (built-in or inline)` });
}
export const lightRefSchema = refOf(lightSourceSchema, 'light');
export const filterRefSchema = refOf(filterSourceSchema, 'filter');
export const mediumRefSchema = refOf(mediumSourceSchema, 'medium');
export type LightRef = z.infer<typeof lightRefSchema>;
export type FilterRef = z.infer<typeof filterRefSchema>;
export type MediumRef = z.infer<typeof mediumRefSchema>;

const PARAMETRIC_KEYS = ['longPass', 'shortPass', 'bandPass', 'notch', 'neutralDensity'] as const;

/** How a curve is given. */
export const curveOriginInputSchema = z.discriminatedUnion('type', [
  /** a table of wavelength and value (a CSV/TSV/semicolon file, or pairs) in a named basis */
  z.strictObject({ type: z.literal('table'), basis: z.enum(ALL_CURVE_BASES), table: tableInputSchema }),
  /** a parametric filter: family, cut-on or centre, slope or width, peak */
  z.strictObject({
    type: z.literal('parametric'),
    filter: filterSourceSchema.refine((f) => PARAMETRIC_KEYS.some((k) => f[k] !== undefined), 'a parametric filter is longPass, shortPass, bandPass, notch or neutralDensity'),
  }),
  /** a light through one or more gels */
  z.strictObject({ type: z.literal('gel'), light: lightRefSchema, gels: z.array(filterRefSchema).min(1, 'At least one gel.').max(6, 'At most 6 gels.') }),
]);
export type CurveOriginInput = z.infer<typeof curveOriginInputSchema>;

/** What a curve keeps of its origin (the raw table pairs, so it can be shown and re-read). */
export type CurveOrigin =
  | { type: 'table'; basis: CurveBasis; fileName: string | null; pairs: [number, number][]; headers: string[] }
  | { type: 'parametric'; filter: z.infer<typeof filterSourceSchema> }
  | { type: 'gel'; light: LightRef; gels: FilterRef[] };

const name = itemNameSchema;

export const curveCreateSchema = z
  .strictObject({ kind: curveKindSchema, name, notes: z.string().max(4000).default(''), origin: curveOriginInputSchema })
  .superRefine((c, ctx) => {
    if (c.origin.type === 'table' && !(CURVE_BASES[c.kind] as readonly string[]).includes(c.origin.basis)) {
      ctx.addIssue({ code: 'custom', path: ['origin', 'basis'], message: `a ${c.kind} table is given as ${CURVE_BASES[c.kind].join(', ')}` });
    }
    if (c.origin.type === 'parametric' && c.kind !== 'filter') ctx.addIssue({ code: 'custom', path: ['origin', 'type'], message: 'only filters are parametric' });
    if (c.origin.type === 'gel' && c.kind !== 'light') ctx.addIssue({ code: 'custom', path: ['origin', 'type'], message: 'a light through a gel is a light' });
  });
export type CurveCreateInput = z.input<typeof curveCreateSchema>;

/** Rename or re-describe a curve (its data is fixed once saved: make a new curve to change it). */
export const curveUpdateSchema = z
  .strictObject({ name: name.optional(), notes: z.string().max(4000).optional() })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change.' });
export type CurveUpdateInput = z.input<typeof curveUpdateSchema>;

export interface CurveView extends ItemView {
  kind: CurveKind;
  origin: CurveOrigin;
  /** the curve on the working grid in the engine's basis: transmittance 0..1, relative power or relative energy sensitivity (peak 1) */
  samples: [number, number][];
  /** where it came from, in one line */
  source: string;
  /** how many looks use it */
  usedBy: number;
}
