/**
 * Tones of swatches through looks in the compute pool (look-tones.job.ts), from the main thread's side:
 * the looks composed and the swatches read here are handed to the pool's threads with the ranges held
 * here, and the ranges a thread solved are kept here. A large board's looks go one per job, so they spread
 * over the threads; a small one's go in one job (a round trip per look would cost more than its tones).
 * Without a pool (a service outside an app) the same job runs in place.
 */
import type { LookTones } from '../../../shared/schemas/board';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';
import type { ComputePool } from '../../services/compute-pool';
import type { ToneLook, ToneSwatch } from './board-tones';
import { computeLookTones, lookTonesJob, type JobSwatches, type LookTonesAnswer, type LookTonesJob } from './look-tones.job';
import { keepRanges, knownRanges } from './tone-ranges';

/** From this many swatches a board's looks go one per job (below it, all in one). */
export const LOOK_PER_JOB_FROM = 100;

/** A swatch as stored, as far as the pool needs it: a colour swatch (no reflectance) is estimated there from its hex. */
export interface StoredColour {
  hex: string;
  reflectance: unknown;
}

/** The swatches by column; `rows[i]` is the stored swatch of `swatches[i]`. */
function jobSwatches(rows: readonly StoredColour[], swatches: readonly ToneSwatch[]): JobSwatches {
  const n = swatches.length;
  const out: JobSwatches = { ids: new Int32Array(n), hex: [], reflectance: [], estimated: new Uint8Array(n), lightStops: new Float64Array(n) };
  swatches.forEach((s, i) => {
    const fromHex = !rows[i].reflectance;
    out.ids[i] = s.id;
    out.hex.push(fromHex ? rows[i].hex : null);
    out.reflectance.push(fromHex ? null : s.reflectance);
    out.estimated[i] = s.estimated ? 1 : 0;
    out.lightStops[i] = s.lightStops ?? 0;
  });
  return out;
}

/**
 * Runs one job for `looks`: in the pool (each look first by its key alone, then with its spectra if the
 * thread does not hold its composition), or in place without one.
 */
async function run(pool: ComputePool | undefined, looks: readonly ToneLook[], part: Omit<LookTonesJob, 'looks'>, swatches: readonly ToneSwatch[], table: UpsampleTable): Promise<LookTonesAnswer> {
  const jobLooks = (withSpectra: boolean) =>
    looks.map((l) => ({
      id: l.id,
      name: l.name,
      pipelineKey: l.pipelineKey ?? null,
      spectra: withSpectra || l.pipelineKey === undefined ? l.composed.spectra : null,
      known: knownRanges(l.composed.path, swatches),
    }));
  if (!pool) return computeLookTones({ ...part, looks: jobLooks(true) }, table);
  // in place (COMPUTE_WORKERS=0) nothing is cloned: the spectra go along at once
  if (pool.size === 0) return pool.run(lookTonesJob, { ...part, looks: jobLooks(true) }, { table });
  const first = await pool.run(lookTonesJob, { ...part, looks: jobLooks(false) }, { table, waitUnbounded: true });
  if (!first.unknown.length) return first;
  return pool.run(lookTonesJob, { ...part, looks: jobLooks(true) }, { table, waitUnbounded: true });
}

/**
 * Each look's tones of `swatches` (ToneSwatch of the stored `rows`, same order), as `lookTones` answers them,
 * or as their JSON text when `json`: computed in the compute pool.
 */
export async function pooledLookTones(
  pool: ComputePool | undefined,
  table: UpsampleTable,
  looks: readonly ToneLook[],
  rows: readonly StoredColour[],
  swatches: readonly ToneSwatch[],
  merge: { mergeStops: number; mergeDeltaE: number },
  json: true,
): Promise<string[]>;
export async function pooledLookTones(
  pool: ComputePool | undefined,
  table: UpsampleTable,
  looks: readonly ToneLook[],
  rows: readonly StoredColour[],
  swatches: readonly ToneSwatch[],
  merge: { mergeStops: number; mergeDeltaE: number },
  json?: false,
): Promise<LookTones[]>;
export async function pooledLookTones(
  pool: ComputePool | undefined,
  table: UpsampleTable,
  looks: readonly ToneLook[],
  rows: readonly StoredColour[],
  swatches: readonly ToneSwatch[],
  merge: { mergeStops: number; mergeDeltaE: number },
  json = false,
): Promise<(LookTones | string)[]> {
  if (!looks.length) return [];
  const cols = jobSwatches(rows, swatches);
  const perJob = swatches.length >= LOOK_PER_JOB_FROM ? 1 : looks.length;
  const jobs: Promise<LookTonesAnswer>[] = [];
  for (let at = 0; at < looks.length; at += perJob) {
    jobs.push(run(pool, looks.slice(at, at + perJob), { swatches: cols, ...merge, json }, swatches, table));
  }
  const answers = await Promise.all(jobs);
  const out: (LookTones | string)[] = [];
  answers.forEach((a, j) => {
    a.looks.forEach((t, k) => {
      const look = looks[j * perJob + k];
      const solved = a.solved[k];
      if (solved) keepRanges(look.composed.path, swatches, solved);
      out.push(t);
    });
  });
  return out;
}
