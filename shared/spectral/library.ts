/**
 * The built-in library (data/library/*.json): lights, filters and media with ids, names, one-line
 * descriptions and their definitions. Models are generic shapes of typical kinds, never a
 * manufacturer's data (each item says so in `note`); CIE items are the published tables.
 * Checked by schemas when loaded.
 */
import { z } from 'zod';
import lightsJson from '../../data/library/lights.json';
import filtersJson from '../../data/library/filters.json';
import mediaJson from '../../data/library/media.json';
import type { MediumModel } from './media';
import { filterSourceSchema, lightSourceSchema, type FilterSource, type LightSource } from './sources';

const lobe = z.strictObject({ centreNm: z.number(), widthNm: z.number().positive(), weight: z.number().positive() });
const mediumModelSchema = z.strictObject({
  basis: z.enum(['energy', 'quantum']),
  lobes: z.array(lobe).min(1),
  redEdgeNm: z.number().optional(),
  redEdgeWidthNm: z.number().positive().optional(),
  blueEdgeNm: z.number().optional(),
  blueEdgeWidthNm: z.number().positive().optional(),
});
const mediumDefinitionSchema = z.union([z.strictObject({ model: mediumModelSchema }), z.strictObject({ cmf: z.literal('y') })]);

const itemBase = {
  id: z.string().regex(/^[a-z0-9][a-z0-9.-]*$/),
  name: z.string().min(1),
  description: z.string().min(1),
  /** true for generic models of typical shapes; false for published CIE data */
  generic: z.boolean(),
  note: z.string().min(1),
};
const fileOf = <T extends z.ZodType>(definition: T) =>
  z.object({ name: z.string(), source: z.string(), units: z.string(), items: z.array(z.object({ ...itemBase, definition })).min(1) });

/** A built-in medium's definition: the parametric model, or the CIE ȳ (the eye). */
export type MediumDefinition = { model: MediumModel } | { cmf: 'y' };

/** What kind of thing a library item is. */
export type LibraryKind = 'light' | 'filter' | 'medium';

/** One library item as loaded. */
export interface LibraryItem<D> {
  id: string;
  name: string;
  description: string;
  generic: boolean;
  note: string;
  definition: D;
}

const noId = (s: { id?: string }) => s.id === undefined;
const lightsFile = fileOf(lightSourceSchema.refine(noId, 'library lights cannot refer to other ids')).parse(lightsJson);
const filtersFile = fileOf(filterSourceSchema.refine(noId, 'library filters cannot refer to other ids')).parse(filtersJson);
const mediaFile = fileOf(mediumDefinitionSchema).parse(mediaJson);

/** Built-in lights (definitions in the light-source form of sources.ts). */
export const LIBRARY_LIGHTS: readonly LibraryItem<LightSource>[] = lightsFile.items;
/** Built-in filters (definitions in the filter-source form). */
export const LIBRARY_FILTERS: readonly LibraryItem<FilterSource>[] = filtersFile.items;
/** Built-in media. */
export const LIBRARY_MEDIA: readonly LibraryItem<MediumDefinition>[] = mediaFile.items as LibraryItem<MediumDefinition>[];

/** Source notes of the three library files (for docs and the library endpoint). */
export const LIBRARY_SOURCES = {
  light: lightsFile.source,
  filter: filtersFile.source,
  medium: mediaFile.source,
} as const;

const ids = [...LIBRARY_LIGHTS, ...LIBRARY_FILTERS, ...LIBRARY_MEDIA].map((i) => i.id);
if (new Set(ids).size !== ids.length) throw new Error('data/library: duplicate ids');

/** The library light with `id`, or undefined. */
export function libraryLight(id: string): LibraryItem<LightSource> | undefined {
  return LIBRARY_LIGHTS.find((i) => i.id === id);
}
/** The library filter with `id`, or undefined. */
export function libraryFilter(id: string): LibraryItem<FilterSource> | undefined {
  return LIBRARY_FILTERS.find((i) => i.id === id);
}
/** The library medium with `id`, or undefined. */
export function libraryMedium(id: string): LibraryItem<MediumDefinition> | undefined {
  return LIBRARY_MEDIA.find((i) => i.id === id);
}

/** Which kind an id belongs to (for "that id is a filter, not a light" messages). */
export function kindOfId(id: string): LibraryKind | undefined {
  if (libraryLight(id)) return 'light';
  if (libraryFilter(id)) return 'filter';
  if (libraryMedium(id)) return 'medium';
  return undefined;
}
