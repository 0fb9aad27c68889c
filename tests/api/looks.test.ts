/**
 * Looks: create, read, update, duplicate, delete; role denials; bad input with nothing written; the bench's
 * analysis (curves, filter factor for the look's light and for daylight and tungsten).
 */
import { GRID_SIZE } from '../../shared/spectral/policy';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoAs, type Agent, type TestApp } from '../helpers/api';
import { Look } from '../../server/db/entities/look.entity';
import { Board } from '../../server/db/entities/board.entity';

/** Default tolerance of this file, stops: a third of a stop, the trade's smallest step (common practice). */
const TOL_STOPS = 1 / 3;
/** Fact of the trade (common practice): the red-absorbing cyan costs about one stop in daylight … */
const CYAN_DAYLIGHT_STOPS = 1;
/** … and about two-thirds of a stop more under tungsten, because tungsten light is mostly red (common practice). */
const CYAN_TUNGSTEN_EXTRA_STOPS = 2 / 3;
/** Looser, ¼ stop, as in the engine's own reference test: the extra is a difference of two estimates. */
const TOL_EXTRA_STOPS = 1 / 4;
/** The working grid: 350–900 nm at 1 nm (shared/spectral/policy.ts; CIE 015:2018 1 nm summation). */
const GRID_SAMPLES = GRID_SIZE;

let t: TestApp;
let owner: Agent;
let editor: Agent;
let contributor: Agent;
let viewer: Agent;
let base: string;
const pan = { light: { source: { id: 'tungsten-3200' } }, filters: [], medium: { source: { id: 'panchromatic' } } };

beforeAll(async () => {
  ({ t, base, as: { owner, editor, contributor, viewer } } = await startDemoAs({ owner: 'camera', editor: 'gaffer', contributor: 'makeup', viewer: 'lab' }));
});
afterAll(async () => t?.close());

const count = () => t.ctx.ds.getRepository(Look).count();

describe('read', () => {
  it('a viewer lists the demo looks (at least three)', async () => {
    const r = await viewer.get(`${base}/looks`);
    expect(r.status).toBe(200);
    const names = r.body.looks.map((l: { name: string }) => l.name);
    expect(names).toEqual(expect.arrayContaining(['Panchromatic, no filter', 'Panchromatic + red-absorbing cyan', 'Orthochromatic']));
  });

  it('the analysis of the cyan look gives the factor for its light, daylight and tungsten', async () => {
    const looks = (await viewer.get(`${base}/looks`)).body.looks as { id: number; name: string }[];
    const cyan = looks.find((l) => l.name === 'Panchromatic + red-absorbing cyan')!;
    const r = await viewer.get(`${base}/looks/${cyan.id}/analysis`);
    expect(r.status).toBe(200);
    const a = r.body.analysis;
    expect(a.nm).toHaveLength(GRID_SAMPLES);
    expect(a.curves.map((c: { role: string }) => c.role)).toEqual(['light', 'filter', 'medium', 'eye', 'product']);
    for (const c of a.curves) expect(c.values).toHaveLength(GRID_SAMPLES);
    expect(Math.max(...a.curves.at(-1).values)).toBeCloseTo(1, 6); // the product is normalised to its peak
    expect(Math.abs(a.daylight.stops - CYAN_DAYLIGHT_STOPS)).toBeLessThanOrEqual(TOL_STOPS);
    expect(Math.abs(a.tungsten.stops - a.daylight.stops - CYAN_TUNGSTEN_EXTRA_STOPS)).toBeLessThanOrEqual(TOL_EXTRA_STOPS);
    expect(a.factor.stops).toBeCloseTo(a.tungsten.stops, 9); // the look is lit by tungsten 3200 K
    expect(a.factor.factor).toBeCloseTo(2 ** a.factor.stops, 9);
  });

  it('a look that is not in the production is a 404', async () => {
    expect((await viewer.get(`${base}/looks/999999`)).status).toBe(404);
  });
});

