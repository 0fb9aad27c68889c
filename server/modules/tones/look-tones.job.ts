/**
 * The compute pool's 'look-tones' job: swatches through one or more looks (simulation, tone pipeline,
 * ranges, merges: board-tones.ts `lookTones`), run in a worker thread so the main thread only reads the
 * database and writes the answer (issue 15: a 2,000-swatch board through four looks is about 300 ms of
 * engine and merges, half of it per thread when its looks are spread over the pool's two threads).
 *
 * What crosses the thread boundary, and why:
 * - each look's key (tone.service.ts `pipelineKey`, what its composition depends on): a thread composes a
 *   look once and keeps it by that key, so the look's spectra (shared/look/compose-look `LookSpectra`) are
 *   sent only when the thread answers that it does not hold it (`unknown`; cloning them was a twentieth of
 *   a small board's main-thread time under load);
 * - each swatch's colour (a colour swatch's spectrum is estimated here, from the shared upsampling table,
 *   and kept per colour as on the main thread) or its stored reflectance;
 * - the ranges the main thread already holds, packed (tone-ranges.ts `knownRanges`); the few a thread solves
 *   come back packed for the main thread to keep, so the range cache stays in one place.
 * The answer is each look's `LookTones`, or its JSON text (serialised here, off the main thread).
 * Both paths run `lookTones`, so a tone does not depend on where it was computed.
 *
 * This module is loaded in the pool's threads: engine and pure helpers only (no database, no Express).
 */
import { composeLook, type ComposedLook, type LookSpectra } from '../../../shared/look/compose-look';
import { stopsRange } from '../../../shared/spectral/compute';
import type { Spectrum } from '../../../shared/spectral/spectrum';
import type { LookTones } from '../../../shared/schemas/board';
import { computeJob, needTable } from '../../services/compute-jobs';
import { LruCache } from '../../services/cache';
import { estimatedSpectrum } from './swatch-spectra';
import { lookTones, type ToneSwatch } from './board-tones';
import { RANGE_VALUES, packRange, unpackRange } from './tone-ranges';

/** One look of a job: its id and name for the answer, its spectra, and the ranges the main thread holds. */
export interface JobLook {
  id: number;
  name: string;
  /** what its composition depends on (tone.service.ts `pipelineKey`): the key of the thread's own cache; null: not kept */
  pipelineKey: string | null;
  /** its spectra; null to ask the thread to use the composition it keeps by `pipelineKey` */
  spectra: LookSpectra | null;
  /** ranges through this look, packed (tone-ranges.ts `knownRanges`; NaN where not held) */
  known: Float64Array;
}

/** The swatches of a job, by column (cheap to clone): a colour swatch gives its hex, any other its reflectance. */
export interface JobSwatches {
  ids: Int32Array;
  /** the colour whose estimate is the spectrum, or null when `reflectance` is given */
  hex: (string | null)[];
  reflectance: (Spectrum | null)[];
  /** 1 when the spectrum is estimated (its tone has a range) */
  estimated: Uint8Array;
  lightStops: Float64Array;
}

export interface LookTonesJob {
  looks: JobLook[];
  swatches: JobSwatches;
  mergeStops: number;
  mergeDeltaE: number;
  /** answer each look's JSON text instead of the object */
  json: boolean;
}

export interface LookTonesAnswer {
  /** indices of the job's looks sent without spectra whose composition the thread does not hold: nothing was computed, send them again with their spectra */
  unknown: number[];
  /** per look, in order: its tones, or their JSON text */
  looks: (LookTones | string)[];
  /** per look: the ranges solved here, packed (NaN elsewhere), or null when none was */
  solved: (Float64Array | null)[];
}

/** Looks kept composed in a thread (a few productions' looks, as tone.service.ts keeps them on the main thread). */
const COMPOSED_KEPT = 200;
/**
 * Looks composed in this thread, by their content (`pipelineKey`). The thread's own copy of cache.ts's switch
 * is not the main thread's: the API bench's "before" (caches off in the main thread) keeps this one, and
 * `GRISAILLE_NO_CACHE=1` turns both off.
 */
const composed = new LruCache<string, ComposedLook>(COMPOSED_KEPT);

/** Whether the thread can compose `l`: it was sent with its spectra, or its composition is kept. */
const composable = (l: JobLook) => l.spectra !== null || (l.pipelineKey !== null && composed.get(l.pipelineKey) !== undefined);

function composedLook(l: JobLook): ComposedLook {
  if (l.pipelineKey === null) return composeLook(l.spectra!);
  const kept = composed.get(l.pipelineKey);
  if (kept) return kept;
  const c = composeLook(l.spectra!);
  composed.set(l.pipelineKey, c);
  return c;
}

/** The swatches as `lookTones` takes them. */
function toneSwatches(s: JobSwatches, table: Parameters<typeof estimatedSpectrum>[1] | null): ToneSwatch[] {
  return Array.from(s.ids, (id, i) => {
    const hex = s.hex[i];
    const reflectance = hex !== null ? estimatedSpectrum(hex, needTable(table)) : s.reflectance[i]!;
    return { id, name: '', reflectance, estimated: s.estimated[i] === 1, lightStops: s.lightStops[i] };
  });
}

/** Runs a 'look-tones' job (see the file's doc). */
export function computeLookTones(job: LookTonesJob, table: Parameters<typeof estimatedSpectrum>[1] | null): LookTonesAnswer {
  const unknown = job.looks.flatMap((l, i) => (composable(l) ? [] : [i]));
  if (unknown.length) return { unknown, looks: [], solved: [] };
  const swatches = toneSwatches(job.swatches, table);
  const looks: (LookTones | string)[] = [];
  const solved: (Float64Array | null)[] = [];
  for (const l of job.looks) {
    const look = composedLook(l);
    let fresh: Float64Array | null = null;
    const tones = lookTones({ id: l.id, name: l.name, composed: look }, swatches, job.mergeStops, job.mergeDeltaE, (i, s, m) => {
      if (!s.estimated) return stopsRange(look.path, s, m);
      const held = unpackRange(l.known, i);
      if (held) return held;
      const r = stopsRange(look.path, s, m);
      packRange((fresh ??= new Float64Array(swatches.length * RANGE_VALUES).fill(NaN)), i, r);
      return r;
    });
    looks.push(job.json ? JSON.stringify(tones) : tones);
    solved.push(fresh);
  }
  return { unknown, looks, solved };
}

/** `computeLookTones` as a compute-pool job. */
export const lookTonesJob = computeJob<LookTonesJob, LookTonesAnswer>('look-tones', import.meta.url, computeLookTones);
