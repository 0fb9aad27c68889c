/**
 * The main event loop while heavy computations run (issue 14, item 3): six 2,000-swatch simulations are
 * posted at once through HTTP (three users, two each, within the fair-use limit), and meanwhile a reader
 * GETs /api/health every 10 ms until all six are answered. Measured twice in the same run: with the compute
 * pool (COMPUTE_WORKERS, default min(2, cores): the simulations run in worker threads) and in place
 * (0 threads: on the main thread, as before the pool).
 *
 * Figures (`_in_process` for the second run):
 *   api_event_loop_delay_p50_ms / _p99_ms / _max_ms   the main loop's delay (perf_hooks monitorEventLoopDelay,
 *                                                     the recorded interval minus its 10 ms resolution)
 *   api_read_ms_under_compute                         median time of a GET /api/health meanwhile
 *   api_read_max_ms_under_compute                     the slowest of those reads
 *   api_compute_6x2000_ms                             wall time until all six simulations are answered
 */
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import request from 'supertest';
import { createApp } from '../server/app';
import { DEMO_PASSWORD } from '../server/db/seed';
import { upsampleCacheFile } from '../server/services/upsample-table';

const RESOLUTION_MS = 10;
const USERS = ['lab@demo.grisaille.test', 'producer@demo.grisaille.test', 'costume@demo.grisaille.test'];

/** Deterministic colours (a small LCG). */
function colours(n: number, seed: number): string[] {
  let s = seed;
  const next = () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
  return Array.from({ length: n }, () => '#' + [next(), next(), next()].map((v) => Math.round(v * 255).toString(16).padStart(2, '0')).join(''));
}

const body = (seed: number) => ({
  light: { cie: 'D65' },
  filters: [{ id: 'red-590' }],
  medium: { id: 'panchromatic' },
  swatches: colours(2000, seed).map((srgb, i) => ({ name: `swatch ${i + 1}`, srgb })),
});

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** One round: an app with `computeWorkers` threads, six simulations, reads meanwhile. */
async function round(computeWorkers: number | undefined, suffix: string, record: (name: string, value: number, unit: string) => void): Promise<void> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-bench-compute-'));
  // the table is built once per install; copy this checkout's if it has one
  const cached = upsampleCacheFile(path.resolve('data'));
  if (fs.existsSync(cached)) {
    fs.mkdirSync(path.dirname(upsampleCacheFile(dataDir)), { recursive: true });
    fs.copyFileSync(cached, upsampleCacheFile(dataDir));
  }
  const env = { dataDir, demo: true, nodeEnv: 'test' as const, authRateLimit: 100_000, writeRateLimit: 100_000, publicUrl: 'http://localhost:5178', fairUseConcurrency: 6, fairUseWorkPerMinute: 0 };
  const g = await createApp({ env: computeWorkers === undefined ? env : { ...env, computeWorkers }, seed: true, serveClient: false });
  const server = http.createServer(g.app).listen(0, '127.0.0.1');
  try {
    await new Promise((r) => server.once('listening', r));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const agents = [];
    for (const email of USERS) {
      const a = request.agent(server);
      const csrf = (await a.get('/api/auth/csrf')).body.csrfToken as string;
      const signedIn = await a.post('/api/auth/sign-in').set('X-CSRF-Token', csrf).send({ email, password: DEMO_PASSWORD });
      agents.push({ a, csrf: signedIn.body.csrfToken as string });
    }
    // warm-up: the table, the threads, the engine's caches (not part of the figure)
    await Promise.all(agents.slice(0, 2).map(({ a, csrf }, i) => a.post('/api/simulate').set('X-CSRF-Token', csrf).send({ ...body(90 + i), swatches: body(90 + i).swatches.slice(0, 50) })));

    const h = monitorEventLoopDelay({ resolution: RESOLUTION_MS });
    h.enable();
    const t0 = performance.now();
    let done = false;
    const sims = Promise.all(agents.flatMap(({ a, csrf }, i) => [0, 1].map((k) => a.post('/api/simulate').set('X-CSRF-Token', csrf).send(body(1 + i * 2 + k))))).finally(() => (done = true));
    const reads: number[] = [];
    while (!done) {
      const r0 = performance.now();
      await (await fetch(`${base}/api/health`)).arrayBuffer();
      reads.push(performance.now() - r0);
      await new Promise((r) => setTimeout(r, 10));
    }
    const answers = await sims;
    const wall = performance.now() - t0;
    h.disable();
    if (answers.some((r) => r.status !== 200)) throw new Error(`compute bench: HTTP ${answers.map((r) => r.status).join(', ')}`);
    const ms = (ns: number) => Math.max(0, ns / 1e6 - RESOLUTION_MS);
    record(`api_event_loop_delay_p50_ms${suffix}`, ms(h.percentile(50)), 'ms');
    record(`api_event_loop_delay_p99_ms${suffix}`, ms(h.percentile(99)), 'ms');
    record(`api_event_loop_delay_max_ms${suffix}`, ms(h.max), 'ms');
    record(`api_read_ms_under_compute${suffix}`, median(reads), 'ms');
    record(`api_read_max_ms_under_compute${suffix}`, Math.max(...reads), 'ms');
    record(`api_compute_6x2000_ms${suffix}`, wall, 'ms');
  } finally {
    await new Promise((r) => server.close(r));
    await g.close();
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
}

export default async function run(record: (name: string, value: number, unit: string) => void): Promise<void> {
  await round(undefined, '', record); // the pool as configured (COMPUTE_WORKERS)
  await round(0, '_in_process', record); // the old way, for comparison in the same run
}
