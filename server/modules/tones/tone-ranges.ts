/**
 * The ranges of estimated swatches' tones through looks (shared/spectral/compute `stopsRange`: two small
 * linear programs each), kept per look and colour: a board asked for again answers from here. Keyed by the
 * estimated spectrum object (swatch-spectra.ts keeps one per colour) and a hash of the light path's medium
 * weights (the only thing of a look a range depends on), so an edited look gets fresh ranges and a
 * forgotten colour takes its ranges with it.
 */
import { stopsRange, type LightPath, type StopsRange } from '../../../shared/spectral/compute';
import type { Spectrum } from '../../../shared/spectral/spectrum';

const byColour = new WeakMap<Spectrum, Map<string, StopsRange>>();
const weightKeys = new WeakMap<Float64Array, string>();
/** Ranges kept per colour (looks of a production rarely exceed this). */
const LOOKS_PER_COLOUR = 64;

/** FNV-1a over the weights' bytes: a key for the light path a range was computed through. */
function weightsKey(w: Float64Array): string {
  let k = weightKeys.get(w);
  if (k) return k;
  const bytes = new Uint8Array(w.buffer, w.byteOffset, w.byteLength);
  let h1 = 0x811c9dc5;
  let h2 = 0x01000193;
  for (let i = 0; i < bytes.length; i++) {
    h1 = Math.imul(h1 ^ bytes[i], 0x01000193);
    h2 = Math.imul(h2 ^ bytes[bytes.length - 1 - i], 0x811c9dc5);
  }
  k = `${(h1 >>> 0).toString(36)}${(h2 >>> 0).toString(36)}`;
  weightKeys.set(w, k);
  return k;
}

/** The range (stops before key placement) of a swatch's tone through `lightPath`, given its exposure m there. */
export function cachedStopsRange(lightPath: LightPath, swatch: { reflectance: Spectrum; estimated: boolean }, m: number): StopsRange {
  if (!swatch.estimated) return stopsRange(lightPath, swatch, m);
  let perLook = byColour.get(swatch.reflectance);
  if (!perLook) byColour.set(swatch.reflectance, (perLook = new Map()));
  const key = weightsKey(lightPath.mediumWeights);
  let r = perLook.get(key);
  if (!r) {
    r = stopsRange(lightPath, swatch, m);
    if (perLook.size >= LOOKS_PER_COLOUR) perLook.delete(perLook.keys().next().value!);
    perLook.set(key, r);
  }
  return r;
}
