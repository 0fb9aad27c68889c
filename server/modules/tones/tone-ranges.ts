/**
 * The ranges of estimated swatches' tones through looks (shared/spectral/compute `stopsRange`: two small
 * linear programs each), kept per look and colour: a board asked for again answers from here. Keyed by the
 * estimated spectrum object (swatch-spectra.ts keeps one per colour) and a hash of the light path's medium
 * weights (the only thing of a look a range depends on), so an edited look gets fresh ranges and a
 * forgotten colour takes its ranges with it.
 *
 * The programs are the heavy part of a board's tones (about 0.2 ms a range: 800 for a board of 200 colours
 * through four looks). `prefillRanges` computes the missing ones in the compute pool's threads
 * (server/services/compute-pool.ts, `rangesJob`) before the tones are composed, so the
 * main thread only reads them here; results are the very same numbers, since both run `stopsRange`.
 */
import { simulateSwatches, stopsRange, type LightPath, type StopsRange } from '../../../shared/spectral/compute';
import type { Spectrum } from '../../../shared/spectral/spectrum';
import { computeJob } from '../../services/compute-jobs';
import type { ComputePool } from '../../services/compute-pool';

const byColour = new WeakMap<Spectrum, Map<string, StopsRange>>();
const weightKeys = new WeakMap<Float64Array, string>();
/** Ranges kept per colour (looks of a production rarely exceed this). */
const LOOKS_PER_COLOUR = 64;
/** Fewer missing ranges than this for a light path are left to `cachedStopsRange` (a pool round trip costs more). */
export const POOL_MIN_RANGES = 8;

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

/** Keeps a colour's range through the light path `key`, forgetting its oldest look past LOOKS_PER_COLOUR. */
function keep(reflectance: Spectrum, key: string, r: StopsRange): void {
  let perLook = byColour.get(reflectance);
  if (!perLook) byColour.set(reflectance, (perLook = new Map()));
  if (!perLook.has(key) && perLook.size >= LOOKS_PER_COLOUR) perLook.delete(perLook.keys().next().value!);
  perLook.set(key, r);
}

/** The range (stops before key placement) of a swatch's tone through `lightPath`, given its exposure m there. */
export function cachedStopsRange(lightPath: LightPath, swatch: { reflectance: Spectrum; estimated: boolean }, m: number): StopsRange {
  if (!swatch.estimated) return stopsRange(lightPath, swatch, m);
  const key = weightsKey(lightPath.mediumWeights);
  let r = byColour.get(swatch.reflectance)?.get(key);
  if (!r) {
    r = stopsRange(lightPath, swatch, m);
    keep(swatch.reflectance, key, r);
  }
  return r;
}

/** Values per range in `knownRanges`' packed form: possible low, high, plausible low, high. */
export const RANGE_VALUES = 4;

/**
 * The ranges through `lightPath` of the estimated `swatches` that are kept already, packed for a compute
 * thread (RANGE_VALUES numbers each, in order; NaN for a swatch not estimated or not kept): the tones job
 * (look-tones.job.ts) reads them there, so the cache stays in this one place, the main thread's.
 */
export function knownRanges(lightPath: LightPath, swatches: readonly { reflectance: Spectrum; estimated: boolean }[]): Float64Array {
  const out = new Float64Array(swatches.length * RANGE_VALUES).fill(NaN);
  const key = weightsKey(lightPath.mediumWeights);
  swatches.forEach((s, i) => {
    const r = s.estimated ? byColour.get(s.reflectance)?.get(key) : undefined;
    if (r) out.set([r.possible[0], r.possible[1], r.plausible[0], r.plausible[1]], i * RANGE_VALUES);
  });
  return out;
}

/** A packed range (see `knownRanges`) at index `i`, or undefined when it is NaN there. */
export function unpackRange(packed: Float64Array, i: number): StopsRange | undefined {
  const o = i * RANGE_VALUES;
  if (Number.isNaN(packed[o])) return undefined;
  return { possible: [packed[o], packed[o + 1]], plausible: [packed[o + 2], packed[o + 3]] };
}

/** Writes `r` packed at index `i` of `packed`. */
export function packRange(packed: Float64Array, i: number, r: StopsRange): void {
  packed.set([r.possible[0], r.possible[1], r.plausible[0], r.plausible[1]], i * RANGE_VALUES);
}

/** Keeps the ranges a compute thread solved (packed as `knownRanges`, NaN where it solved none). */
export function keepRanges(lightPath: LightPath, swatches: readonly { reflectance: Spectrum; estimated: boolean }[], solved: Float64Array): void {
  const key = weightsKey(lightPath.mediumWeights);
  swatches.forEach((s, i) => {
    const r = s.estimated ? unpackRange(solved, i) : undefined;
    if (r) keep(s.reflectance, key, r);
  });
}

/** The compute pool's 'ranges' job: estimated swatches through one light path, each with its exposure m there. */
export interface RangesJob {
  lightPath: LightPath;
  swatches: { reflectance: Spectrum; m: number }[];
}

/** A 'ranges' job: `stopsRange` of each swatch, in order. */
export function computeRanges(job: RangesJob): StopsRange[] {
  return job.swatches.map((s) => stopsRange(job.lightPath, { reflectance: s.reflectance, estimated: true }, s.m));
}

/** `computeRanges` as a compute-pool job (this module is loaded in the pool's threads: engine imports only). */
export const rangesJob = computeJob<RangesJob, StopsRange[]>('ranges', import.meta.url, computeRanges);

/**
 * Computes, in the compute pool, the ranges that tones of `swatches` through `lightPaths` are about to ask
 * `cachedStopsRange` for and that are not kept yet (one job per light path, so several looks spread over
 * the pool's threads), and keeps them. Without a pool, or with only a few missing, it leaves them to
 * `cachedStopsRange`. Each swatch's exposure comes from `simulateSwatches`, as the tones' own does.
 */
export async function prefillRanges(pool: ComputePool | undefined, lightPaths: readonly LightPath[], swatches: readonly { reflectance: Spectrum; estimated: boolean }[]): Promise<void> {
  if (!pool) return;
  const colours = [...new Set(swatches.filter((s) => s.estimated).map((s) => s.reflectance))];
  if (colours.length < POOL_MIN_RANGES) return;
  const jobs: Promise<void>[] = [];
  const seen = new Set<string>();
  for (const lightPath of lightPaths) {
    const key = weightsKey(lightPath.mediumWeights);
    if (seen.has(key)) continue;
    seen.add(key);
    const missing = colours.filter((c) => !byColour.get(c)?.has(key));
    if (missing.length < POOL_MIN_RANGES) continue;
    const sim = simulateSwatches(lightPath, missing.map((reflectance) => ({ name: '', reflectance, estimated: true })));
    const job: RangesJob = { lightPath, swatches: missing.map((reflectance, i) => ({ reflectance, m: sim.swatches[i].exposure })) };
    jobs.push(pool.run(rangesJob, job, { waitUnbounded: true }).then((ranges) => missing.forEach((c, i) => keep(c, key, ranges[i]))));
  }
  await Promise.all(jobs);
}
