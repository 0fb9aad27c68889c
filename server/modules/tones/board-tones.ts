/**
 * Tones of swatches through looks, and the merges between them. Composition only: the spectral engine
 * (shared/spectral/compute) gives each swatch's stops, eye stops and L*a*b*; the look's composition
 * (shared/look/compose-look) places the key, runs the tone pipeline and rounds the grey as photos do;
 * the merges (two swatches within `mergeStops` on the medium yet more than `mergeDeltaE` apart to the eye)
 * come from ./board-merges, per swatch.
 *
 * A surface's own light (`lightStops`, + lit hotter than the key, − under it) moves its exposure on the
 * medium and to the eye by that many stops before the tone pipeline, and its range with them; the zone,
 * the grey and the lost/blown flags then follow from the pipeline's own thresholds, and the merges compare
 * the moved tones. Its L*a*b* is that of the surface as lit (XYZ × 2^lightStops against the light's white).
 */
import { simulateSwatches, type ResolvedSwatch, type StopsRange } from '../../../shared/spectral/compute';
import { xyzToLab } from '../../../shared/spectral/colour';
import { toneThrough, type ComposedLook } from '../../../shared/look/compose-look';
import type { LookTones, SwatchTone } from '../../../shared/schemas/board';
import type { Spectrum } from '../../../shared/spectral/spectrum';
import type { ResolvedLook } from './look-resolve';
import { cachedStopsRange } from './tone-ranges';
import { findMerges } from './board-merges';

export interface ToneSwatch {
  id: number;
  name: string;
  reflectance: Spectrum;
  estimated: boolean;
  /** its own light against the key, stops (+ hotter, − under; default 0) */
  lightStops?: number;
}

/** A range moved by a surface's own light, stops. */
const movedRange = (r: StopsRange, by: number): StopsRange =>
  by === 0 ? r : { possible: [r.possible[0] + by, r.possible[1] + by], plausible: [r.plausible[0] + by, r.plausible[1] + by] };

/** A look ready to tone swatches: its references (labels) and its composition. */
export interface ToneLook {
  id: number;
  name: string;
  resolved: ResolvedLook;
  composed: ComposedLook;
  /** what the composition depends on (tone.service.ts `pipelineKey`), so a compute thread can keep its own */
  pipelineKey?: string;
}

/**
 * The range (stops before key placement) of swatch `i` through the look, given its exposure m there: by
 * default from the range cache (tone-ranges.ts `cachedStopsRange`); the compute pool's tones job
 * (look-tones.job.ts) passes the ranges the main thread already holds instead.
 */
export type RangeOf = (i: number, swatch: ResolvedSwatch, exposure: number) => StopsRange;

/** Every swatch through one look: placed on the zones, rendered to a grey, with its range and the merges. */
export function lookTones(look: Omit<ToneLook, 'resolved'> & { resolved?: ResolvedLook }, swatches: readonly ToneSwatch[], mergeStops: number, mergeDeltaE: number, rangeOf?: RangeOf): LookTones {
  const resolved: ResolvedSwatch[] = swatches.map((s) => ({ name: s.name, reflectance: s.reflectance, estimated: s.estimated }));
  const path = look.composed.path;
  const range = rangeOf ?? ((_i: number, s: ResolvedSwatch, m: number) => cachedStopsRange(path, s, m));
  const sim = simulateSwatches(path, resolved);
  const tones: SwatchTone[] = sim.swatches.map((r, i) => {
    const by = swatches[i].lightStops ?? 0;
    const lab = by === 0 ? r.lab : xyzToLab([r.xyz[0] * 2 ** by, r.xyz[1] * 2 ** by, r.xyz[2] * 2 ** by], path.white);
    return {
      swatchId: swatches[i].id,
      ...toneThrough(look.composed, r.stops + by, r.eyeStops + by, movedRange(range(i, resolved[i], r.exposure), by)),
      lab,
    };
  });
  return {
    lookId: look.id,
    lookName: look.name,
    filterStops: look.composed.factor.stops,
    tonePipeline: true,
    tones,
    ...findMerges(tones, mergeStops, mergeDeltaE),
  };
}
