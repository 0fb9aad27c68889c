/**
 * A board of 200 swatches through four looks, on the server path: the tones service reads the board, its
 * swatches and looks from SQLite, resolves the looks with the engine, and computes every tone, grey and
 * merge, and every tone's possible and plausible range (server/modules/tones/tone-ranges.ts keeps ranges per
 * colour and look, so a board asked for again answers them from there). Figures: `board_200x4_ms` (median
 * of 9 warm runs; target < 100 ms), also named `board_200x4_ranges_ms` (target ≤ 150 ms) since it holds the
 * ranges; `board_200x4_cold_ms` = `board_200x4_ranges_cold_ms` (the first run, which also estimates 200
 * spectra from their colours and solves their 800 ranges' programs); `board_200x4_http_ms` (through HTTP).
 *
 * Then a board of 2,000 swatches through the same four looks, through HTTP (the route, its JSON and all):
 * `board_2000x4_ms` (median of 5 warm requests, after one cold request that fills the range cache, each to
 * the answer's last byte, not parsed; target ≤ 300 ms) and `board_2000x4_json_mb` (the answer's size, 10⁶ bytes; target ≤ 5 MB). A board this large
 * exists only here: the bench writes it straight to the database.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createApp } from '../server/app';
import { Production } from '../server/db/entities/production.entity';
import { Look } from '../server/db/entities/look.entity';
import { Swatch } from '../server/db/entities/swatch.entity';
import { Board } from '../server/db/entities/board.entity';
import { DEMO_PASSWORD, DEMO_PRODUCTION_NAME } from '../server/db/seed';
import { ToneService } from '../server/modules/tones/tone.service';
import { resolveSwatchOrigin } from '../server/modules/swatches/swatches.service';
import { getUpsampleTable } from '../server/services/upsample-table';
import { medianMs } from './lib';

/** Size of the large board, and how many warm requests its median takes. */
const LARGE_BOARD_SWATCHES = Number(process.env.BENCH_BOARD_SWATCHES ?? 2000);
const LARGE_BOARD_RUNS = 5;

/** Deterministic colours (a small LCG), so every run times the same board. */
function colours(n: number, seed = 20240601): string[] {
  let s = seed;
  const next = () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
  return Array.from({ length: n }, () => '#' + [next(), next(), next()].map((v) => Math.round(v * 255).toString(16).padStart(2, '0')).join(''));
}

export default async function run(record: (name: string, value: number, unit: string) => void): Promise<void> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-bench-board-'));
  const g = await createApp({ env: { dataDir, demo: true, nodeEnv: 'test', authRateLimit: 100_000, publicUrl: 'http://localhost:5178' }, seed: true, serveClient: false });
  try {
    const ds = g.ctx.ds;
    await getUpsampleTable(dataDir); // the table is built once per data dir at first start; not part of a board's cost
    await g.ctx.compute.warm(); // nor are the compute threads, which a server starts with itself (server/app.ts)
    const production = await ds.getRepository(Production).findOneByOrFail({ name: DEMO_PRODUCTION_NAME });
    const looks = await ds.getRepository(Look).find({ where: { production: { id: production.id } }, order: { id: 'ASC' }, take: 4 });
    const swatches = await ds.getRepository(Swatch).save(
      colours(200).map((hex, i) => ds.getRepository(Swatch).create({ production, department: 'costume', name: `Bench swatch ${i + 1}`, notes: '', ...resolveSwatchOrigin({ type: 'colour', colour: { space: 'hex', hex } }) })),
    );
    const board = await ds.getRepository(Board).save({ production, department: 'costume', name: 'Bench 200 × 4', notes: '', lookIds: looks.map((l) => l.id), mergeStops: 1 / 3, mergeDeltaE: 10, swatches });
    const svc = new ToneService(ds, dataDir);
    const t0 = performance.now();
    const first = await svc.boardTones(production.id, board.id, {});
    const cold = performance.now() - t0;
    if (first.looks.length !== 4 || first.looks.some((l) => l.tones.length !== 200)) throw new Error('board bench: expected 4 looks × 200 tones');
    if (first.looks.some((l) => l.tones.some((x) => !x.range || x.range.possible[1] - x.range.possible[0] < 0))) throw new Error('board bench: every tone should carry its range');
    record('board_200x4_cold_ms', cold, 'ms');
    record('board_200x4_ranges_cold_ms', cold, 'ms');
    const warm = await medianMs(() => svc.boardTones(production.id, board.id, {}), 9);
    record('board_200x4_ms', warm, 'ms');
    record('board_200x4_ranges_ms', warm, 'ms');
    const agent = request.agent(g.app);
    const csrf = (await agent.get('/api/auth/csrf')).body.csrfToken;
    await agent.post('/api/auth/sign-in').set('X-CSRF-Token', csrf).send({ email: 'costume@demo.grisaille.test', password: DEMO_PASSWORD });
    record('board_200x4_http_ms', await medianMs(async () => {
      const r = await agent.get(`/api/productions/${production.id}/boards/${board.id}/tones`);
      if (r.status !== 200) throw new Error(`board bench: HTTP ${r.status}`);
    }, 9), 'ms');

    const n = LARGE_BOARD_SWATCHES;
    const many = await ds.getRepository(Swatch).save(
      colours(n).map((hex, i) => ds.getRepository(Swatch).create({ production, department: 'costume', name: `Bench large swatch ${i + 1}`, notes: '', ...resolveSwatchOrigin({ type: 'colour', colour: { space: 'hex', hex } }) })),
      { chunk: 200 },
    );
    const large = await ds.getRepository(Board).save({ production, department: 'costume', name: `Bench ${n} × 4`, notes: '', lookIds: looks.map((l) => l.id), mergeStops: 1 / 3, mergeDeltaE: 10, swatches: many });
    let bytes = 0;
    // the answer's bytes as they arrive, unparsed: the figure is the server's answer time, not a client's
    // JSON.parse of 4.9 MB (30–60 ms on this machine, and in this process, before the next request)
    const raw = (res: unknown, done: (err: Error | null, body: Buffer) => void) => {
      const stream = res as NodeJS.ReadableStream; // superagent hands its parser the response stream
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => done(null, Buffer.concat(chunks)));
    };
    const ask = async () => {
      const r = await agent.get(`/api/productions/${production.id}/boards/${large.id}/tones`).buffer(true).parse(raw).maxResponseSize(1e9);
      if (r.status !== 200) throw new Error(`board bench: HTTP ${r.status}`);
      bytes = (r.body as Buffer).byteLength;
    };
    await ask(); // cold: estimates the spectra and solves the ranges (cached for the warm runs, as on a server)
    record(`board_${n}x4_ms`, await medianMs(ask, LARGE_BOARD_RUNS), 'ms');
    record(`board_${n}x4_json_mb`, bytes / 1e6, 'MB');
  } finally {
    await g.close();
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
}
