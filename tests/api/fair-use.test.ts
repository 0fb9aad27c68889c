/**
 * Issue 14, item 3: heavy computations off the main event loop (the compute pool's worker threads,
 * server/services/compute-pool.ts) and a fair-use limit per user on them (server/middleware/fair-use.ts).
 *
 * Figures (event-loop delay, read latency) are printed, not asserted: the machine is shared and noisy.
 * What is asserted is structural: which thread ran a job, which answers came back, what was refused.
 * Retry-After on 429 and 503: RFC 6585 §4 and RFC 9110 §10.2.3 / §15.6.4.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { threadId } from 'node:worker_threads';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, withTestApp, type Agent, type TestApp } from '../helpers/api';
import { readRunUpsampleTable } from '../setup/upsample-table-file';
import { ComputeBusyError, ComputeClosedError, ComputeCrashError, ComputePool } from '../../server/services/compute-pool';
import { onLogEvent } from '../../server/services/log';
import { MemoryFairUse, type FairUseLimiter } from '../../server/middleware/fair-use';
import { simulateJob } from '../../server/modules/simulate/simulate.job';
import { shadeAnswer, shadeJob } from '../../server/modules/shade/shade-answer';
import { computeRanges, rangesJob } from '../../server/modules/tones/tone-ranges';
import { resolveSwatchOrigin } from '../../server/modules/swatches/swatches.service';
import { Production } from '../../server/db/entities/production.entity';
import { Look } from '../../server/db/entities/look.entity';
import { Swatch } from '../../server/db/entities/swatch.entity';
import { Board } from '../../server/db/entities/board.entity';
import { DEMO_PRODUCTION_NAME } from '../../server/db/seed';
import { simulateRequestSchema } from '../../shared/schemas/simulate';
import { shadeRequestSchema } from '../../shared/schemas/shade';
import { resolveLightPath, resolveSwatch, simulate, simulateSwatches } from '../../shared/spectral/compute';
import { SpectralInputError } from '../../shared/spectral/errors';
import { buildUpsampleTable, type UpsampleTable } from '../../shared/spectral/upsample-table';
import { busyJob, crashJob } from './fair-use-jobs';

/** The message of a refusal past FAIR_USE_CONCURRENCY = 2 (issue 14's wording). */
const BUSY_MESSAGE = 'You already have 2 computations running; wait for one to finish.';
const LOOK = { light: { cie: 'D65' }, filters: [{ id: 'red-590' }], medium: { id: 'panchromatic' } };

/** Deterministic sRGB colours (a small LCG), so every run computes the same swatches. */
function colours(n: number, seed = 14): string[] {
  let s = seed;
  const next = () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
  return Array.from({ length: n }, () => '#' + [next(), next(), next()].map((v) => Math.round(v * 255).toString(16).padStart(2, '0')).join(''));
}

/** A simulate body with `n` estimated colours (2,000 is the most a request may hold). */
const simulation = (n: number, seed = 14) => ({ ...LOOK, swatches: colours(n, seed).map((srgb, i) => ({ name: `swatch ${i + 1}`, srgb })) });

let table: UpsampleTable;
beforeAll(() => {
  table = readRunUpsampleTable() ?? buildUpsampleTable();
});

/**
 * Sampling interval of the event-loop monitor, ms. Node's histogram records each whole interval between
 * samples, so the delay is a recorded value minus this (Node.js perf_hooks, monitorEventLoopDelay).
 */
const RESOLUTION_MS = 10;

const quantile = (xs: number[], q: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(q * xs.length))];

