/**
 * Issue 15, items 1 and 3: a board's tones (simulation, tone pipeline, ranges, merges, and the JSON text of
 * each look) are computed in the compute pool's worker threads (server/modules/tones/look-tones.job.ts), the
 * looks of a large board spread over the threads. The answer must not depend on where it was computed: it
 * equals the same board through an app that computes in place (COMPUTE_WORKERS=0), and the tones composed on
 * the main thread the way the service composed them before (every range solved again, the swatches read
 * through the board's relation).
 */
import { threadId } from 'node:worker_threads';
import { In } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, withTestApp, type Agent, type TestApp } from '../helpers/api';
import { Board } from '../../server/db/entities/board.entity';
import { Look } from '../../server/db/entities/look.entity';
import { Production } from '../../server/db/entities/production.entity';
import { Swatch } from '../../server/db/entities/swatch.entity';
import { DEMO_PRODUCTION_NAME } from '../../server/db/seed';
import { resolveSwatchOrigin } from '../../server/modules/swatches/swatches.service';
import { lookDefinition, prepareToneLooks, toneSwatches } from '../../server/modules/tones/tone.service';
import { lookTones } from '../../server/modules/tones/board-tones';
import { LOOK_PER_JOB_FROM } from '../../server/modules/tones/pooled-tones';
import { knownRanges } from '../../server/modules/tones/tone-ranges';
import { getUpsampleTable } from '../../server/services/upsample-table';
import { stopsRange } from '../../shared/spectral/compute';
import type { LookTones } from '../../shared/schemas/board';

/** Deterministic sRGB colours (a small LCG), so both apps and every run hold the same board. */
function colours(n: number, seed: number): string[] {
  let s = seed;
  const next = () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
  return Array.from({ length: n }, () => '#' + [next(), next(), next()].map((v) => Math.round(v * 255).toString(16).padStart(2, '0')).join(''));
}

/** Demo swatches on the large board: every one the seed made (measured, skin, makeup and colours). */
const ALL_DEMO = Infinity;
/** The start of the name of every swatch this file makes. */
const MADE_HERE = 'Pool test: ';

/** Colour swatches on the large board: enough that its looks go one per job. */
const LARGE = LOOK_PER_JOB_FROM + 40;

/**
 * A board of the demo's swatches (measured, skin, makeup and colours; the first `demoTaken` of them) and `n` new colours, some lit hotter or
 * under the key, through the production's first four looks. Same ids in every app made from the same seed.
 */
async function makeBoard(t: TestApp, n: number, seed: number, name: string, demoTaken = ALL_DEMO): Promise<{ productionId: number; boardId: number; swatchIds: number[] }> {
  const ds = t.ctx.ds;
  const production = await ds.getRepository(Production).findOneByOrFail({ name: DEMO_PRODUCTION_NAME });
  const looks = await ds.getRepository(Look).find({ where: { production: { id: production.id } }, order: { id: 'ASC' }, take: 4 });
  // the seed's swatches (this file's own are named with MADE_HERE)
  const demo = (await ds.getRepository(Swatch).find({ where: { production: { id: production.id } }, order: { id: 'ASC' } })).filter((s) => !s.name.startsWith(MADE_HERE)).slice(0, demoTaken);
  const made = await ds.getRepository(Swatch).save(
    colours(n, seed).map((hex, i) =>
      ds.getRepository(Swatch).create({ production, department: 'costume', name: `${MADE_HERE}${name} ${i + 1}`, notes: '', lightStops: i % 7 === 0 ? 1.5 : i % 11 === 0 ? -2 : 0, ...resolveSwatchOrigin({ type: 'colour', colour: { space: 'hex', hex } }) }),
    ),
    { chunk: 100 },
  );
  const swatches = [...demo, ...made];
  const board = await ds.getRepository(Board).save({ production, department: 'costume', name, notes: '', lookIds: looks.map((l) => l.id), mergeStops: 1 / 3, mergeDeltaE: 10, swatches });
  return { productionId: production.id, boardId: board.id, swatchIds: swatches.map((s) => s.id) };
}

/** The answer's text without its compute time (the one field that differs between two runs). */
const withoutMs = (text: string) => text.replace(/,"ms":[-0-9.e+]+\}\}$/, '}}');

/**
 * The board's looks as the service computed them on the main thread before the pool: the board read through
 * its relation, each look composed, every range solved afresh (no cache), `lookTones` in place.
 */
