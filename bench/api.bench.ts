/**
 * The API under load (issue 15, items 3 and 5): the real app on a temporary data directory, signed in as the
 * demo owner, and autocannon (10 s, 50 connections) on two reads every page makes:
 *   GET /api/productions/:pid/looks                     (the role check, the session's user, a list)
 *   GET /api/productions/:pid/boards/:boardId/tones     (the same, and every look composed, every tone)
 * on the demo board with the most swatches, and (`tones_large`, caches on only) the tones of a board of
 * LARGE_BOARD_SWATCHES random colours through four looks, where the computing outweighs the HTTP work
 * and both compute threads are busy. The tones are computed in the app's compute threads
 * (server/modules/tones/look-tones.job.ts); the main thread reads the database and answers. Between runs the
 * bench waits until the server has finished what autocannon left in flight (`settle`), so no run pays for
 * the one before it.
 *
 * Each is measured twice in the same run: with the caches of server/services/cache.ts off (the "before":
 * membership and user read from the database and every look composed again per request) and on.
 * autocannon runs in a child process, so this process's CPU time is the server's alone (its compute
 * threads included); `api_cores_used` is that CPU time over the wall time of the run, i.e. how many cores
 * the server kept busy (both reads' "after" runs; each run's own is recorded too). Latencies are every
 * response's time as autocannon saw it (its 'response' event), so p95 is exact (its summary has no p95).
 *
 * Figures (`_nocache` for the "before"):
 *   api_looks_rps, api_looks_p50_ms, api_looks_p95_ms, api_looks_p99_ms, api_looks_cores
 *   api_tones_rps, api_tones_p50_ms, api_tones_p95_ms, api_tones_p99_ms, api_tones_cores
 *   api_tones_large_rps, api_tones_large_p50_ms, …, api_tones_large_cores
 *   api_cores_used (the most of the "after" runs: the large board's, where the computing endpoint keeps both
 *   cores busy; on the small demo board the main thread's own HTTP work, ~2–3 ms a request against ~1 ms
 *   of computing, keeps it near one core)
 *   api_looks_loadgen_cores, api_tones_loadgen_cores (autocannon's own CPU on the same two cores, Linux only:
 *   what the server could not have had)
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { createApp } from '../server/app';
import { Board } from '../server/db/entities/board.entity';
import { Production } from '../server/db/entities/production.entity';
import { Look } from '../server/db/entities/look.entity';
import { Swatch } from '../server/db/entities/swatch.entity';
import { resolveSwatchOrigin } from '../server/modules/swatches/swatches.service';
import { DEMO_PASSWORD, DEMO_PRODUCTION_NAME } from '../server/db/seed';
import { setCachesEnabled } from '../server/services/cache';
import { upsampleCacheFile } from '../server/services/upsample-table';

const DURATION_S = 10;
const CONNECTIONS = 50;
const OWNER = 'camera@demo.grisaille.test';
/** Swatches of the large board (random colours, as in board.bench.ts). */
const LARGE_BOARD_SWATCHES = 300;

/** Deterministic random colours (a small LCG). */
function colours(n: number, seed = 20261202): string[] {
  let s = seed;
  const next = () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
  return Array.from({ length: n }, () => '#' + [next(), next(), next()].map((v) => Math.round(v * 255).toString(16).padStart(2, '0')).join(''));
}

/**
 * The load generator, run as `node --input-type=module -e LOAD <url> <cookie> <seconds> <connections>`:
 * prints "started" on stderr when the load begins, then one line of JSON on stdout.
 */
const LOAD = `
import autocannon from 'autocannon';
const [url, cookie, seconds, connections] = process.argv.slice(1);
const times = [];
const statuses = {};
const inst = autocannon({ url, connections: Number(connections), duration: Number(seconds), headers: { cookie } });
inst.on('response', (_c, status, _bytes, ms) => { statuses[status] = (statuses[status] ?? 0) + 1; if (status === 200) times.push(ms); });
process.stderr.write('started\\n');
inst.on('done', (r) => {
  times.sort((a, b) => a - b);
  const q = (p) => times.length ? times[Math.min(times.length - 1, Math.floor(p * times.length))] : NaN;
  process.stdout.write(JSON.stringify({ ok: times.length, statuses, errors: r.errors, timeouts: r.timeouts, seconds: r.duration, p50: q(0.5), p95: q(0.95), p99: q(0.99) }) + '\\n');
});
`;