describe('the fair-use limiter (in memory)', () => {
  /** A grant that must be given. */
  async function granted(f: FairUseLimiter, key: string, work: number) {
    const g = await f.acquire(key, work);
    if (!g.ok) throw new Error(`refused: ${g.message}`);
    return g;
  }

  it('holds at most N heavy grants per user, frees one on release (once), and leaves other users and light work alone', async () => {
    const f = new MemoryFairUse({ concurrency: 2, workPerMinute: 0 });
    const a = await granted(f, '1', 2000);
    await granted(f, '1', 2000);
    expect(await f.acquire('1', 2000)).toEqual({ ok: false, code: 'busy', message: BUSY_MESSAGE, retryAfterS: 1 });
    await granted(f, '2', 2000);
    await granted(f, '1', 2); // light: not counted
    a.release();
    a.release();
    expect(f.runningFor('1')).toBe(1);
    await granted(f, '1', 2000);
    expect((await f.acquire('1', 2000)).ok).toBe(false);
  });

  it('charges work to the last minute and says when enough of it will have aged out', async () => {
    let now = 0;
    const f = new MemoryFairUse({ concurrency: 9, workPerMinute: 100, now: () => now });
    (await granted(f, '1', 60)).release();
    now = 20_000;
    (await granted(f, '1', 30)).release();
    now = 30_000;
    // 90 used; 50 more fits once the 60 of t = 0 s has aged out, at t = 60 s
    expect(await f.acquire('1', 50)).toMatchObject({ ok: false, code: 'over_budget', retryAfterS: 30 });
    expect((await f.acquire('2', 50)).ok).toBe(true);
    now = 60_000;
    expect((await f.acquire('1', 50)).ok).toBe(true);
  });
});

describe('the compute pool', () => {
  let pool: ComputePool;
  beforeAll(() => {
    pool = new ComputePool({ size: 2, queueLimit: 8 });
  });
  afterAll(() => pool.close());

  it('runs a simulation in a worker thread and answers exactly what the same call answers in place', async () => {
    const body = simulateRequestSchema.parse({ ...simulation(60), swatches: [...simulation(60).swatches, { name: 'grey card', reflectance: [[380, 0.18], [580, 0.18], [780, 0.18]] }] });
    const inPool = await pool.run(simulateJob, body, { table });
    expect(inPool).toEqual(simulate(body, table));
    const text = (await pool.runJson(simulateJob, body, { table })).text;
    expect(text).toBe(JSON.stringify(simulate(body, table)));
    const last = pool.stats().recent.at(-1)!;
    expect(last).toMatchObject({ name: 'simulate', ok: true });
    expect(last.threadId).not.toBe(threadId);
    expect(pool.stats().threads).toContain(last.threadId);
    expect(pool.stats().jobsInProcess).toBe(0);
  });

  it('answers shade and tone ranges exactly as in place', async () => {
    const shade = shadeRequestSchema.parse({ ...LOOK, target: { zone: 4 }, near: '#b01c2e' });
    expect(await pool.run(shadeJob, shade, { table })).toEqual(shadeAnswer(shade, table));

    const lightPath = resolveLightPath({ light: { id: 'tungsten-3200' }, filters: [{ id: 'cyan-530' }], medium: { id: 'orthochromatic' } });
    const swatches = colours(40, 7).map((srgb) => resolveSwatch({ name: srgb, srgb }, table));
    const sim = simulateSwatches(lightPath, swatches);
    const job = { lightPath, swatches: swatches.map((s, i) => ({ reflectance: s.reflectance, m: sim.swatches[i].exposure })) };
    const ranges = await pool.run(rangesJob, job);
    expect(ranges).toEqual(computeRanges(job));
    expect(ranges.some((r) => r.possible[1] - r.possible[0] > 0.01)).toBe(true); // real ranges, not zero widths
  });

  it('passes an engine input error back with its field (a 400 for the route)', async () => {
    const body = simulateRequestSchema.parse({ ...LOOK, medium: { id: 'no-such-medium' } }); // the schema takes any id; the engine knows them
    const err = await pool.run(simulateJob, body).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(SpectralInputError);
    expect((err as SpectralInputError).field).toBe('medium.id');
    expect((err as SpectralInputError).message).toMatch(/no built-in medium/);
  });

  it('fails the job of a thread that crashes with a crash error and an operator log line, then carries on in a new thread', async () => {
    const events: Record<string, unknown>[] = [];
    const off = onLogEvent((e) => events.push(e));
    try {
      const before = pool.stats();
      const err = await pool.run(crashJob, null).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(ComputeCrashError);
      const logged = events.find((e) => e.event === 'compute-worker-crashed');
      expect(logged).toMatchObject({ job: 'crash', error: 'a crash on purpose (test)' });
      expect(pool.stats().crashes).toBe(before.crashes + 1);
      expect(pool.stats().threads).not.toContain(logged!.threadId);
      expect(await pool.run(busyJob, 1)).toBe(1);
      expect(pool.stats().recent.at(-1)!.threadId).not.toBe(logged!.threadId);
    } finally {
      off();
    }
  });

  it('refuses a job past the queue bound with a 503 and Retry-After', async () => {
    const small = new ComputePool({ size: 1, queueLimit: 1 });
    try {
      const running = small.run(busyJob, 300);
      const waiting = small.run(busyJob, 1);
      const refused = await small.run(busyJob, 1).catch((e: unknown) => e);
      expect(refused).toBeInstanceOf(ComputeBusyError);
      expect(refused).toMatchObject({ status: 503, code: 'server_busy', retryAfterS: expect.any(Number) });
      expect(await Promise.all([running, waiting])).toEqual([300, 1]);
    } finally {
      await small.close();
    }
  });

  it('ends its threads on close and fails what was waiting', async () => {
    const p = new ComputePool({ size: 1, queueLimit: 4 });
    const running = p.run(busyJob, 200).catch((e: unknown) => e);
    const waiting = p.run(busyJob, 1).catch((e: unknown) => e);
    expect(p.stats().threads).toHaveLength(1);
    await p.close();
    expect(p.stats().threads).toEqual([]);
    expect(await waiting).toBeInstanceOf(ComputeClosedError);
    expect(await running).toBeInstanceOf(ComputeClosedError);
    expect(await p.run(busyJob, 1).catch((e: unknown) => e)).toBeInstanceOf(ComputeClosedError);
  });

  it('computes in place with 0 threads (COMPUTE_WORKERS=0), the same answer', async () => {
    const p = new ComputePool({ size: 0, queueLimit: 0 });
    const body = simulateRequestSchema.parse(simulation(10));
    expect(await p.run(simulateJob, body, { table })).toEqual(simulate(body, table));
    expect(p.stats()).toMatchObject({ threads: [], jobsInWorkers: 0, jobsInProcess: 1 });
    expect(p.stats().recent[0].threadId).toBe(threadId);
    await p.close();
  });
});

