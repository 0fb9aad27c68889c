/**
 * A surface as the engine's endpoints take it (POST /api/simulate and POST /api/shade): a colour, a
 * reflectance, a skin made from physics, or makeup over a surface. Also the same for a stored swatch, so a
 * saved swatch can be the base or the paint of makeup, or the `near` colour of the shade solver.
 */
import type { SwatchView } from '../../shared/schemas/swatch';

/** Skin parameters (shared/spectral/skin.ts): volume fractions and saturation, 0..1. */
export interface SkinParams {
  /** eumelanin volume fraction of the epidermis, 0..0.5 */
  melanin: number;
  /** blood volume fraction of the dermis, 0..0.3 */
  blood: number;
  /** oxygen saturation of that blood, 0..1 */
  oxygenation: number;
  pheomelanin?: number;
  bilirubin?: number;
  carotene?: number;
}

/** A layer of paint over a surface, coverage 0 (bare surface) .. 1 (the paint alone). */
export interface MakeupParams {
  over: SurfaceSource;
  colour: string | SurfaceSource;
  coverage: number;
}

/** A surface without a name (a swatch source nested in makeup, or `near`). */
export type SurfaceSource =
  | { srgb: string }
  | { rgb: [number, number, number] }
  | { lab: [number, number, number] }
  | { reflectance: [number, number][]; basis?: 'fraction' | 'percent' }
  | { skin: SkinParams }
  | { makeup: MakeupParams };

/** A named surface, as a swatch of POST /api/simulate. */
export type NamedSurface = SurfaceSource & { name: string };

/** What a stored swatch keeps of how it was made, including the physical forms (skin, makeup). */
export type AnyOrigin = { type: string; skin?: SkinParams; makeup?: MakeupParams };

/** The origin of a stored swatch, read loosely: the physical forms may be newer than the shared type. */
export const originOf = (s: Pick<SwatchView, 'origin'>): AnyOrigin => s.origin as unknown as AnyOrigin;

/** The light a surface carries relative to the key, stops (+ lit hotter); 0 when none is stored. */
export const lightStopsOf = (s: SwatchView): number => Number((s as SwatchView & { lightStops?: number }).lightStops ?? 0) || 0;

/**
 * A stored swatch as a source: its skin or makeup parameters when it was made from physics, its measured
 * reflectance when measured, else its colour (estimated the same way the server estimates it).
 */
export function sourceOfSwatch(s: SwatchView): SurfaceSource {
  const o = originOf(s);
  if (o.type === 'skin' && o.skin) return { skin: o.skin };
  if (o.type === 'makeup' && o.makeup) return { makeup: o.makeup };
  if (s.spectrum === 'measured' && s.reflectance?.length) return { reflectance: s.reflectance, basis: 'fraction' };
  return { srgb: s.hex };
}

/** A stable text of a source (for query keys and comparisons). */
export const sourceKey = (s: SurfaceSource | null) => (s ? JSON.stringify(s) : '');

/** Whether a swatch is made from physics (skin or makeup): its parameters, not its colour, are edited. */
export const isPhysical = (s: Pick<SwatchView, 'origin'>) => ['skin', 'makeup'].includes(originOf(s).type);