interface LoadResult {
  ok: number;
  statuses: Record<string, number>;
  errors: number;
  timeouts: number;
  seconds: number;
  p50: number;
  p95: number;
  p99: number;
  /** this process's CPU time over the run's wall time */
  cores: number;
  /** the load generator's own CPU time over the run's wall time (Linux only, else NaN): the share of the two cores the server could not have */
  loadCores: number;
}

/** CPU time of process `pid` so far, ms, from /proc (Linux; USER_HZ is 100 there); NaN elsewhere. */
function cpuOfPid(pid: number | undefined): number {
  try {
    const st = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    const f = st.slice(st.lastIndexOf(')') + 2).split(' ');
    return (Number(f[11]) + Number(f[12])) * 10;
  } catch {
    return NaN;
  }
}

/** Runs the load generator on `url`; this process's CPU use is measured from its "started" to its end. */
function load(url: string, cookie: string, seconds = DURATION_S): Promise<LoadResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--input-type=module', '-e', LOAD, url, cookie, String(seconds), String(CONNECTIONS)], { stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    let cpu0: NodeJS.CpuUsage | null = null;
    let t0 = 0;
    // sampled while it runs: /proc forgets the process at its exit
    let loadMs = NaN;
    const sampler = setInterval(() => {
      const ms = cpuOfPid(child.pid);
      if (!Number.isNaN(ms)) loadMs = ms;
    }, 100);
    child.stdout.on('data', (d: Buffer) => (out += d));
    child.stderr.on('data', (d: Buffer) => {
      err += d;
      if (!cpu0 && err.includes('started')) {
        cpu0 = process.cpuUsage();
        t0 = performance.now();
      }
    });
    child.on('error', reject);
    child.on('exit', (code) => {
      clearInterval(sampler);
      const cpu = process.cpuUsage(cpu0 ?? undefined);
      const wall = performance.now() - t0;
      if (code !== 0 || !cpu0) return reject(new Error(`api bench: the load generator failed (${code}): ${err}`));
      const r = JSON.parse(out) as Omit<LoadResult, 'cores'>;
      resolve({ ...r, cores: (cpu.user + cpu.system) / 1000 / wall, loadCores: loadMs / wall });
    });
  });
}

/**
 * Waits until the server has answered what the last run left in flight (requests autocannon gave up on at
 * its end still hold compute jobs), so the next run's figures and the app's close start from an idle server.
 */
