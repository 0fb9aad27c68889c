/**
 * The compute pool: a few worker threads that run the engine's heavy computations (jobs declared with
 * compute-jobs.ts `computeJob`: a simulation, a shade, tone ranges) off the main event loop, so reads stay fast while
 * someone computes (issue 14: one viewer's six parallel 2,000-swatch simulations took everyone's pages
 * from 10 ms to 420 ms, all on the one thread).
 *
 * - Size: COMPUTE_WORKERS (default min(2, cores)); 0 runs every job in place on the main thread, the old
 *   way (for comparison, and for a host that cannot start threads).
 * - Threads start at first use (or `warm()`) and end with the app (`close()`): tests make many apps.
 *   Each thread loads the job modules announced with `preload()` (by the routers and services that use
 *   them) as it starts, so a first computation does not wait for the engine to load.
 *   An idle thread does not keep the process alive.
 * - One FIFO queue; past COMPUTE_QUEUE_LIMIT waiting jobs a new one is refused (503, Retry-After). The
 *   computing part of a read (a board's, a swatch's or a sheet's tones and their ranges: `waitUnbounded`)
 *   waits instead and is not counted: those tones were never refused while they ran on the main thread,
 *   the open connections bound how many are in flight, and the limit stays for what POSTs ask for.
 * - Payloads and answers are structured clones; the upsampling table is copied once into shared memory
 *   and every thread reads that copy. A job may answer its JSON text, serialised in the thread.
 * - A thread that dies (an uncaught error, an exit) fails the job it held (a 500, and an operator's log
 *   line 'compute-worker-crashed'); the next job starts a new thread in its place.
 * - Threads run TypeScript through tsx (compute-thread.ts starts them), under `tsx server/index.ts` and
 *   inside vitest alike.
 */
import { threadId as mainThreadId, type Worker } from 'node:worker_threads';
import type { UpsampleTable } from '../../shared/spectral/upsample-table';
import { RetryLaterError } from '../errors';
import { decodeFailure, type ComputeJob, type JobMessage, type JobReply, type SharedTable } from './compute-jobs';
import { shareTable, startComputeThread } from './compute-thread';
import { logEvent } from './log';

/** Seconds a client is told to wait when the queue is full. */
export const BUSY_RETRY_AFTER_S = 5;

/** A refusal the client may retry after `retryAfterS` seconds (the route sets the Retry-After header, RFC 9110 §10.2.3). */
export { RetryLaterError }; // kept here for the pool's callers

/** Too many computations are waiting: 503 (RFC 9110 §15.6.4), with Retry-After. */
export class ComputeBusyError extends RetryLaterError {
  constructor() {
    super(503, 'server_busy', 'The server is busy with other computations; try again in a few seconds.', BUSY_RETRY_AFTER_S);
  }
}

/** The thread running a job died; the route answers 500 (the operator's log has the details). */
export class ComputeCrashError extends Error {
  readonly name = 'ComputeCrashError';
  constructor(readonly job: string) {
    super(`the compute thread running "${job}" stopped`);
  }
}

/** The pool was closed (the app is shutting down). */
export class ComputeClosedError extends Error {
  readonly name = 'ComputeClosedError';
  constructor() {
    super('the compute pool is closed');
  }
}

/** A job's answer as JSON text (serialised in the thread); the route sends it as it is. */
export class JsonText {
  constructor(readonly text: string) {}
}

export interface ComputePoolOptions {
  /** worker threads; 0 runs every job in place on the main thread */
  size: number;
  /** jobs that may wait for a thread; one more is refused with ComputeBusyError */
  queueLimit: number;
}

/** One finished job, for diagnostics and tests: where it ran and how long it took. */
export interface JobRecord {
  name: string;
  /** the thread that ran it (the main thread's id for in-place jobs) */
  threadId: number;
  ms: number;
  ok: boolean;
}

export interface ComputeStats {
  size: number;
  /** thread ids of the live worker threads */
  threads: number[];
  busy: number;
  queued: number;
  /** jobs finished by worker threads, and in place on the main thread */
  jobsInWorkers: number;
  jobsInProcess: number;
  crashes: number;
  /** the last jobs finished, newest last */
  recent: JobRecord[];
}

/** Options of one job: the table when its payload estimates colours; `waitUnbounded` for a read's share of work. */
export interface RunOptions {
  table?: UpsampleTable | null;
  /**
   * wait for a thread however long the queue (never ComputeBusyError): for the computing part of a read
   * (tones and their ranges), which was never refused while it ran on the main thread and whose number in
   * flight the connections already bound
   */
  waitUnbounded?: boolean;
}

