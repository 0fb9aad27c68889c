/**
 * Jobs of the compute pool (compute-pool.ts), and the messages its threads exchange.
 *
 * A job is a pure function of a structured-clone payload (and, for jobs that estimate colours, the
 * upsampling table), declared with `computeJob(name, import.meta.url, fn)` in the module that owns it
 * (e.g. modules/simulate/simulate.job.ts). A thread imports that module by its URL the first time it
 * runs one of its jobs; in-place mode (COMPUTE_WORKERS=0) calls `fn` directly. Both run the very same
 * function, so an answer does not depend on where it was computed. A job module is loaded in a worker
 * thread: it imports the engine (shared/) and pure helpers only, never the database or Express.
 *
 * This file is loaded by the threads too: keep it light (no logger, no Express, no database).
 */
import { SpectralInputError } from '../../shared/spectral/errors';
import type { UpsampleTable } from '../../shared/spectral/upsample-table';

/** A job as the pool runs it: its name, the module that exports it, and the function itself. */
export interface ComputeJob<P, R> {
  readonly name: string;
  /** file: URL of the module exporting this job (its `import.meta.url`) */
  readonly moduleUrl: string;
  readonly run: (payload: P, table: UpsampleTable | null) => R | Promise<R>;
}

/** Declares a job; export the result from the module whose `import.meta.url` is given. */
export function computeJob<P, R>(name: string, moduleUrl: string, run: (payload: P, table: UpsampleTable | null) => R | Promise<R>): ComputeJob<P, R> {
  return Object.freeze({ name, moduleUrl, run });
}

/** The table a job needs (its payload holds colour values); a missing one is a programming error. */
export function needTable(table: UpsampleTable | null): UpsampleTable {
  if (!table) throw new Error('this compute job needs the upsampling table');
  return table;
}

/** True for a value `computeJob` made (how a thread finds the job named in a message among a module's exports). */
export function isComputeJob(v: unknown): v is ComputeJob<unknown, unknown> {
  return !!v && typeof v === 'object' && typeof (v as ComputeJob<unknown, unknown>).name === 'string' && typeof (v as ComputeJob<unknown, unknown>).run === 'function';
}

/** The upsampling table as a thread receives it: its values in shared memory, kept by `key`. */
export interface SharedTable {
  key: number;
  resolution: number;
  version: number;
  zNodes: Float32Array;
  spectra: SharedArrayBuffer;
}

/** Main thread → worker. */
export interface JobMessage {
  id: number;
  name: string;
  moduleUrl: string;
  payload: unknown;
  table: SharedTable | null;
  /** answer the result as JSON text (serialised in the thread, off the main one) */
  json: boolean;
}

/** A job's failure as it crosses threads: an engine input error (a 400) keeps its reason and path. */
export type JobFailure = { input: { reason: string; path: (string | number)[] } } | { message: string; stack?: string };

/** Worker → main thread. */
export type JobReply =
  | { id: number; ok: true; result?: unknown; text?: string; ms: number; threadId: number }
  | { id: number; ok: false; error: JobFailure; ms: number; threadId: number };

/** A thrown value as a JobFailure. */
export function encodeFailure(err: unknown): JobFailure {
  if (err instanceof SpectralInputError) return { input: { reason: err.reason, path: [...err.path] } };
  if (err instanceof Error) return { message: err.message, stack: err.stack };
  return { message: String(err) };
}

/** Thrown on the main thread for a job that failed in a thread with something other than an input error (a 500). */
export class ComputeJobError extends Error {
  readonly name = 'ComputeJobError';
  constructor(
    readonly job: string,
    message: string,
    readonly workerStack?: string,
  ) {
    super(`compute job "${job}" failed: ${message}`);
  }
}

/** A JobFailure back as the error it was: a SpectralInputError for input, else a ComputeJobError. */
export function decodeFailure(job: string, f: JobFailure): Error {
  if ('input' in f) return new SpectralInputError(f.input.reason, f.input.path);
  return new ComputeJobError(job, f.message, f.stack);
}
