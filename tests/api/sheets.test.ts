import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type Agent, type TestApp } from '../helpers/api';
import { NEAR_THRESHOLD_STOPS, type ExposureSheet } from '../../shared/schemas/sheet';

/** Shared default tolerance for this file (relative). */
const TOL = 1e-6;
/** Optical density 0.3 passes 10^−0.3 of every wavelength (definition of optical density): F = 10^0.3, for any light. */
const ND03_FACTOR = 10 ** 0.3;
/**
 * Facts of the trade (common practice): box speed 250, pulled half a stop and rated two-thirds of a stop
 * slower, gives EI 160; a one-stop filter then gives 80. An ND 0.3 costs 0.997 stop, which rounds the same way.
 */
const BOX_SPEED = 250;
const RATED_EI = 160;
const EFFECTIVE_EI = 80;
/** ISO 2720, E = C·N²/(t·S) by hand: 250 · 2.8² · 48 / 80 = 1176 lux (T2.8, 24 fps, 180° = 1/48 s, EI 80). */
const LUX_T28_EI80 = 1176;
/** 1 fc = 10.764 lux (definition: 1 lm/ft², 1 ft = 0.3048 m). */
const FC_T28_EI80 = LUX_T28_EI80 * 0.3048 ** 2;
/** Light scales as 1/EI: 160 / 80. */
const COST_RATIO = 2;

const LOOK_NAME = 'Sheet check, ND 0.3 pulled';

let t: TestApp;
let camera: Agent;
let lab: Agent;
let lookId: number;
let strangerLookId: number;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-sheet-'));

/** GET as raw bytes. */
const getBytes = (agent: Agent, url: string) =>
  agent.get(url).buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });
/** Text of a PDF by poppler's pdftotext (an independent reader). */
function pdfText(pdf: Buffer): string {
  const file = path.join(tmp, `sheet-${Date.now()}-${Math.random().toString(36).slice(2)}.pdf`);
  fs.writeFileSync(file, pdf);
  return execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
}
const rel = (x: number, y: number) => Math.abs(x / y - 1);

beforeAll(async () => {
  t = await startTestApp();
  camera = await t.agent('camera@demo.grisaille.test');
  lab = await t.agent('lab@demo.grisaille.test');
  const pid = t.demoProductionId;
  const made = await camera.post(`/api/productions/${pid}/looks`).send({
    name: LOOK_NAME,
    notes: 'Grey card at zone V; check the flag on the key.',
    light: { source: { id: 'tungsten-3200' } },
    filters: [{ filter: { source: { id: 'nd-0.3' } }, on: 'lens' }],
    medium: { source: { id: 'panchromatic' } },
    tone: { boxSpeed: BOX_SPEED, developmentStops: -0.5, ratingStops: -0.667 },
  });
  expect(made.status).toBe(201);
  lookId = made.body.look.id;
  // a look in another production, which the demo production's routes must not reach
  const other = await camera.post('/api/productions').send({ name: 'Another production' });
  expect(other.status).toBe(201);
  const otherLook = await camera.post(`/api/productions/${other.body.production.id}/looks`).send({
    name: 'Stranger', light: { source: { id: 'd65' } }, medium: { source: { id: 'panchromatic' } },
  });
  expect(otherLook.status).toBe(201);
  strangerLookId = otherLook.body.look.id;
});
afterAll(async () => {
  await t.close();
  fs.rmSync(tmp, { recursive: true, force: true });
});

