/**
 * POST /api/shade (docs/api-shade.md): the shade of a surface that lands on a target tone through a look.
 * The light path is given as in POST /api/simulate (the same source schemas); `near` is an sRGB hex or a
 * swatch source without a name, checked by the engine's own `swatchSourceSchema` (so every swatch form it
 * gains is accepted here too). The engine: `findShade` in shared/spectral/shade.ts.
 */
import { z } from 'zod';
import type { StopsRange } from '../spectral/compute';
import { MAX_FILTERS } from '../spectral/limits';
import type { NearSource, ShadeChange, ShadeNear } from '../spectral/shade';
import { filterSourceSchema, lightSourceSchema, mediumSourceSchema, swatchSourceSchema } from './simulate';

const HEX = /^#([0-9a-fA-F]{6}|[0-9a-fA-F]{3})$/;
const NEAR_WORDS = 'an sRGB colour like #a33b3b, or a swatch source without a name';

/** The tone to land on: `{ zone }` (0..10, continuous; zone = 5 + stops) or `{ stops }` from middle grey before key placement. */
export const shadeTargetSchema = z
  .strictObject({
    zone: z.number('the zone is a number 0..10').min(0, 'the zone goes from 0 to 10').max(10, 'the zone goes from 0 to 10').optional(),
    stops: z.number('stops is a number of stops from middle grey').min(-10, 'stops go from -10 to 10').max(10, 'stops go from -10 to 10').optional(),
  })
  .superRefine((t, ctx) => {
    if ((t.zone === undefined) === (t.stops === undefined)) ctx.addIssue({ code: 'custom', message: t.zone === undefined ? 'a target needs a zone or stops' : 'a target takes a zone or stops, not both' });
  });
export type ShadeTarget = z.infer<typeof shadeTargetSchema>;

/** The surface to start from: an sRGB hex, or a swatch source without a name (srgb, rgb, lab, skin, makeup; a `name` is ignored). */
export const shadeNearSchema = z.unknown().transform((v, ctx): ShadeNear => {
  if (typeof v === 'string') {
    if (HEX.test(v.trim())) return v.trim();
    ctx.addIssue({ code: 'custom', message: NEAR_WORDS });
    return z.NEVER;
  }
  if (!v || typeof v !== 'object' || Array.isArray(v)) {
    ctx.addIssue({ code: 'custom', message: NEAR_WORDS });
    return z.NEVER;
  }
  const parsed = swatchSourceSchema.safeParse({ ...v, name: 'near' });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const keys = issue.code === 'unrecognized_keys' ? issue.keys.slice(0, 1) : [];
      ctx.addIssue({ code: 'custom', message: issue.message, path: [...issue.path, ...keys] as (string | number)[] });
    }
    return z.NEVER;
  }
  const { name: _name, ...source } = parsed.data;
  return source as NearSource;
});

/** Body of POST /api/shade. */
export const shadeRequestSchema = z.strictObject({
  light: lightSourceSchema,
  filters: z.array(filterSourceSchema).max(MAX_FILTERS, `at most ${MAX_FILTERS} filters`).default([]),
  medium: mediumSourceSchema,
  target: shadeTargetSchema,
  near: shadeNearSchema,
});
export type ShadeRequest = z.infer<typeof shadeRequestSchema>;
export type ShadeRequestInput = z.input<typeof shadeRequestSchema>;

/** Answer of POST /api/shade. */
export interface ShadeResponse {
  /** the answer's colour: the answer itself for a colour; for skin and makeup their colour under D65, for display */
  srgb: string;
  /** the answer's own tone, stops from middle grey before key placement (the scale of POST /api/simulate) */
  stops: number;
  /** 5 + stops, clamped 0..10 */
  zone: number;
  /** how sure the answer's tone is, on the scale of `stops` (zero width when not estimated) */
  range: Pick<StopsRange, 'possible' | 'plausible'>;
  /** the answer lands within 0.1 stop of the target */
  reached: boolean;
  /** the parameter moved: L* (lightness), the skin's melanin, or the makeup's coverage */
  changed: ShadeChange;
  /** the moved parameter's value in the answer: L* 0..100, melanin volume fraction, coverage 0..1 */
  value: number;
  /** the answer as a swatch source without a name, to store: `{ srgb }` for a colour, the skin / makeup form with the parameter moved */
  source: NearSource;
  /** for skin and makeup: the same source (their model's parameters) */
  params?: NearSource;
  /** why the target was not reached */
  message?: string;
}
