/**
 * How sure is a grey, over HTTP: the ranges of POST /api/simulate (and the extremes on request), of board
 * and swatch tones (with the merges' certainty) and of the exposure sheet's swatches; the photos page's
 * uncertainty tables (POST …/photo-uncertainty, polled at GET …/photo-uncertainty/:key).
 * Documented in docs/api-simulate.md, docs/api-bench.md, docs/api-sheets.md and docs/api-photos.md.
 */
import { ESTIMATE_SIZE, GRID_END_NM, GRID_START_NM } from '../../shared/spectral/policy';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoAs, type Agent, type TestApp } from '../helpers/api';
import type { BoardTones, LookTones, SwatchTone, ToneRange } from '../../shared/schemas/board';
import type { UncertaintyStatus } from '../../shared/schemas/photo';
import type { ExposureSheet } from '../../shared/schemas/sheet';
import { createTestLook, TEST_LOOK } from './photo-fixtures';

/** Default tolerance of this file, stops (floating point only: ranges hold the estimate by construction). */
const TOL = 1e-9;
/** The grid the metamer programs range over: the estimate's grid, 350–900 nm at 5 nm (shared/spectral/policy.ts). */
const GRID_SAMPLES = ESTIMATE_SIZE;
/** Nodes per axis of a photo uncertainty table (shared/photo/uncertainty-table.ts, as the live preview's table). */
const UNCERTAINTY_SIZE = 33;
/** Middle grey (common practice). */
const GREY = 0.18;

let t: TestApp;
let lab: Agent;
let camera: Agent;
let costume: Agent;
let base: string;
let pid: number;

beforeAll(async () => {
  ({ t, pid, base, as: { lab, camera, costume } } = await startDemoAs({ lab: 'lab', camera: 'camera', costume: 'costume' }));
});
afterAll(async () => t?.close());

/** lo ≤ value ≤ hi for both ranges, and the plausible range inside the possible one. */
function expectHolds(range: ToneRange, stops: number, what: string): void {
  const [pLo, pHi] = range.possible;
  const [qLo, qHi] = range.plausible;
  expect(pLo, what).toBeLessThanOrEqual(qLo + TOL);
  expect(qLo, what).toBeLessThanOrEqual(stops + TOL);
  expect(stops, what).toBeLessThanOrEqual(qHi + TOL);
  expect(qHi, what).toBeLessThanOrEqual(pHi + TOL);
}
const zeroWidth = (range: ToneRange, stops: number) => [...range.possible, ...range.plausible].every((v) => Math.abs(v - stops) <= TOL);