describe('heavy computations through the API', () => {
  let t: TestApp;
  let viewer: Agent;
  let other: Agent;
  let server: http.Server;
  let base: string;
  beforeAll(async () => {
    t = await startTestApp({ env: { computeWorkers: 2, fairUseConcurrency: 2, fairUseWorkPerMinute: 0 } });
    viewer = await t.agent('lab@demo.grisaille.test');
    other = await t.agent('producer@demo.grisaille.test');
    server = http.createServer(t.app).listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(async () => {
    await new Promise((r) => server.close(r));
    await t.close();
  });

  it('lets one viewer run at most 2 of six parallel 2,000-swatch simulations; the rest are 429 busy; another user is served meanwhile', async () => {
    const body = simulation(2000);
    const six = Array.from({ length: 6 }, () => viewer.post('/api/simulate').send(body));
    const meanwhile = other.post('/api/simulate').send(simulation(2000, 15));
    const [answers, theirs] = await Promise.all([Promise.all(six), meanwhile]);
    const ok = answers.filter((r) => r.status === 200);
    const busy = answers.filter((r) => r.status === 429);
    expect(ok.length + busy.length, answers.map((r) => r.status).join(',')).toBe(6);
    expect(ok.length).toBeGreaterThanOrEqual(1);
    expect(ok.length).toBeLessThanOrEqual(2);
    for (const r of busy) {
      expect(r.body).toEqual({ error: { code: 'busy', message: BUSY_MESSAGE } });
      expect(Number(r.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    }
    for (const r of ok) expect(r.body.swatches).toHaveLength(2000);
    expect(theirs.status).toBe(200);
    expect(theirs.body.swatches).toHaveLength(2000);
    // the grants end with the computations: the viewer may compute again
    expect((await viewer.post('/api/simulate').send(simulation(5))).status).toBe(200);
  });

  it('does not count light simulations against the concurrency (the shade page sends one per look, in parallel)', async () => {
    const heavy = viewer.post('/api/simulate').send(simulation(2000, 41));
    const light = await Promise.all(Array.from({ length: 6 }, (_, i) => viewer.post('/api/simulate').send(simulation(2, 50 + i))));
    expect(light.map((r) => r.status)).toEqual([200, 200, 200, 200, 200, 200]);
    expect((await heavy).status).toBe(200);
  });

  it('answers from the pool exactly what the engine answers in place, for simulate and shade', async () => {
    const raw = { ...simulation(100, 21), extremes: true };
    const r = await viewer.post('/api/simulate').send(raw);
    expect(r.status).toBe(200);
    expect(r.body).toEqual(JSON.parse(JSON.stringify(simulate(simulateRequestSchema.parse(raw), table))));
    const shade = { ...LOOK, target: { stops: -1 }, near: { rgb: [40, 64, 192] } };
    const s = await viewer.post('/api/shade').send(shade);
    expect(s.status).toBe(200);
    expect(s.body).toEqual(JSON.parse(JSON.stringify(shadeAnswer(shadeRequestSchema.parse(shade), table))));
    const recent = t.ctx.compute.stats().recent;
    expect(recent.filter((j) => j.name === 'shade').at(-1)!.threadId).not.toBe(threadId);
  });

  it('keeps the main event loop free while heavy simulations run in the pool (figures printed)', async () => {
    const h = monitorEventLoopDelay({ resolution: RESOLUTION_MS });
    const before = t.ctx.compute.stats().jobsInWorkers;
    h.enable();
    let done = false;
    const sims = Promise.all([viewer.post('/api/simulate').send(simulation(2000, 31)), other.post('/api/simulate').send(simulation(2000, 32))]).finally(() => (done = true));
    const reads: number[] = [];
    while (!done) {
      const t0 = performance.now();
      const res = await fetch(`${base}/api/health`);
      await res.arrayBuffer();
      reads.push(performance.now() - t0);
      await new Promise((r) => setTimeout(r, 10));
    }
    h.disable();
    const answers = await sims;
    expect(answers.map((a) => a.status)).toEqual([200, 200]);
    const ms = (ns: number) => Math.max(0, ns / 1e6 - RESOLUTION_MS).toFixed(1);
    console.log(
      `event-loop delay while two 2,000-swatch simulations ran in the pool: p50 ${ms(h.percentile(50))} ms, p99 ${ms(h.percentile(99))} ms, max ${ms(h.max)} ms; ` +
        `GET /api/health meanwhile (${reads.length} reads): median ${quantile(reads, 0.5).toFixed(1)} ms, max ${Math.max(...reads).toFixed(1)} ms`,
    );
    // structurally: both simulations ran in worker threads, none on the main thread
    const stats = t.ctx.compute.stats();
    expect(stats.jobsInWorkers - before).toBeGreaterThanOrEqual(2);
    expect(stats.jobsInProcess).toBe(0);
    const sims2 = stats.recent.filter((j) => j.name === 'simulate').slice(-2);
    for (const j of sims2) expect(j.threadId).not.toBe(threadId);
    expect(reads.length).toBeGreaterThan(0);
  });

  it('computes a board’s missing tone ranges in the pool', async () => {
    const ds = t.ctx.ds;
    const production = await ds.getRepository(Production).findOneByOrFail({ name: DEMO_PRODUCTION_NAME });
    const looks = await ds.getRepository(Look).find({ where: { production: { id: production.id } }, order: { id: 'ASC' }, take: 2 });
    const swatches = await ds.getRepository(Swatch).save(
      colours(24, 99).map((hex, i) => ds.getRepository(Swatch).create({ production, department: 'costume', name: `Pool swatch ${i + 1}`, notes: '', ...resolveSwatchOrigin({ type: 'colour', colour: { space: 'hex', hex } }) })),
    );
    const board = await ds.getRepository(Board).save({ production, department: 'costume', name: 'Pool board', notes: '', lookIds: looks.map((l) => l.id), mergeStops: 1 / 3, mergeDeltaE: 10, swatches });
    const before = t.ctx.compute.stats().recent.filter((j) => j.name === 'ranges').length;
    const r = await viewer.get(`/api/productions/${production.id}/boards/${board.id}/tones`);
    expect(r.status).toBe(200);
    expect(r.body.tones.looks).toHaveLength(looks.length);
    for (const l of r.body.tones.looks) for (const tone of l.tones) expect(tone.range.possible[1]).toBeGreaterThanOrEqual(tone.range.possible[0]);
    const ranges = t.ctx.compute.stats().recent.filter((j) => j.name === 'ranges');
    // one job per light path (looks sharing one share a job), each in a worker
    expect(ranges.length - before).toBeGreaterThanOrEqual(1);
    expect(ranges.length - before).toBeLessThanOrEqual(looks.length);
    for (const j of ranges.slice(before)) expect(j.threadId).not.toBe(threadId);
  });

  it('answers 500 (and logs it) when the thread running a simulation crashes; the next one is served', async () => {
    const events: Record<string, unknown>[] = [];
    const off = onLogEvent((e) => events.push(e));
    const real = t.ctx.compute;
    /** a pool whose threads crash on every job, standing in for a failing one */
    class CrashingPool extends ComputePool {
      override runJson() {
        return super.runJson(crashJob, null);
      }
    }
    const crashing = new CrashingPool({ size: 1, queueLimit: 1 });
    t.ctx.compute = crashing;
    try {
      const r = await viewer.post('/api/simulate').send(simulation(3));
      expect(r.status).toBe(500);
      expect(r.body.error.code).toBe('internal');
      expect(events.find((e) => e.event === 'compute-worker-crashed')).toMatchObject({ job: 'crash' });
    } finally {
      t.ctx.compute = real;
      off();
      await crashing.close();
    }
    expect((await viewer.post('/api/simulate').send(simulation(3))).status).toBe(200);
  });

  it('answers 503 with Retry-After when the pool’s queue is full', async () => {
    await withTestApp({ env: { computeWorkers: 1, computeQueueLimit: 0, fairUseConcurrency: 10, fairUseWorkPerMinute: 0 } }, async (app) => {
      const a = await app.agent('lab@demo.grisaille.test');
      const [first, second] = await Promise.all([a.post('/api/simulate').send(simulation(2000)), a.post('/api/simulate').send(simulation(2000, 16))]);
      const statuses = [first.status, second.status].sort();
      expect(statuses).toEqual([200, 503]);
      const refused = first.status === 503 ? first : second;
      expect(refused.body).toEqual({ error: { code: 'server_busy', message: 'The server is busy with other computations; try again in a few seconds.' } });
      expect(Number(refused.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    });
  });

  it('refuses work past the per-minute budget with 429 over_budget and Retry-After', async () => {
    await withTestApp({ env: { fairUseWorkPerMinute: 10 } }, async (app) => {
      const a = await app.agent('lab@demo.grisaille.test');
      expect((await a.post('/api/simulate').send(simulation(6))).status).toBe(200);
      const r = await a.post('/api/simulate').send(simulation(6));
      expect(r.status).toBe(429);
      expect(r.body.error.code).toBe('over_budget');
      expect(r.body.error.message).toMatch(/^You have used this minute's share of computation \(10 swatches' worth\); try again in \d+ seconds?\.$/);
      expect(Number(r.headers['retry-after'])).toBeGreaterThanOrEqual(1);
      expect(Number(r.headers['retry-after'])).toBeLessThanOrEqual(60);
      // the budget is per user: another one is served
      const b = await app.agent('producer@demo.grisaille.test');
      expect((await b.post('/api/simulate').send(simulation(6))).status).toBe(200);
    });
  });
});
