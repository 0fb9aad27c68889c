/**
 * Tones of swatches through looks, and the merges between them. Composition only: the spectral engine
 * (shared/spectral/compute) gives each swatch's stops, eye stops and L*a*b*; the tone pipeline
 * (shared/tone/tone-pipeline) places the key, runs the characteristic curve and the print or display and
 * gives the grey and the lost/blown flags; culori gives CIEDE2000. A merge: two swatches within
 * `mergeStops` on the medium yet more than `mergeDeltaE` apart to the eye.
 */
import { differenceCiede2000, modeLab65, useMode } from 'culori/fn';
import { simulateSwatches, type ResolvedSwatch } from '../../../shared/spectral/compute';
import { buildTonePipeline } from '../../../shared/tone/tone-pipeline';
import { keyOffsetStops } from '../../../shared/tone/zones';
import { TONE_MEDIUM_IDS } from '../../../shared/tone/media-tone';
import type { ToneSettings } from '../../../shared/schemas/exposure';
import type { LookTones, Merge, SwatchTone } from '../../../shared/schemas/board';
import type { Spectrum } from '../../../shared/spectral/spectrum';
import type { ResolvedLook } from '../looks/look-resolve';

export interface ToneSwatch {
  id: number;
  name: string;
  reflectance: Spectrum;
  estimated: boolean;
}

export interface ToneLook {
  id: number;
  name: string;
  resolved: ResolvedLook;
  tone: ToneSettings;
  /** the key swatch's reflectance when the look places a swatch as key (else middle grey is the key) */
  key?: Spectrum | null;
}

useMode(modeLab65);
/** CIEDE2000 by culori; the L*a*b* values are passed as they are (mode lab65, so culori converts nothing). */
const ciede2000 = differenceCiede2000();
const asLab = (l: [number, number, number]) => ({ mode: 'lab65' as const, l: l[0], a: l[1], b: l[2] });

/** The tone-defaults id of a look's medium: built-in media by their id, production curves as `curve.<id>`. */
export function toneMediumId(look: ResolvedLook): string {
  const id = look.medium.libraryId;
  if (id === null) return look.medium.curveId !== null ? `curve.${look.medium.curveId}` : 'custom';
  if (TONE_MEDIUM_IDS.includes(id)) return id;
  if (TONE_MEDIUM_IDS.includes(`medium.${id}`)) return `medium.${id}`;
  return id;
}

/** Pairs that merge, found by walking the swatches in order of stops (only near neighbours are compared). */
export function findMerges(tones: SwatchTone[], mergeStops: number, mergeDeltaE: number): Merge[] {
  const order = [...tones].sort((a, b) => a.stops - b.stops);
  const out: Merge[] = [];
  for (let i = 0; i < order.length; i++) {
    for (let j = i + 1; j < order.length && order[j].stops - order[i].stops <= mergeStops; j++) {
      const a = order[i];
      const b = order[j];
      const deltaE = ciede2000(asLab(a.lab), asLab(b.lab));
      if (deltaE > mergeDeltaE) {
        const [x, y] = a.swatchId < b.swatchId ? [a, b] : [b, a];
        out.push({ a: x.swatchId, b: y.swatchId, stopsApart: Math.abs(a.stops - b.stops), deltaE });
      }
    }
  }
  return out.sort((m, n) => m.stopsApart - n.stopsApart);
}

/** Every swatch through one look: placed on the zones, rendered to a grey, with merges. */
export function lookTones(look: ToneLook, swatches: ToneSwatch[], mergeStops: number, mergeDeltaE: number): LookTones {
  const stack = look.resolved.stack;
  const resolved: ResolvedSwatch[] = swatches.map((s) => ({ name: s.name, reflectance: s.reflectance, estimated: s.estimated }));
  const sim = simulateSwatches(stack, resolved);
  const keyStops = look.key ? simulateSwatches(stack, [{ name: 'key', reflectance: look.key, estimated: false }]).swatches[0].stops : 0;
  const offset = keyOffsetStops(keyStops, look.tone.keyZone);
  const pipeline = buildTonePipeline({ mediumId: toneMediumId(look.resolved), settings: look.tone, offsetStops: offset });
  const tones: SwatchTone[] = sim.swatches.map((r, i) => {
    const t = pipeline.renderStops(r.stops);
    const eyeStops = r.eyeStops + offset;
    return {
      swatchId: swatches[i].id,
      stops: t.stops,
      eyeStops,
      shift: t.stops - eyeStops,
      zone: t.zone,
      numeral: t.numeral,
      grey: t.srgb8,
      lost: t.lost,
      blown: t.blown,
      lab: r.lab,
    };
  });
  return {
    lookId: look.id,
    lookName: look.name,
    filterStops: look.resolved.factor.stops,
    tonePipeline: true,
    tones,
    merges: findMerges(tones, mergeStops, mergeDeltaE),
  };
}
