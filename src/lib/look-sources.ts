/**
 * A saved look as the engine's sources (light, filters, medium), for POST /api/simulate and /api/shade:
 * production curves are sent as their grid samples, filters on the light become gels on the light, and
 * the look's key placement is reported so tones before key can be moved onto the board's zones.
 */
import type { CurveView } from '../../shared/schemas/curve';
import type { LookView } from '../../shared/schemas/look';
import type { FilterSource, LightSource, MediumSource } from '../../shared/schemas/simulate';
import type { SwatchView } from '../../shared/schemas/swatch';
import { keyOffsetStops } from '../../shared/tone/zones';
import { sourceOfSwatch, type SurfaceSource } from './swatch-source';

export interface LookSources {
  light: LightSource;
  filters: FilterSource[];
  medium: MediumSource;
}

/** How a look places its key: the key surface (null: middle grey) and the zone it goes on. */
export interface LookKey {
  surface: SurfaceSource | null;
  zone: number;
}

/** A look ready to compute with: its id and name, its sources and its key. */
export interface SourcedLook {
  id: number;
  name: string;
  sources: LookSources;
  key: LookKey;
}

type Ref<S> = { curveId?: number; source?: S };

function fromRef<S>(ref: Ref<S>, curves: ReadonlyMap<number, CurveView>, asCurve: (c: CurveView) => S): S | null {
  if (ref.source) return ref.source;
  const c = ref.curveId !== undefined ? curves.get(ref.curveId) : undefined;
  return c ? asCurve(c) : null;
}

/**
 * A saved look → sources, or null when one of its production curves is not at hand (not loaded yet, or
 * deleted). Curves are on the engine's grid in its basis: transmittance, relative power, energy sensitivity.
 */
export function lookSources(look: LookView, curves: readonly CurveView[]): LookSources | null {
  const byId = new Map(curves.map((c) => [c.id, c]));
  const light = fromRef<LightSource>(look.light, byId, (c) => ({ samples: c.samples }));
  const medium = fromRef<MediumSource>(look.medium, byId, (c) => ({ samples: c.samples, basis: 'energy' }));
  const filters = look.filters.map((f) => ({ on: f.on, source: fromRef<FilterSource>(f.filter, byId, (c) => ({ samples: c.samples, basis: 'transmittance' })) }));
  if (!light || !medium || filters.some((f) => !f.source)) return null;
  const gels = filters.filter((f) => f.on === 'light').map((f) => f.source!);
  return {
    light: gels.length ? { ...light, gels: [...(light.gels ?? []), ...gels] } : light,
    filters: filters.filter((f) => f.on !== 'light').map((f) => f.source!),
    medium,
  };
}

/** The saved looks that can be computed with, each with its key (the key swatch looked up in `swatches`). */
export function sourcedLooks(looks: readonly LookView[], curves: readonly CurveView[], swatches: readonly SwatchView[]): SourcedLook[] {
  const swatchById = new Map(swatches.map((s) => [s.id, s]));
  return looks.flatMap((l) => {
    const sources = lookSources(l, curves);
    if (!sources) return [];
    const keySwatch = l.tone.keySwatchId !== null ? swatchById.get(l.tone.keySwatchId) : undefined;
    return [{ id: l.id, name: l.name, sources, key: { surface: keySwatch ? sourceOfSwatch(keySwatch) : null, zone: l.tone.keyZone } }];
  });
}

/** Stops added to every tone before key to place the key (`keyStopsBeforeKey`: the key surface's stops, 0 for middle grey). */
export const keyOffset = (key: LookKey, keyStopsBeforeKey: number | null) => keyOffsetStops(key.surface ? (keyStopsBeforeKey ?? 0) : 0, key.zone);
