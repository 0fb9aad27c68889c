/**
 * Tones of swatches through looks, and the merges between them. Composition only: the spectral engine
 * (shared/spectral/compute) gives each swatch's stops, eye stops and L*a*b*; the look's composition
 * (shared/look/compose-look) places the key, runs the tone pipeline and rounds the grey as photos do;
 * culori gives CIEDE2000. A merge: two swatches within `mergeStops` on the medium yet more than
 * `mergeDeltaE` apart to the eye.
 *
 * A surface's own light (`lightStops`, + lit hotter than the key, − under it) moves its exposure on the
 * medium and to the eye by that many stops before the tone pipeline, and its range with them; the zone,
 * the grey and the lost/blown flags then follow from the pipeline's own thresholds, and the merges compare
 * the moved tones. Its L*a*b* is that of the surface as lit (XYZ × 2^lightStops against the light's white).
 */
import { differenceCiede2000, modeLab65, useMode } from 'culori/fn';
import { simulateSwatches, type ResolvedSwatch, type StopsRange } from '../../../shared/spectral/compute';
import { xyzToLab } from '../../../shared/spectral/colour';
import { toneThrough, type ComposedLook } from '../../../shared/look/compose-look';
import type { LookTones, Merge, SwatchTone } from '../../../shared/schemas/board';
import type { Spectrum } from '../../../shared/spectral/spectrum';
import type { ResolvedLook } from './look-resolve';
import { cachedStopsRange } from './tone-ranges';

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
}

useMode(modeLab65);
/** CIEDE2000 by culori; the L*a*b* values are passed as they are (mode lab65, so culori converts nothing). */
const ciede2000 = differenceCiede2000();
const asLab = (l: [number, number, number]) => ({ mode: 'lab65' as const, l: l[0], a: l[1], b: l[2] });

/**
 * Pairs that merge: two swatches more than `mergeDeltaE` apart to the eye whose plausible ranges come
 * within `mergeStops` of each other (`possible`), or lie within it entirely (`certain`). Walks the swatches
 * in order of their ranges' low ends, comparing only those that can still come near.
 */
export function findMerges(tones: SwatchTone[], mergeStops: number, mergeDeltaE: number): Merge[] {
  const order = [...tones].sort((a, b) => a.range.plausible[0] - b.range.plausible[0] || a.stops - b.stops);
  const out: Merge[] = [];
  for (let i = 0; i < order.length; i++) {
    const a = order[i];
    const [aLo, aHi] = a.range.plausible;
    for (let j = i + 1; j < order.length && order[j].range.plausible[0] - aHi <= mergeStops; j++) {
      const b = order[j];
      const [bLo, bHi] = b.range.plausible;
      const deltaE = ciede2000(asLab(a.lab), asLab(b.lab));
      if (deltaE > mergeDeltaE) {
        const [x, y] = a.swatchId < b.swatchId ? [a, b] : [b, a];
        const certain = Math.max(aHi, bHi) - Math.min(aLo, bLo) <= mergeStops;
        out.push({ a: x.swatchId, b: y.swatchId, stopsApart: Math.abs(a.stops - b.stops), deltaE, certainty: certain ? 'certain' : 'possible' });
      }
    }
  }
  return out.sort((m, n) => Number(n.certainty === 'certain') - Number(m.certainty === 'certain') || m.stopsApart - n.stopsApart);
}

/** Every swatch through one look: placed on the zones, rendered to a grey, with its range and the merges. */
export function lookTones(look: ToneLook, swatches: ToneSwatch[], mergeStops: number, mergeDeltaE: number): LookTones {
  const resolved: ResolvedSwatch[] = swatches.map((s) => ({ name: s.name, reflectance: s.reflectance, estimated: s.estimated }));
  const path = look.composed.path;
  const sim = simulateSwatches(path, resolved);
  const tones: SwatchTone[] = sim.swatches.map((r, i) => {
    const by = swatches[i].lightStops ?? 0;
    const lab = by === 0 ? r.lab : xyzToLab([r.xyz[0] * 2 ** by, r.xyz[1] * 2 ** by, r.xyz[2] * 2 ** by], path.white);
    return {
      swatchId: swatches[i].id,
      ...toneThrough(look.composed, r.stops + by, r.eyeStops + by, movedRange(cachedStopsRange(path, resolved[i], r.exposure), by)),
      lab,
    };
  });
  return {
    lookId: look.id,
    lookName: look.name,
    filterStops: look.composed.factor.stops,
    tonePipeline: true,
    tones,
    merges: findMerges(tones, mergeStops, mergeDeltaE),
  };
}