async function settle(pool: { stats(): { busy: number; queued: number } }, maxMs = 30_000): Promise<void> {
  const end = performance.now() + maxMs;
  while (performance.now() < end) {
    const s = pool.stats();
    if (!s.busy && !s.queued) return;
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** Signs in through the API; the session cookie. */
async function signIn(base: string, email: string): Promise<string> {
  const c = await fetch(`${base}/api/auth/csrf`);
  const csrf = ((await c.json()) as { csrfToken: string }).csrfToken;
  const csrfCookies = c.headers.getSetCookie().map((s) => s.split(';')[0]);
  const r = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': csrf, cookie: csrfCookies.join('; ') },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (r.status !== 200) throw new Error(`api bench: sign-in answered ${r.status}`);
  return r.headers.getSetCookie().map((s) => s.split(';')[0]).join('; ');
}

export default async function run(record: (name: string, value: number, unit: string) => void): Promise<void> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-bench-api-'));
  // the table is built once per install; copy this checkout's if it has one
  const cached = upsampleCacheFile(path.resolve('data'));
  if (fs.existsSync(cached)) {
    fs.mkdirSync(path.dirname(upsampleCacheFile(dataDir)), { recursive: true });
    fs.copyFileSync(cached, upsampleCacheFile(dataDir));
  }
  const g = await createApp({ env: { dataDir, demo: true, nodeEnv: 'test', authRateLimit: 100_000, publicUrl: 'http://localhost:5178' }, seed: true, serveClient: false });
  const server = http.createServer(g.app).listen(0, '127.0.0.1');
  try {
    await new Promise((r) => server.once('listening', r));
    await g.ctx.compute.warm(); // a server starts its compute threads with itself (server/app.ts)
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const production = await g.ctx.ds.getRepository(Production).findOneByOrFail({ name: DEMO_PRODUCTION_NAME });
    const boards = await g.ctx.ds.getRepository(Board).find({ where: { production: { id: production.id } }, relations: { swatches: true } });
    const board = boards.sort((a, b) => b.swatches.length - a.swatches.length || a.id - b.id)[0];
    const cookie = await signIn(base, OWNER);
    const looks = await g.ctx.ds.getRepository(Look).find({ where: { production: { id: production.id } }, order: { id: 'ASC' }, take: 4 });
    const swatchRepo = g.ctx.ds.getRepository(Swatch);
    const large = await g.ctx.ds.getRepository(Board).save({
      production, department: 'costume', name: `Bench ${LARGE_BOARD_SWATCHES} × 4`, notes: '', lookIds: looks.map((l) => l.id), mergeStops: 1 / 3, mergeDeltaE: 10,
      swatches: await swatchRepo.save(colours(LARGE_BOARD_SWATCHES).map((hex, i) => swatchRepo.create({ production, department: 'costume', name: `Bench swatch ${i + 1}`, notes: '', ...resolveSwatchOrigin({ type: 'colour', colour: { space: 'hex', hex } }) }))),
    });
    const urls = {
      looks: `${base}/api/productions/${production.id}/looks`,
      tones: `${base}/api/productions/${production.id}/boards/${board.id}/tones`,
      tones_large: `${base}/api/productions/${production.id}/boards/${large.id}/tones`,
    };
    console.log(`# ${CONNECTIONS} connections, ${DURATION_S} s each; tones of "${board.name}" (${board.swatches.length} swatches × ${board.lookIds.length} looks) and of ${LARGE_BOARD_SWATCHES} random colours × ${looks.length} looks`);
    const after: number[] = [];
    for (const [name, url] of Object.entries(urls)) {
      for (const cache of name === 'tones_large' ? [true] : [false, true]) {
        setCachesEnabled(cache);
        const warm = await fetch(url, { headers: { cookie } }); // the table, the ranges, the engine's own caches
        if (warm.status !== 200) throw new Error(`api bench: ${url} answered ${warm.status}`);
        await warm.arrayBuffer();
        const r = await load(url, cookie);
        await settle(g.ctx.compute);
        const others = Object.entries(r.statuses).filter(([s]) => s !== '200');
        if (others.length) throw new Error(`api bench: ${name}: not every answer was a 200 (${JSON.stringify(r.statuses)})`);
        // a request still unanswered after autocannon's 10 s is counted as a timeout (and as an error), not in the figures
        if (r.errors || r.timeouts) console.log(`# ${name}${cache ? '' : ' (no cache)'}: ${r.timeouts} timeouts, ${r.errors} errors`);
        const suffix = cache ? '' : '_nocache';
        record(`api_${name}_rps${suffix}`, r.ok / r.seconds, 'req/s');
        record(`api_${name}_p50_ms${suffix}`, r.p50, 'ms');
        record(`api_${name}_p95_ms${suffix}`, r.p95, 'ms');
        record(`api_${name}_p99_ms${suffix}`, r.p99, 'ms');
        record(`api_${name}_cores${suffix}`, r.cores, 'cores');
        if (Number.isFinite(r.loadCores)) record(`api_${name}_loadgen_cores${suffix}`, r.loadCores, 'cores');
        if (cache) after.push(r.cores);
      }
    }
    record('api_cores_used', Math.max(...after), 'cores');
  } finally {
    setCachesEnabled(true);
    await new Promise((r) => server.close(r));
    await g.close();
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
}
