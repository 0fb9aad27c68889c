import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { apiPaths } from '../../../lib/paths';
import { keyOffset, type SourcedLook } from '../../../lib/look-sources';
import { sourceKey, type SurfaceSource } from '../../../lib/swatch-source';
import type { SimulateResponse } from '../../../../shared/schemas/simulate';
import { labToXyz, linearToSrgb, srgbToHex, xyzToLinearSrgb } from '../../../../shared/spectral/colour';
import { zoneFromStops, zoneNumeral } from '../../../../shared/tone/zones';

/** A surface's tone through one look, after the look's key placement (the board's scale). */
export interface LiveZone {
  lookId: number;
  lookName: string;
  /** stops from middle grey after key placement */
  stops: number;
  /** 5 + stops, unrounded */
  zone: number;
  numeral: string;
  /** stops − eye stops (+ reads lighter than it looks) */
  shift: number;
}

export interface LiveZones {
  /** the surface's colour to the eye in daylight (D65), sRGB */
  hex: string;
  /** its reflectance on the grid, when the server answers it */
  reflectance: [number, number][] | null;
  looks: LiveZone[];
}

type Answer = SimulateResponse & { swatches: (SimulateResponse['swatches'][number] & { reflectance?: [number, number][] })[] };

export const simulate = (body: unknown, signal?: AbortSignal) => api.post<Answer>(apiPaths.simulate(), body, { signal });

/** Any medium does for the colour to the eye: only L*a*b* under D65 is read. */
const EYE_PATH = { light: { cie: 'D65' as const }, filters: [], medium: { id: 'panchromatic' } };

/** L*a*b* against D65 → sRGB hex (clamped to the gamut). */
export const hexOfLab = (lab: [number, number, number]) => srgbToHex(linearToSrgb(xyzToLinearSrgb(labToXyz(lab))));

/**
 * A surface through each look (POST /api/simulate once per look, the look's key surface beside it so the
 * key placement is the look's own), and its colour in daylight. One request per look, in parallel.
 */
export async function zonesThrough(looks: readonly SourcedLook[], surface: SurfaceSource, signal?: AbortSignal): Promise<LiveZones> {
  const named = { name: 'surface', ...surface };
  const physical = !('srgb' in surface);
  // all requests together, so a cancelled query (the signal aborted) rejects once, with no promise left unawaited
  const [eyeAnswer, ...per] = await Promise.all([
    simulate({ ...EYE_PATH, swatches: [named], ...(physical ? { spectra: true } : {}) }, signal),
    ...looks.map(async (l): Promise<LiveZone> => {
      const swatches = l.key.surface ? [named, { name: 'key', ...l.key.surface }] : [named];
      const r = await simulate({ ...l.sources, swatches }, signal);
      const s = r.swatches[0];
      const stops = s.stops + keyOffset(l.key, r.swatches[1]?.stops ?? null);
      const zone = zoneFromStops(stops);
      return { lookId: l.id, lookName: l.name, stops, zone, numeral: zoneNumeral(zone), shift: s.shift };
    }),
  ]);
  const e = (eyeAnswer as Answer).swatches[0];
  return { hex: 'srgb' in surface ? surface.srgb.toLowerCase() : hexOfLab(e.lab), reflectance: e.reflectance ?? null, looks: per as LiveZone[] };
}

/** The live zones of a surface being typed or slid (the caller debounces `surface`); the last answer stays while the next is computed. */
export const liveZonesQueryOptions = (looks: readonly SourcedLook[], surface: SurfaceSource | null) =>
  queryOptions({
    queryKey: ['live-zones', looks.map((l) => l.id), sourceKey(surface)],
    queryFn: ({ signal }) => zonesThrough(looks, surface!, signal),
    enabled: surface !== null && looks.length > 0,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
    retry: false,
  });
export const useLiveZones = (looks: readonly SourcedLook[], surface: SurfaceSource | null) => useQuery(liveZonesQueryOptions(looks, surface));