describe('create, update, duplicate, delete', () => {
  let id = 0;
  it('the owner creates a look from the built-in library', async () => {
    const r = await owner.post(`${base}/looks`).send({ name: 'Test look', notes: 'made in a test', ...pan, filters: [{ filter: { source: { id: 'yellow-490' } }, on: 'lens' }] });
    expect(r.status).toBe(201);
    id = r.body.look.id;
    expect(r.body.look.tone.developmentStops).toBe(0); // tone settings take their defaults
    const g = await viewer.get(`${base}/looks/${id}`);
    expect(g.body.look.filters).toEqual([{ filter: { source: { id: 'yellow-490' } }, on: 'lens' }]);
  });

  it('an editor changes its light and filter stack; the factor follows', async () => {
    const before = (await viewer.get(`${base}/looks/${id}/analysis`)).body.analysis.factor.stops;
    const r = await editor.patch(`${base}/looks/${id}`).send({ light: { source: { daylight: 5600 } }, filters: [{ filter: { source: { id: 'red-590' } }, on: 'lens' }] });
    expect(r.status).toBe(200);
    const after = (await viewer.get(`${base}/looks/${id}/analysis`)).body.analysis.factor.stops;
    expect(after).toBeGreaterThan(before + 1);
  });

  it('a tone change keeps the tone fields it does not name', async () => {
    const a = await editor.patch(`${base}/looks/${id}`).send({ tone: { developmentStops: -0.5, ratingStops: -0.667 } });
    expect(a.status).toBe(200);
    const b = await editor.patch(`${base}/looks/${id}`).send({ tone: { tStop: 4 } });
    expect(b.status).toBe(200);
    expect(b.body.look.tone).toMatchObject({ developmentStops: -0.5, ratingStops: -0.667, tStop: 4 });
    const bad = await editor.patch(`${base}/looks/${id}`).send({ tone: { tStop: 'wide open' } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('tone.tStop');
  });

  it('a gel on the light costs light but leaves the lens clear', async () => {
    const r = await owner.post(`${base}/looks/analyse`).send({ look: { ...pan, filters: [{ filter: { source: { id: 'nd-0.3' } }, on: 'light' }] } });
    expect(r.status).toBe(200);
    // ND 0.3 is one stop at every wavelength (T = 10^−0.3 ≈ 0.501, definition of optical density)
    expect(r.body.analysis.factor.stops).toBeCloseTo(0.3 * Math.log2(10), 6);
  });

  it('duplicates a look', async () => {
    const r = await editor.post(`${base}/looks/${id}/duplicate`).send({});
    expect(r.status).toBe(201);
    expect(r.body.look.name).toBe('Test look (copy)');
    expect(r.body.look.filters).toEqual([{ filter: { source: { id: 'red-590' } }, on: 'lens' }]);
  });

  it('deleting a look takes it off every board', async () => {
    const board = (await owner.get(`${base}/boards`)).body.boards[0];
    await owner.patch(`${base}/boards/${board.id}`).send({ lookIds: [...board.lookIds.slice(0, 3), id] });
    const r = await owner.delete(`${base}/looks/${id}`);
    expect(r.status).toBe(204);
    expect((await viewer.get(`${base}/looks/${id}`)).status).toBe(404);
    const b = await t.ctx.ds.getRepository(Board).findOneByOrFail({ id: board.id });
    expect(b.lookIds).not.toContain(id);
  });
});

describe('roles', () => {
  it('contributors and viewers cannot create, change, duplicate or delete looks', async () => {
    const someId = (await viewer.get(`${base}/looks`)).body.looks[0].id;
    for (const a of [contributor, viewer]) {
      expect((await a.post(`${base}/looks`).send({ name: 'x', ...pan })).status).toBe(403);
      expect((await a.patch(`${base}/looks/${someId}`).send({ name: 'x' })).status).toBe(403);
      expect((await a.post(`${base}/looks/${someId}/duplicate`).send({})).status).toBe(403);
      expect((await a.delete(`${base}/looks/${someId}`)).status).toBe(403);
    }
  });

  it('a viewer may still analyse an unsaved look on the bench', async () => {
    const r = await viewer.post(`${base}/looks/analyse`).send({ look: pan });
    expect(r.status).toBe(200);
    expect(r.body.analysis.factor.stops).toBe(0);
  });
});

describe('bad input writes nothing', () => {
  const cases: [string, object, string][] = [
    ['no name', { ...pan }, 'name'],
    ['an unknown built-in light', { name: 'x', ...pan, light: { source: { id: 'no-such-light' } } }, 'light.source.id'],
    ['a filter id used as a medium', { name: 'x', ...pan, medium: { source: { id: 'red-590' } } }, 'medium.source.id'],
    ['both a curve and a source', { name: 'x', ...pan, light: { curveId: 1, source: { id: 'd65' } } }, 'light'],
    ['a curve that is not in the library', { name: 'x', ...pan, medium: { curveId: 999999 } }, 'medium.curveId'],
    ['daylight below 4000 K', { name: 'x', ...pan, light: { source: { daylight: 2000 } } }, 'light.source.daylight'],
    ['a filter neither on the lens nor the light', { name: 'x', ...pan, filters: [{ filter: { source: { id: 'red-590' } }, on: 'camera' }] }, 'filters.0.on'],
    ['a key swatch from nowhere', { name: 'x', ...pan, tone: { keySwatchId: 999999 } }, 'tone.keySwatchId'],
  ];
  it.each(cases)('%s → 400 naming the field', async (_label, body, field) => {
    const n = await count();
    const r = await owner.post(`${base}/looks`).send(body);
    expect(r.status).toBe(400);
    expect(r.body.error.field ?? '').toBe(field);
    expect(await count()).toBe(n);
  });

  it('a bad update changes nothing', async () => {
    const l = (await viewer.get(`${base}/looks`)).body.looks[0];
    const r = await owner.patch(`${base}/looks/${l.id}`).send({ name: 'renamed', medium: { source: { id: 'nope' } } });
    expect(r.status).toBe(400);
    expect((await viewer.get(`${base}/looks/${l.id}`)).body.look.name).toBe(l.name);
  });
});
