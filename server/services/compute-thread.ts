/**
 * Starting one thread of the compute pool (compute-pool.ts), and the upsampling table in shared memory.
 *
 * The thread runs TypeScript through tsx's API: Node 20 does not apply an `--import` loader given in a
 * Worker's execArgv to the worker's own entry (nodejs/node#47747; tsx issue #354), so a two-line JavaScript
 * bootstrap registers tsx in the thread and then imports compute-worker.ts. This works under
 * `tsx server/index.ts` and inside vitest alike (vite's transform does not reach a worker thread, so the
 * thread must load its TypeScript itself).
 */
import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { isMainThread, Worker, workerData } from 'node:worker_threads';
import type { UpsampleTable } from '../../shared/spectral/upsample-table';
import type { SharedTable } from './compute-jobs';

const ENTRY_URL = new URL('./compute-worker.ts', import.meta.url).href;
/** The thread's bootstrap (plain JavaScript, evaluated): register tsx, then load the TypeScript entry. */
const BOOTSTRAP = `const { workerData } = require('node:worker_threads');
import(workerData.tsxApi).then((tsx) => { tsx.register(); return import(workerData.entry); });`;

/** True inside one of the pool's own threads. */
const IN_COMPUTE_THREAD = !isMainThread && (workerData as { computeThread?: unknown } | null)?.computeThread === true;

let tsxApi: string | null = null;
/** file: URL of tsx's ESM API (`tsx/esm/api`, its `register()`), from tsx's own export map. */
function tsxApiUrl(): string {
  if (tsxApi) return tsxApi;
  const pkgFile = createRequire(import.meta.url).resolve('tsx/package.json');
  const pkg = JSON.parse(fs.readFileSync(pkgFile, 'utf8')) as { exports?: Record<string, { import?: { default?: string } }> };
  const rel = pkg.exports?.['./esm/api']?.import?.default;
  if (!rel) throw new Error('tsx does not export ./esm/api; the compute threads cannot load TypeScript');
  return (tsxApi = pathToFileURL(path.join(path.dirname(pkgFile), rel)).href);
}

const isTsx = (v: string | undefined) => v !== undefined && /(^|[\\/=])tsx([\\/]|$)/.test(v);
/** The parent's Node options without tsx's own hooks (the bootstrap registers tsx; twice would transform twice). */
function workerExecArgv(): string[] {
  const a = process.execArgv;
  const out: string[] = [];
  for (let i = 0; i < a.length; i++) {
    if (['--require', '-r', '--import', '--loader', '--experimental-loader'].includes(a[i]) && isTsx(a[i + 1])) i++;
    else if (!(a[i].startsWith('--') && a[i].includes('=') && isTsx(a[i]))) out.push(a[i]);
  }
  return out;
}

let tableKeys = 0;
const sharedTables = new WeakMap<UpsampleTable, SharedTable>();
/** The table's values in shared memory (copied once per table; every thread reads the same copy). */
export function shareTable(table: UpsampleTable): SharedTable {
  let s = sharedTables.get(table);
  if (!s) {
    const spectra = new SharedArrayBuffer(table.spectra.byteLength);
    new Float32Array(spectra).set(table.spectra);
    s = { key: ++tableKeys, resolution: table.resolution, version: table.version, zNodes: Float32Array.from(table.zNodes), spectra };
    sharedTables.set(table, s);
  }
  return s;
}

/** A new compute thread (compute-worker.ts) that loads the job modules `preload` as it starts. */
export function startComputeThread(preload: string[]): Worker {
  // a job module with side effects that made a pool would otherwise start threads from threads, without end
  if (IN_COMPUTE_THREAD) throw new Error('a compute thread cannot start compute threads');
  return new Worker(BOOTSTRAP, {
    eval: true,
    execArgv: workerExecArgv(),
    workerData: { tsxApi: tsxApiUrl(), entry: ENTRY_URL, computeThread: true, preload },
  });
}