interface Pending {
  id: number;
  job: ComputeJob<unknown, unknown>;
  payload: unknown;
  table: SharedTable | null;
  json: boolean;
  /** waits however long the queue, and is not counted against its limit (RunOptions.waitUnbounded) */
  unbounded: boolean;
  resolve(v: unknown): void;
  reject(e: Error): void;
}

interface Slot {
  worker: Worker | null;
  /** settles when the thread has loaded its preloads (or has died) */
  ready: Promise<void>;
  threadId: number;
  job: Pending | null;
  lastError: Error | null;
}

const RECENT = 50;

export class ComputePool {
  private readonly slots: Slot[];
  private readonly queue: Pending[] = [];
  private readonly recent: JobRecord[] = [];
  private readonly preloads = new Set<string>();
  private nextId = 1;
  private closed = false;
  private jobsInWorkers = 0;
  private jobsInProcess = 0;
  private crashes = 0;

  constructor(private readonly opts: ComputePoolOptions) {
    this.slots = Array.from({ length: Math.max(0, Math.floor(opts.size)) }, () => ({ worker: null, ready: Promise.resolve(), threadId: -1, job: null, lastError: null }));
  }

  /** Number of threads (0: jobs run in place). */
  get size(): number {
    return this.slots.length;
  }

  /** Runs `job` on `payload` and resolves with its answer; `table` when the payload estimates colours. */
  run<P, R>(job: ComputeJob<P, R>, payload: P, opts: RunOptions = {}): Promise<R> {
    return this.submit(job as ComputeJob<unknown, unknown>, payload, opts.table ?? null, false, opts.waitUnbounded === true) as Promise<R>;
  }

  /** Runs `job` and resolves with its answer's JSON text (serialised off the main thread). */
  async runJson<P, R>(job: ComputeJob<P, R>, payload: P, opts: { table?: UpsampleTable | null } = {}): Promise<JsonText> {
    return new JsonText((await this.submit(job as ComputeJob<unknown, unknown>, payload, opts.table ?? null, true)) as string);
  }

  /** Has every thread started from now on load these jobs' modules as it starts (routers and services announce theirs). */
  preload(...jobs: ComputeJob<never, unknown>[]): void {
    for (const j of jobs) this.preloads.add(j.moduleUrl);
  }

  /**
   * Starts every thread now (a server does at start, so the first computation waits neither for a thread
   * nor for the engine to load); settles when they are ready. Never rejects: a thread that cannot start is logged.
   */
  warm(): Promise<void> {
    if (this.closed) return Promise.resolve();
    try {
      for (const slot of this.slots) if (!slot.worker) this.spawn(slot).unref();
    } catch (err) {
      // the server still starts; each computation then tries again (and fails with a 500 while this lasts)
      logEvent('compute-worker-failed-to-start', { error: (err as Error).message }, 'warn');
    }
    return Promise.all(this.slots.map((s) => s.ready)).then(() => undefined);
  }

  stats(): ComputeStats {
    return {
      size: this.slots.length,
      threads: this.slots.filter((s) => s.worker).map((s) => s.threadId),
      busy: this.slots.filter((s) => s.job).length,
      queued: this.queue.length,
      jobsInWorkers: this.jobsInWorkers,
      jobsInProcess: this.jobsInProcess,
      crashes: this.crashes,
      recent: [...this.recent],
    };
  }

  /** Refuses new jobs, fails the waiting ones and ends every thread (the app's close()). */
  async close(): Promise<void> {
    this.closed = true;
    for (const job of this.queue.splice(0)) job.reject(new ComputeClosedError());
    await Promise.all(this.slots.map((s) => s.worker?.terminate()));
  }

  private submit(job: ComputeJob<unknown, unknown>, payload: unknown, table: UpsampleTable | null, json: boolean, unbounded = false): Promise<unknown> {
    if (this.closed) return Promise.reject(new ComputeClosedError());
    if (this.slots.length === 0) return this.runInPlace(job, payload, table, json);
    return new Promise((resolve, reject) => {
      const pending: Pending = { id: this.nextId++, job, payload, table: table && shareTable(table), json, unbounded, resolve, reject };
      const slot = this.idleSlot();
      if (slot) this.dispatch(slot, pending);
      else if (!unbounded && this.boundedWaiting() >= this.opts.queueLimit) reject(new ComputeBusyError());
      else this.queue.push(pending);
    });
  }