describe('GET …/looks/:lookId/sheet.pdf', () => {
  it('a viewer downloads the PDF: application/pdf, %PDF header, the look name, the EI chain and light levels in it', async () => {
    const r = await getBytes(lab, `/api/productions/${t.demoProductionId}/looks/${lookId}/sheet.pdf`);
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/^application\/pdf/);
    expect(r.headers['content-disposition']).toMatch(/attachment; filename="exposure-sheet-sheet-check-nd-03-pulled\.pdf"/);
    const pdf = r.body as Buffer;
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const text = pdfText(pdf);
    expect(text).toContain(LOOK_NAME);
    expect(text).toContain("The Clockmaker's Winter");
    expect(text).toMatch(/Effective EI \(this look’s light\)\s+80/);
    expect(text).toContain(`EI ${BOX_SPEED}`);
    expect(text).toContain(`EI ${RATED_EI}`);
    expect(text).toContain(`EI ${EFFECTIVE_EI}`);
    expect(text).toMatch(/pulled ½ stop/);
    expect(text).toMatch(/T2\.8 +\(this look\) +109 fc +1,176 lux/);
    expect(text).toContain('needs 2× the light of the unfiltered one');
    expect(text).toContain('Neutral density'); // the light-path card wraps: 'Neutral density' / '0.3, on the lens'
    expect(text).toContain('0.3, on the lens');
    expect(text).toContain('Daylight');
    expect(text).toContain('Tungsten');
    expect(text).toContain('CAUTIONS');
    expect(text).toMatch(/safety officer, licensed\s+electricians and local codes/);
    expect(text).toContain('Grey card at zone V');
  });

  it('answers 404 for a look of another production', async () => {
    const r = await camera.get(`/api/productions/${t.demoProductionId}/looks/${strangerLookId}/sheet.pdf`);
    expect(r.status).toBe(404);
    expect(r.body.error.code).toBe('not_found');
    const j = await camera.get(`/api/productions/${t.demoProductionId}/looks/${strangerLookId}/sheet`);
    expect(j.status).toBe(404);
  });

  it('answers 401 without a session', async () => {
    const anon = await t.agent();
    const r = await anon.get(`/api/productions/${t.demoProductionId}/looks/${lookId}/sheet.pdf`);
    expect(r.status).toBe(401);
  });
});

describe('GET …/looks/:lookId/sheet', () => {
  it('gives the numbers the page and the PDF show', async () => {
    const r = await lab.get(`/api/productions/${t.demoProductionId}/looks/${lookId}/sheet`);
    expect(r.status).toBe(200);
    const s = r.body.sheet as ExposureSheet;
    expect(s.look.name).toBe(LOOK_NAME);
    expect(s.chain!.steps.map((x) => x.ei)).toEqual([BOX_SPEED, RATED_EI, EFFECTIVE_EI]);
    for (const f of s.factors) expect(rel(f.factor, ND03_FACTOR)).toBeLessThan(TOL);
    expect(s.chain!.byLight.map((b) => b.effectiveEI)).toEqual([EFFECTIVE_EI, EFFECTIVE_EI]);
    const own = s.lightLevels.find((l) => l.tStop === 2.8)!;
    expect(rel(own.lux, LUX_T28_EI80)).toBeLessThan(TOL);
    expect(rel(own.footcandles, FC_T28_EI80)).toBeLessThan(TOL);
    expect(rel(s.cost!.ratio, COST_RATIO)).toBeLessThan(TOL);
    expect(rel(s.camera.exposureSeconds, 1 / 48)).toBeLessThan(TOL);
    expect(s.cautions.length).toBeGreaterThanOrEqual(4);
    expect(s.lightPath.filters).toEqual([{ label: 'Neutral density 0.3', on: 'lens' }]);
  });

  it('lists the zones of the swatches of the boards that use a demo look', async () => {
    const looks = await lab.get(`/api/productions/${t.demoProductionId}/looks`);
    const boards = await lab.get(`/api/productions/${t.demoProductionId}/boards`);
    const used = boards.body.boards.flatMap((b: { lookIds: number[] }) => b.lookIds);
    const demo = looks.body.looks.find((l: { id: number }) => used.includes(l.id));
    const r = await lab.get(`/api/productions/${t.demoProductionId}/looks/${demo.id}/sheet`);
    const s = r.body.sheet as ExposureSheet;
    expect(s.swatches.length).toBeGreaterThan(0);
    expect(s.boards.length).toBeGreaterThan(0);
    for (const w of s.swatches) expect(w.zone).toBeCloseTo(5 + w.stops, 9);
    // lightest first
    for (let i = 1; i < s.swatches.length; i++) expect(s.swatches[i].stops).toBeLessThanOrEqual(s.swatches[i - 1].stops);
  });
});

/** More swatches than the sheet's old cut of 30: every one must be listed. */
const MANY = 60;
/** Stage blood, dark and red: among the darkest swatches, the kind the old cut of 30 left off (the report). */
const BLOOD = { name: 'Stage blood, dried', hex: '#3a0a0c' };
/** A grey ramp from black to white, one step per swatch (names sort with their number). */
const stepName = (i: number) => `Ramp step ${String(i + 1).padStart(2, '0')}`;
const stepHex = (i: number) => {
  const v = Math.round((i / (MANY - 2)) * 255).toString(16).padStart(2, '0');
  return `#${v}${v}${v}`;
};

