/**
 * One thread of the compute pool (compute-pool.ts). As it starts, it loads the job modules the pool
 * announced (`preload`) and says it is ready. Runs one job per message: it imports the job's module
 * the first time (by the URL the job was declared with, compute-jobs.ts), takes the payload and the shared
 * table, and answers the result (or its JSON text). A job's own error is answered, not thrown; anything that
 * escapes (an uncaught error, an exit) ends the thread, and the pool replaces it.
 * Loaded through tsx's API by the pool's bootstrap, so it is TypeScript like the rest of the server.
 */
import { parentPort, threadId, workerData } from 'node:worker_threads';
import type { UpsampleTable } from '../../shared/spectral/upsample-table';
import { encodeFailure, isComputeJob, type ComputeJob, type JobMessage, type JobReply, type SharedTable } from './compute-jobs';

type AnyJob = ComputeJob<unknown, unknown>;

/** Job modules loaded, by URL: their jobs by name. */
const modules = new Map<string, Promise<Map<string, AnyJob>>>();
function jobsOf(moduleUrl: string): Promise<Map<string, AnyJob>> {
  let p = modules.get(moduleUrl);
  if (!p) {
    p = import(moduleUrl).then((mod: Record<string, unknown>) => new Map(Object.values(mod).filter(isComputeJob).map((j) => [j.name, j])));
    modules.set(moduleUrl, p);
  }
  return p;
}

/** Tables seen, by key: one view per table, so the engine's caches keyed by the table object keep working. */
const tables = new Map<number, UpsampleTable>();
function tableOf(t: SharedTable): UpsampleTable {
  let table = tables.get(t.key);
  if (!table) {
    table = Object.freeze({ resolution: t.resolution, version: t.version, zNodes: t.zNodes, spectra: new Float32Array(t.spectra) });
    tables.set(t.key, table);
  }
  return table;
}

async function run(m: JobMessage): Promise<JobReply> {
  const t0 = performance.now();
  try {
    const job = (await jobsOf(m.moduleUrl)).get(m.name);
    if (!job) throw new Error(`${m.moduleUrl} exports no compute job "${m.name}"`);
    const result = await job.run(m.payload, m.table ? tableOf(m.table) : null);
    const ms = performance.now() - t0;
    return m.json ? { id: m.id, ok: true, text: JSON.stringify(result), ms, threadId } : { id: m.id, ok: true, result, ms, threadId };
  } catch (err) {
    return { id: m.id, ok: false, error: encodeFailure(err), ms: performance.now() - t0, threadId };
  }
}

/** Posts a reply; an answer that cannot cross threads is answered as the job's failure. */
function reply(r: JobReply): void {
  try {
    parentPort!.postMessage(r);
  } catch (err) {
    parentPort!.postMessage({ id: r.id, ok: false, error: encodeFailure(err), ms: r.ms, threadId } satisfies JobReply);
  }
}

parentPort!.on('message', (m: JobMessage) => {
  void run(m).then(reply);
});

// the job modules the pool announced: loaded now, so the first job does not wait for the engine to load
const { preload = [] } = workerData as { preload?: string[] };
void Promise.allSettled(preload.map(jobsOf)).then(() => parentPort!.postMessage({ ready: true }));