  /** Waiting jobs that count against the queue's limit. */
  private boundedWaiting(): number {
    let n = 0;
    for (const p of this.queue) if (!p.unbounded) n++;
    return n;
  }

  /** The old way (COMPUTE_WORKERS=0): the same job function, on the main thread. */
  private async runInPlace(job: ComputeJob<unknown, unknown>, payload: unknown, table: UpsampleTable | null, json: boolean): Promise<unknown> {
    const t0 = performance.now();
    let ok = false;
    try {
      const result = await job.run(payload, table);
      ok = true;
      return json ? JSON.stringify(result) : result;
    } finally {
      this.jobsInProcess++;
      this.remember({ name: job.name, threadId: mainThreadId, ms: performance.now() - t0, ok });
    }
  }

  /** A free thread (a live one first), or a slot whose thread is to be started; null when all are busy. */
  private idleSlot(): Slot | null {
    return this.slots.find((s) => s.worker && !s.job) ?? this.slots.find((s) => !s.worker) ?? null;
  }

  private dispatch(slot: Slot, job: Pending): void {
    let w: Worker;
    try {
      w = slot.worker ?? this.spawn(slot);
    } catch (err) {
      logEvent('compute-worker-failed-to-start', { job: job.job.name, error: (err as Error).message }, 'warn');
      job.reject(new ComputeCrashError(job.job.name));
      return;
    }
    slot.job = job;
    try {
      w.postMessage({ id: job.id, name: job.job.name, moduleUrl: job.job.moduleUrl, payload: job.payload, table: job.table, json: job.json } satisfies JobMessage);
      w.ref();
    } catch (err) {
      slot.job = null; // a payload that cannot be cloned: the job's own failure
      job.reject(err as Error);
      this.pump();
    }
  }

  private spawn(slot: Slot): Worker {
    const w = startComputeThread([...this.preloads]);
    slot.worker = w;
    slot.threadId = w.threadId;
    slot.lastError = null;
    let ready!: () => void;
    slot.ready = new Promise((r) => (ready = r));
    w.once('exit', () => ready());
    w.on('message', (r: JobReply | { ready: true }) => ('ready' in r ? ready() : this.onReply(slot, w, r)));
    w.on('error', (err) => {
      if (slot.worker === w) slot.lastError = err;
    });
    w.on('exit', (code) => this.onExit(slot, w, code));
    return w;
  }

  private onReply(slot: Slot, w: Worker, r: JobReply): void {
    const job = slot.job;
    if (slot.worker !== w || !job || job.id !== r.id) return;
    slot.job = null;
    w.unref();
    this.jobsInWorkers++;
    this.remember({ name: job.job.name, threadId: r.threadId, ms: r.ms, ok: r.ok });
    if (r.ok) job.resolve(job.json ? r.text : r.result);
    else job.reject(decodeFailure(job.job.name, r.error));
    this.pump();
  }

  private onExit(slot: Slot, w: Worker, exitCode: number): void {
    if (slot.worker !== w) return;
    const job = slot.job;
    const threadId = slot.threadId;
    slot.worker = null;
    slot.job = null;
    if (this.closed) {
      job?.reject(new ComputeClosedError());
      return;
    }
    this.crashes++;
    logEvent('compute-worker-crashed', { threadId, exitCode, job: job?.job.name ?? null, error: slot.lastError?.message ?? null }, 'warn');
    if (job) {
      this.remember({ name: job.job.name, threadId, ms: 0, ok: false });
      job.reject(new ComputeCrashError(job.job.name));
    }
    this.pump(); // waiting jobs go on, on a new thread
  }

  /** Hands waiting jobs to free threads. */
  private pump(): void {
    let slot: Slot | null;
    while (this.queue.length && !this.closed && (slot = this.idleSlot())) this.dispatch(slot, this.queue.shift()!);
  }

  private remember(r: JobRecord): void {
    this.recent.push(r);
    if (this.recent.length > RECENT) this.recent.shift();
  }
}

const byOwner = new WeakMap<object, ComputePool>();

/**
 * The app's pool (created by createApp, which passes its DataSource as `owner`, so services constructed
 * from the DataSource alone, such as ToneService, find it with `computePoolFor(ds)`).
 */
export function createComputePool(opts: ComputePoolOptions, owner?: object): ComputePool {
  const pool = new ComputePool(opts);
  if (owner) byOwner.set(owner, pool);
  return pool;
}

/** The pool registered for `owner` (see createComputePool); undefined outside an app. */
export function computePoolFor(owner: object): ComputePool | undefined {
  return byOwner.get(owner);
}
