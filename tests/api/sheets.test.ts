import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type Agent, type TestApp } from '../helpers/api';
import type { ExposureSheet } from '../../shared/schemas/sheet';

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
