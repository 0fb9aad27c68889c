/**
 * POST /api/simulate, and the spectrum-source schemas other features reuse to store looks
 * (`lightSourceSchema`, `filterSourceSchema`, `mediumSourceSchema`, `swatchSourceSchema`; defined by the
 * engine in shared/spectral/sources.ts and re-exported here).
 * Each source is an object with exactly one form key; samples are checked by the engine's own reader,
 * so a form, the server and the engine refuse the same things with the same messages.
 * Also the answer types of GET /api/library (`LibraryView`, `LibraryItemView`).
 * Documented in docs/api-simulate.md.
 */
import { z } from 'zod';
import { MAX_FILTERS, MAX_SWATCHES } from '../spectral/limits';
import type { SimulationResult, SwatchResult } from '../spectral/compute';
import type { LibraryKind } from '../spectral/library';
import { filterSourceSchema, lightSourceSchema, mediumSourceSchema, swatchSourceSchema } from '../spectral/sources';

export { filterSourceSchema, lightSourceSchema, makeupParamsSchema, mediumSourceSchema, nestedSwatchSourceSchema, skinParamsSchema, swatchSourceSchema } from '../spectral/sources';
export type { FilterSource, LightSource, MakeupParams, MediumSource, NestedSwatchSource, SkinParams, SwatchSource } from '../spectral/sources';

/** The light path without surfaces: what a look stores. */
export const lightPathSourceSchema = z.strictObject({
  light: lightSourceSchema,
  filters: z.array(filterSourceSchema).max(MAX_FILTERS, `at most ${MAX_FILTERS} filters`).default([]),
  medium: mediumSourceSchema,
});
export type LightPathSource = z.input<typeof lightPathSourceSchema>;

/** Body of POST /api/simulate. */
export const simulateRequestSchema = z.strictObject({
  light: lightSourceSchema,
  filters: z.array(filterSourceSchema).max(MAX_FILTERS, `at most ${MAX_FILTERS} filters`).default([]),
  medium: mediumSourceSchema,
  swatches: z.array(swatchSourceSchema).max(MAX_SWATCHES, `at most ${MAX_SWATCHES} swatches`).default([]),
  /** also answer, per estimated swatch, the reflectances reaching its possible range's ends */
  extremes: z.boolean().optional(),
  /** also answer every swatch's reflectance on the working grid, `reflectance: [[nm, ρ], …]` (ρ to 6 decimals) */
  spectra: z.boolean().optional(),
});
export type SimulateRequest = z.infer<typeof simulateRequestSchema>;
export type SimulateRequestInput = z.input<typeof simulateRequestSchema>;

/** One swatch of the answer (defined by the engine: `SwatchResult` in shared/spectral/compute.ts). */
export type SwatchResultView = SwatchResult;

/** Answer of POST /api/simulate (defined by the engine: `SimulationResult` in shared/spectral/compute.ts). */
export type SimulateResponse = SimulationResult;

/** One built-in item as GET /api/library answers it. */
export interface LibraryItemView {
  id: string;
  kind: LibraryKind;
  name: string;
  description: string;
  generic: boolean;
  note: string;
  /** the source form (light / filter source above; media: model or cmf) */
  definition: unknown;
  /** samples on the working grid, 350–900 nm at 1 nm (lights and media peak 1; filters transmittance) */
  values: number[];
}

/** Answer of GET /api/library. */
export interface LibraryView {
  grid: { startNm: number; endNm: number; stepNm: number };
  items: LibraryItemView[];
  upsample: { name: string; source: string; version: number; resolution: number };
}