describe('POST /api/simulate: range and extremes', () => {
  const body = {
    light: { id: 'tungsten-3200' },
    filters: [{ id: 'red-590' }],
    medium: { id: 'panchromatic' },
    swatches: [
      { name: 'grey card', reflectance: [[380, GREY], [580, GREY], [780, GREY]] },
      { name: 'lipstick', srgb: '#b01c2e' },
      { name: 'foliage', rgb: [60, 110, 40] },
      { name: 'sky', lab: [60, -5, -30] },
    ],
  };

  it('answers a range per swatch in stops before key: lo ≤ stops ≤ hi, plausible inside possible; zero width when measured', async () => {
    const r = await lab.post('/api/simulate').send(body);
    expect(r.status).toBe(200);
    const [grey, ...estimated] = r.body.swatches as { name: string; stops: number; estimated: boolean; range: ToneRange & { extremes?: unknown } }[];
    expect(grey.estimated).toBe(false);
    expect(zeroWidth(grey.range, grey.stops)).toBe(true);
    for (const s of [grey, ...estimated]) {
      expect(Object.keys(s.range).sort(), s.name).toEqual(['plausible', 'possible']);
      expectHolds(s.range, s.stops, s.name);
    }
    for (const s of estimated) {
      expect(s.estimated).toBe(true);
      // through a red filter the colour alone leaves room: the possible range is not a point
      expect(s.range.possible[1] - s.range.possible[0], s.name).toBeGreaterThan(0.01);
    }
  });

  it('answers the reflectances at the possible range\'s ends only when asked, as [nm, ρ] pairs on the estimate grid in 0..1', async () => {
    const r = await lab.post('/api/simulate').send({ ...body, extremes: true });
    expect(r.status).toBe(200);
    const [grey, ...estimated] = r.body.swatches as { name: string; range: { extremes?: { low: [number, number][]; high: [number, number][] } } }[];
    expect(grey.range.extremes).toBeUndefined(); // measured: nothing to range over
    for (const s of estimated) {
      const e = s.range.extremes!;
      expect(e, s.name).toBeDefined();
      for (const side of [e.low, e.high]) {
        expect(side).toHaveLength(GRID_SAMPLES);
        expect(side[0][0]).toBe(GRID_START_NM);
        expect(side[GRID_SAMPLES - 1][0]).toBe(GRID_END_NM);
        for (const [, v] of side) {
          expect(v).toBeGreaterThanOrEqual(0);
          expect(v).toBeLessThanOrEqual(1);
        }
      }
    }
    const off = await lab.post('/api/simulate').send({ ...body, extremes: false });
    for (const s of off.body.swatches) expect(s.range.extremes).toBeUndefined();
    const bad = await lab.post('/api/simulate').send({ ...body, extremes: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('extremes');
  });
});

describe('board, swatch and sheet tones carry ranges', () => {
  let boards: { id: number; department: string; lookIds: number[]; swatchIds: number[]; mergeStops: number }[] = [];
  let measured = new Set<number>();

  beforeAll(async () => {
    boards = (await lab.get(`${base}/boards`)).body.boards;
    const swatches = (await lab.get(`${base}/swatches`)).body.swatches as { id: number; spectrum: 'measured' | 'estimated' }[];
    measured = new Set(swatches.filter((s) => s.spectrum === 'measured').map((s) => s.id));
  });

  const checkTones = (tones: SwatchTone[], what: string) => {
    for (const s of tones) {
      expectHolds(s.range, s.stops, `${what}, swatch ${s.swatchId}`);
      if (measured.has(s.swatchId)) expect(zeroWidth(s.range, s.stops), `${what}, measured swatch ${s.swatchId}`).toBe(true);
    }
  };

  it('board tones: every tone has a range (stops after key) holding its stops; measured swatches have zero width', async () => {
    expect(measured.size).toBeGreaterThan(0);
    let sawMeasured = false;
    for (const b of boards) {
      const tones = (await lab.get(`${base}/boards/${b.id}/tones`)).body.tones as BoardTones;
      for (const l of tones.looks) checkTones(l.tones, `board ${b.id}, look ${l.lookId}`);
      sawMeasured ||= b.swatchIds.some((id) => measured.has(id));
    }
    expect(sawMeasured).toBe(true);
  });

  it('merges say how certain they are: certain when both plausible ranges lie within the threshold, else possible', async () => {
    const seen = new Set<string>();
    for (const b of boards) {
      const tones = (await lab.get(`${base}/boards/${b.id}/tones?mergeStops=0.5`)).body.tones as BoardTones;
      for (const l of tones.looks) {
        for (const sm of l.merges) {
          for (const m of sm.partners) {
            const [x, y] = [sm.swatchId, m.swatchId].map((id) => l.tones.find((s) => s.swatchId === id)!);
            const lo = Math.min(x.range.plausible[0], y.range.plausible[0]);
            const hi = Math.max(x.range.plausible[1], y.range.plausible[1]);
            const gap = Math.max(x.range.plausible[0], y.range.plausible[0]) - Math.min(x.range.plausible[1], y.range.plausible[1]);
            expect(gap).toBeLessThanOrEqual(0.5 + TOL);
            const certainty = m.certain ? 'certain' : 'possible';
            expect(certainty).toBe(hi - lo <= 0.5 + TOL ? 'certain' : 'possible');
            seen.add(certainty);
          }
          // certain merges come first
          const order = sm.partners.map((m) => m.certain);
          expect(order).toEqual([...order].sort((p, q) => Number(q) - Number(p)));
        }
      }
    }
    expect(seen.has('possible')).toBe(true);
  });

  it('swatch tones: one range per look, zero width for a measured swatch', async () => {
    const ids = [...new Set(boards.flatMap((b) => b.swatchIds))];
    const picks = [ids.find((id) => measured.has(id))!, ...ids.filter((id) => !measured.has(id)).slice(0, 3)];
    for (const id of picks) {
      const r = await lab.get(`${base}/swatches/${id}/tones`);
      expect(r.status).toBe(200);
      const looks = r.body.looks as LookTones[];
      expect(looks.length).toBeGreaterThan(0);
      for (const l of looks) {
        expect(l.tones).toHaveLength(1);
        checkTones(l.tones, `swatch ${id}, look ${l.lookId}`);
      }
    }
  });

  it("the exposure sheet's swatches carry their ranges", async () => {
    const lookId = boards[0].lookIds[0];
    const r = await lab.get(`${base}/looks/${lookId}/sheet`);
    expect(r.status).toBe(200);
    const s = r.body.sheet as ExposureSheet;
    expect(s.swatches.length).toBeGreaterThan(0);
    for (const w of s.swatches) {
      expectHolds(w.range, w.stops, `sheet swatch ${w.swatchId}`);
      if (measured.has(w.swatchId)) expect(zeroWidth(w.range, w.stops)).toBe(true);
    }
    // the same numbers as the board's tones through that look
    const board = (await lab.get(`${base}/boards/${boards[0].id}/tones`)).body.tones as BoardTones;
    const tone = board.looks.find((l) => l.lookId === lookId)!.tones;
    for (const w of s.swatches) {
      const same = tone.find((x) => x.swatchId === w.swatchId);
      if (same) expect(w.range).toEqual(same.range);
    }
  });
});

describe('photo uncertainty tables', () => {
  let lookId = 0;
  const url = () => `${base}/photo-uncertainty`;

  beforeAll(async () => {
    lookId = await createTestLook(camera, pid);
  });

  async function untilDone(key: string): Promise<UncertaintyStatus> {
    for (let i = 0; i < 600; i++) {
      const r = await lab.get(`${url()}/${key}`);
      expect(r.status).toBe(200);
      const u = r.body.uncertainty as UncertaintyStatus;
      expect(u.key).toBe(key);
      if (u.status !== 'running') return u;
      expect(u.widths).toBeNull();
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    throw new Error('the uncertainty table did not finish in 60 s');
  }

  it('a viewer starts one for a saved look (202), polls it to done, and gets size³ widths ≥ 0', async () => {
    const r = await lab.post(url()).send({ lookId });
    expect(r.status).toBe(202);
    const u = r.body.uncertainty as UncertaintyStatus;
    expect(u).toMatchObject({ status: 'running', size: UNCERTAINTY_SIZE, widths: null, error: null });
    expect(u.key).toMatch(/^[0-9a-f]{32}$/);
    expect(u.progress).toBeGreaterThanOrEqual(0);
    const done = await untilDone(u.key);
    expect(done.status).toBe('done');
    expect(done.progress).toBe(1);
    expect(done.error).toBeNull();
    expect(done.widths).toHaveLength(UNCERTAINTY_SIZE ** 3);
    expect(done.widths!.every((w) => Number.isFinite(w) && w >= 0)).toBe(true);
    // neutrals have no spread to speak of through a red filter; saturated colours do
    const at = (r8: number, g8: number, b8: number) => done.widths![(b8 * UNCERTAINTY_SIZE + g8) * UNCERTAINTY_SIZE + r8];
    expect(Math.max(...done.widths!)).toBeGreaterThan(at(16, 16, 16));

    const again = await costume.post(url()).send({ lookId });
    expect(again.status).toBe(200);
    expect(again.body.uncertainty.key).toBe(u.key);
    expect(again.body.uncertainty.status).toBe('done');
  }, 90_000);

  it('takes an unsaved look definition too', async () => {
    const r = await lab.post(url()).send({ look: TEST_LOOK });
    expect([200, 202]).toContain(r.status);
    expect((r.body.uncertainty as UncertaintyStatus).key).toMatch(/^[0-9a-f]{32}$/);
    expect((await untilDone(r.body.uncertainty.key)).status).toBe('done');
  }, 90_000);

  it('refuses bad bodies with 400 and the field named', async () => {
    const cases: [object, string][] = [
      [{}, 'lookId'],
      [{ lookId: 'one' }, 'lookId'],
      [{ lookId: -3 }, 'lookId'],
      [{ lookId, look: TEST_LOOK }, 'lookId'],
    ];
    for (const [sent, field] of cases) {
      const r = await lab.post(url()).send(sent);
      expect(r.status, JSON.stringify(sent)).toBe(400);
      expect(r.body.error.field, JSON.stringify(sent)).toBe(field);
    }
    const badLook = await lab.post(url()).send({ look: { ...TEST_LOOK, medium: 'panchromatic' } });
    expect(badLook.status).toBe(400);
    expect(badLook.body.error.field).toBe('look.medium');
    // a well-formed look naming no built-in medium is refused when it is resolved, with the look's own path
    const unknown = await lab.post(url()).send({ look: { ...TEST_LOOK, medium: { source: { id: 'no-such-medium' } } } });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.field).toBe('look.medium.source.id');
  });

  it('answers 404 for an unknown key or a look of no production of ours', async () => {
    expect((await lab.get(`${url()}/${'0'.repeat(32)}`)).status).toBe(404);
    expect((await lab.get(`${url()}/not-a-key`)).status).toBe(404);
    expect((await lab.post(url()).send({ lookId: 999_999 })).status).toBe(404);
  });
});