async function tonesInPlace(t: TestApp, productionId: number, boardId: number, mergeStops: number, mergeDeltaE: number): Promise<LookTones[]> {
  const em = t.ctx.ds.manager;
  const table = await getUpsampleTable(t.dataDir);
  const board = await em.findOneOrFail(Board, { where: { id: boardId }, relations: { swatches: true } });
  const rows = await em.find(Look, { where: { production: { id: productionId } } });
  const looks = board.lookIds.map((id) => lookDefinition(rows.find((l) => l.id === id)!));
  const toneLooks = await prepareToneLooks(em, productionId, looks, table);
  const swatches = toneSwatches(board.swatches, table);
  return toneLooks.map((l) => lookTones(l, swatches, mergeStops, mergeDeltaE, (_i, s, m) => stopsRange(l.composed.path, s, m)));
}

describe('board tones in the compute pool', () => {
  let pooled: TestApp;
  let inPlace: TestApp;
  let a: Agent;
  let b: Agent;
  let board: Awaited<ReturnType<typeof makeBoard>>;
  beforeAll(async () => {
    [pooled, inPlace] = await Promise.all([startTestApp({ env: { computeWorkers: 2 } }), startTestApp({ env: { computeWorkers: 0 } })]);
    [a, b] = await Promise.all([pooled.agent('lab@demo.grisaille.test'), inPlace.agent('lab@demo.grisaille.test')]);
    board = await makeBoard(pooled, LARGE, 1515, 'Pool board');
    expect(await makeBoard(inPlace, LARGE, 1515, 'Pool board')).toEqual(board);
    // the board holds stored reflectances (measured, and modelled skin and makeup) besides colours
    const origins = (await pooled.ctx.ds.getRepository(Swatch).findBy({ id: In(board.swatchIds) })).filter((s) => s.reflectance).map((s) => s.origin.type);
    expect(new Set(origins)).toEqual(new Set(['measured', 'skin', 'makeup']));
  });
  afterAll(async () => {
    await Promise.all([pooled.close(), inPlace.close()]);
  });

  it('answers a large board through four looks exactly as in place (COMPUTE_WORKERS=0), computed in worker threads', async () => {
    const url = `/api/productions/${board.productionId}/boards/${board.boardId}/tones`;
    const before = pooled.ctx.compute.stats().recent.filter((j) => j.name === 'look-tones').length;
    for (const round of ['cold', 'warm']) {
      const [p, q] = await Promise.all([a.get(url), b.get(url)]);
      expect([p.status, q.status], round).toEqual([200, 200]);
      expect(p.headers['content-type']).toMatch(/^application\/json/);
      expect(p.body.tones.looks).toHaveLength(4);
      expect(p.body.tones.looks[0].tones).toHaveLength(board.swatchIds.length);
      expect(p.body.tones.looks.some((l: LookTones) => l.mergeCount > 0)).toBe(true);
      expect(withoutMs(p.text), round).toBe(withoutMs(q.text));
      // the text is what JSON.stringify writes for the answer
      expect(p.text).toBe(JSON.stringify(p.body));
    }
    const jobs = pooled.ctx.compute.stats().recent.filter((j) => j.name === 'look-tones').slice(before);
    // one job per look for a board this large (two rounds, four looks), each in a worker thread; a thread that
    // has not composed a look yet asks for its spectra, and the job is sent again with them
    expect(jobs.length).toBeGreaterThanOrEqual(8);
    expect(jobs.length).toBeLessThanOrEqual(16);
    for (const j of jobs) expect(j.threadId).not.toBe(threadId);
    expect(new Set(jobs.map((j) => j.threadId)).size).toBe(2);
    const here = inPlace.ctx.compute.stats();
    expect(here.jobsInWorkers).toBe(0);
    expect(here.recent.filter((j) => j.name === 'look-tones').every((j) => j.threadId === threadId)).toBe(true);
  });

  it('answers the very tones the main thread composes with every range solved afresh, in the relation’s swatch order', async () => {
    const r = await a.get(`/api/productions/${board.productionId}/boards/${board.boardId}/tones?mergeStops=0.5&mergeDeltaE=8`);
    expect(r.status).toBe(200);
    expect(r.body.tones.looks[0].tones.map((x: { swatchId: number }) => x.swatchId)).toEqual([...board.swatchIds].sort((x, y) => x - y));
    expect(JSON.stringify(r.body.tones.looks)).toBe(JSON.stringify(await tonesInPlace(pooled, board.productionId, board.boardId, 0.5, 8)));
  });

  it('answers a small board (all looks in one job) and a swatch’s tones exactly as in place', async () => {
    const small = await makeBoard(pooled, 12, 77, 'Small pool board', 8);
    expect(await makeBoard(inPlace, 12, 77, 'Small pool board', 8)).toEqual(small);
    const before = pooled.ctx.compute.stats().recent.filter((j) => j.name === 'look-tones').length;
    const url = `/api/productions/${small.productionId}/boards/${small.boardId}/tones`;
    const [p, q] = await Promise.all([a.get(url), b.get(url)]);
    expect(withoutMs(p.text)).toBe(withoutMs(q.text));
    const jobs = pooled.ctx.compute.stats().recent.filter((j) => j.name === 'look-tones').length - before;
    expect(jobs).toBeGreaterThanOrEqual(1); // one job for every look (two if its thread asked for their spectra)
    expect(jobs).toBeLessThanOrEqual(2);
    for (const id of [small.swatchIds[0], small.swatchIds.at(-1)!]) {
      const swatchUrl = `/api/productions/${small.productionId}/swatches/${id}/tones`;
      const [x, y] = await Promise.all([a.get(swatchUrl), b.get(swatchUrl)]);
      expect(x.status).toBe(200);
      expect(x.body.looks.length).toBeGreaterThan(0);
      expect(x.body).toEqual(y.body);
    }
  });

  it('answers an exposure sheet listing the large board’s swatches (tones in the pool) exactly as in place', async () => {
    const lookId = (await pooled.ctx.ds.getRepository(Board).findOneByOrFail({ id: board.boardId })).lookIds[0];
    const url = `/api/productions/${board.productionId}/looks/${lookId}/sheet?boards=${board.boardId}`;
    const before = pooled.ctx.compute.stats().recent.filter((j) => j.name === 'look-tones').length;
    const [p, q] = await Promise.all([a.get(url), b.get(url)]);
    expect([p.status, q.status]).toEqual([200, 200]);
    expect(p.body.sheet.swatches.length).toBeGreaterThanOrEqual(LARGE);
    expect(p.body.sheet.swatches).toEqual(q.body.sheet.swatches); // (the two apps' timestamps differ)
    expect(pooled.ctx.compute.stats().recent.filter((j) => j.name === 'look-tones').length).toBeGreaterThan(before);
  });

  it('keeps on the main thread the ranges a thread solved, so the next request does not solve them again', async () => {
    const few = await makeBoard(pooled, 3, 4242, 'Few new colours');
    const r = await a.get(`/api/productions/${few.productionId}/boards/${few.boardId}/tones`);
    expect(r.status).toBe(200);
    const em = pooled.ctx.ds.manager;
    const table = await getUpsampleTable(pooled.dataDir);
    const row = await em.findOneOrFail(Board, { where: { id: few.boardId }, relations: { swatches: true } });
    const looks = await em.find(Look, { where: { production: { id: few.productionId } } });
    const [look] = await prepareToneLooks(em, few.productionId, [lookDefinition(looks.find((l) => l.id === row.lookIds[0])!)], table);
    const swatches = toneSwatches(row.swatches, table);
    const held = knownRanges(look.composed.path, swatches);
    swatches.forEach((s, i) => expect(Number.isNaN(held[i * 4]), `swatch ${i}`).toBe(!s.estimated));
  });
});

describe('board tones when the pool is busy', () => {
  it('waits for a thread rather than refusing a read (the queue limit is for heavy computations)', async () => {
    await withTestApp({ env: { computeWorkers: 1, computeQueueLimit: 0 } }, async (t) => {
      const v = await t.agent('lab@demo.grisaille.test');
      const b = await makeBoard(t, LARGE, 99, 'Busy board');
      const url = `/api/productions/${b.productionId}/boards/${b.boardId}/tones`;
      const answers = await Promise.all(Array.from({ length: 3 }, () => v.get(url)));
      expect(answers.map((r) => r.status)).toEqual([200, 200, 200]);
      expect(new Set(answers.map((r) => withoutMs(r.text))).size).toBe(1);
    });
  });
});