/** PDFs kept to look at (test-output/ is ignored by git): render a page with `pdftoppm -png -r 60`. */
const KEEP_DIR = path.resolve('test-output/sheets');
/** Text of each page of a PDF (pdftotext -f n -l n); the file is kept as test-output/sheets/<keep>.pdf. */
function pdfPages(pdf: Buffer, keep: string): string[] {
  fs.mkdirSync(KEEP_DIR, { recursive: true });
  const file = path.join(KEEP_DIR, `${keep}.pdf`);
  fs.writeFileSync(file, pdf);
  const info = execFileSync('pdfinfo', [file], { encoding: 'utf8' });
  const pages = Number(/^Pages:\s+(\d+)/m.exec(info)![1]);
  return Array.from({ length: pages }, (_, i) => execFileSync('pdftotext', ['-layout', '-f', String(i + 1), '-l', String(i + 1), file, '-'], { encoding: 'utf8' }));
}

describe('a complete sheet: every swatch, the darkest flagged, boards picked, several looks in one PDF', () => {
  let boardId: number;
  let freshLookId: number;
  const names: string[] = [];
  const base = () => `/api/productions/${t.demoProductionId}`;

  beforeAll(async () => {
    const ids: number[] = [];
    for (let i = 0; i < MANY - 1; i++) {
      const r = await camera.post(`${base()}/swatches`).send({ name: stepName(i), origin: { type: 'colour', colour: { space: 'hex', hex: stepHex(i) } } });
      expect(r.status).toBe(201);
      ids.push(r.body.swatch.id);
      names.push(stepName(i));
    }
    const blood = await camera.post(`${base()}/swatches`).send({ name: BLOOD.name, origin: { type: 'colour', colour: { space: 'hex', hex: BLOOD.hex } } });
    expect(blood.status).toBe(201);
    ids.push(blood.body.swatch.id);
    names.push(BLOOD.name);
    const board = await camera.post(`${base()}/boards`).send({ name: 'Long ramp', lookIds: [lookId], swatchIds: ids });
    expect(board.status).toBe(201);
    boardId = board.body.board.id;
    // a look made now, which no board shows yet
    const fresh = await camera.post(`${base()}/looks`).send({ name: 'Made this morning', light: { source: { id: 'tungsten-3200' } }, medium: { source: { id: 'panchromatic' } } });
    expect(fresh.status).toBe(201);
    freshLookId = fresh.body.look.id;
  });

  it('the JSON lists every swatch of a board of more than 30, lightest to darkest, the darkest flagged', async () => {
    const r = await lab.get(`${base()}/looks/${lookId}/sheet`);
    expect(r.status).toBe(200);
    const s = r.body.sheet as ExposureSheet;
    expect(s.swatches.length).toBe(MANY);
    expect(s.swatches.map((w) => w.name).sort()).toEqual([...names].sort());
    expect(s).not.toHaveProperty('swatchesLeftOff');
    for (let i = 1; i < s.swatches.length; i++) expect(s.swatches[i].stops).toBeLessThanOrEqual(s.swatches[i - 1].stops);
    // the flags follow the thresholds in force
    const shadow = -s.thresholds.shadowDetailStops;
    for (const w of s.swatches) {
      expect(w.lost).toBe(w.stops < shadow);
      if (w.lost) expect(w.flag).toBe('lost');
      else if (w.blown) expect(w.flag).toBe('blown');
      else if (w.stops < shadow + NEAR_THRESHOLD_STOPS) expect(w.flag).toBe('near-lost');
    }
    expect(s.swatches.at(-1)!.flag).toBe('lost'); // black is under every medium's shadow-detail threshold
    expect(s.boards).toContain('Long ramp');
    expect(s.boardsPicked).toBe(false);
    expect(s.boardChoices.find((b) => b.id === boardId)).toMatchObject({ name: 'Long ramp', swatchCount: MANY, showsLook: true, onSheet: true });
  });

  it('the PDF of one look lists every swatch, over pages with the table header on each, the threshold drawn', async () => {
    const r = await getBytes(lab, `${base()}/looks/${lookId}/sheet.pdf`);
    expect(r.status).toBe(200);
    const pages = pdfPages(r.body as Buffer, 'sheet-36-swatches');
    expect(pages.length).toBeGreaterThanOrEqual(2);
    const text = pages.join('\n');
    for (const n of names) expect(text).toContain(n);
    expect(text).toContain('Shadow-detail threshold');
    expect(text).toContain('texture lost');
    expect(text).toMatch(new RegExp(`${MANY} swatches, every one on the boards`));
    // every page that carries a swatch row carries the table header too
    const withRows = pages.filter((p) => names.some((n) => p.includes(n)));
    expect(withRows.length).toBeGreaterThanOrEqual(2);
    for (const p of withRows) expect(p).toMatch(/Colour · grey\s+Swatch\s+Board/);
    pages.forEach((p, i) => expect(p).toContain(`Page ${i + 1} of ${pages.length}`));
  });

  it('a newly made look shows on no board, and the sheet lists the boards picked with ?boards=', async () => {
    const plain = (await lab.get(`${base()}/looks/${freshLookId}/sheet`)).body.sheet as ExposureSheet;
    expect(plain.swatches).toEqual([]);
    expect(plain.boardsPicked).toBe(false);
    const choice = plain.boardChoices.find((b) => b.id === boardId)!;
    expect(choice).toMatchObject({ showsLook: false, onSheet: false, swatchCount: MANY });

    const picked = await lab.get(`${base()}/looks/${freshLookId}/sheet?boards=${boardId}`);
    expect(picked.status).toBe(200);
    const s = picked.body.sheet as ExposureSheet;
    expect(s.swatches.length).toBe(MANY);
    expect(s.boardsPicked).toBe(true);
    expect(s.boards).toEqual(['Long ramp']);
    expect(s.boardChoices.find((b) => b.id === boardId)).toMatchObject({ showsLook: false, onSheet: true });

    const pdf = await getBytes(lab, `${base()}/looks/${freshLookId}/sheet.pdf?boards=${boardId}`);
    expect(pdf.status).toBe(200);
    expect(pdfText(pdf.body as Buffer)).toContain(BLOOD.name);
  });

  it('?boards= answers 400 naming boards for a board of another production or a bad list', async () => {
    for (const q of ['999999', `${boardId},999999`, 'abc', '1;2']) {
      const r = await lab.get(`${base()}/looks/${lookId}/sheet?boards=${encodeURIComponent(q)}`);
      expect(r.status).toBe(400);
      expect(r.body.error.field).toBe('boards');
      expect(r.body.error.message).toMatch(/^boards: /);
    }
  });

  it('GET …/sheets.pdf?looks= gives the sheets of several looks, each starting on a new page', async () => {
    const looks = [lookId, freshLookId];
    const r = await getBytes(lab, `${base()}/sheets.pdf?looks=${looks.join(',')}`);
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/^application\/pdf/);
    expect(r.headers['content-disposition']).toMatch(/attachment; filename="exposure-sheets-the-clockmakers-winter-2-looks\.pdf"/);
    const pages = pdfPages(r.body as Buffer, 'sheets-of-the-day');
    expect(pages.length).toBeGreaterThanOrEqual(looks.length);
    // a sheet starts where its heading is; each look's starts on a page of its own, in the order asked
    const starts = pages.flatMap((p, i) => (p.includes('EXPOSURE SHEET') ? [i] : []));
    expect(starts.length).toBe(looks.length);
    expect(pages[starts[0]]).toContain(LOOK_NAME);
    expect(pages[starts[1]]).toContain('Made this morning');
    // nothing of the first sheet's table runs on (the light budget chart names every look, so the names of the
    // first sheet's swatches mark it)
    for (const n of names) expect(pages[starts[1]]).not.toContain(n);
    expect(starts[1]).toBeGreaterThan(starts[0]);
    // the first look's long table is complete before the second begins
    const first = pages.slice(0, starts[1]).join('\n');
    for (const n of names) expect(first).toContain(n);
    expect(pages[starts[1] - 1]).toContain(`Sheet 1 of ${looks.length}`);
    expect(pages.at(-1)).toContain(`Sheet ${looks.length} of ${looks.length}`);
  });

  it('GET …/sheets.pdf answers 400 naming looks when a look is missing, not in the production, or not an id', async () => {
    for (const q of ['', '?looks=', '?looks=abc', `?looks=${lookId},${strangerLookId}`, '?looks=999999', `?looks=${Array.from({ length: 25 }, (_, i) => i + 1).join(',')}`]) {
      const r = await lab.get(`${base()}/sheets.pdf${q}`);
      expect(r.status, q).toBe(400);
      expect(r.body.error.field).toBe('looks');
      expect(r.body.error.message).toMatch(/^looks: /);
    }
    const r = await lab.get(`${base()}/sheets.pdf?looks=${lookId},${strangerLookId}`);
    expect(r.body.error.message).toContain(String(strangerLookId));
  });

  it('GET …/sheets.pdf answers 401 without a session', async () => {
    const anon = await t.agent();
    expect((await anon.get(`${base()}/sheets.pdf?looks=${lookId}`)).status).toBe(401);
  });
});
