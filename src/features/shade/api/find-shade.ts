import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { apiPaths } from '../../../lib/paths';
import type { LookSources } from '../../../lib/look-sources';
import type { SkinParams, SurfaceSource } from '../../../lib/swatch-source';

/** Body of POST /api/shade: a light path, the target tone (zone or stops, before key placement) and the colour to stay near. */
export interface ShadeRequest extends LookSources {
  target: { zone: number } | { stops: number };
  near: string | SurfaceSource;
}

/** Answer of POST /api/shade. `stops` and `zone` are before key placement (the scale of /api/simulate). */
export interface ShadeAnswer {
  srgb: string;
  stops: number;
  zone: number;
  /** how far the answer's tone could move (its spectrum is estimated), stops before key */
  range?: { possible: [number, number]; plausible: [number, number] } | [number, number];
  /** false when the target cannot be reached from `near` (the closest reachable is answered) */
  reached: boolean;
  /** the parameter moved: 'lightness' (of the colour, or of makeup's paint), 'melanin' or 'coverage' */
  changed?: string;
  /** the moved parameter's value: L*, melanin volume fraction or coverage 0..1 */
  value?: number;
  /** the answer as a surface: `{ srgb }`, or the skin / makeup form with the parameter changed */
  source?: { srgb?: string; skin?: SkinParams; makeup?: unknown };
  /** the model's parameters of the answer (older form of `source`) */
  params?: { skin?: SkinParams; makeup?: unknown };
  /** why the target was not reached */
  message?: string;
}

export const findShade = (body: ShadeRequest) => api.post<ShadeAnswer>(apiPaths.shade(), body);
export const useFindShade = () => useMutation({ mutationFn: findShade });
