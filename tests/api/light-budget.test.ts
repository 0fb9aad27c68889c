import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LooksService } from '../../server/modules/looks/looks.service';
import { renderSheetPdf } from '../../server/modules/sheets/sheets-pdf';
import { startTestApp, type Agent, type TestApp } from '../helpers/api';
import type { LightBudgetAnswer, LookView } from '../../shared/schemas/look';
import type { ExposureSheet } from '../../shared/schemas/sheet';

/** Shared default tolerance for this file (relative). */
const TOL = 1e-9;
/** Optical density 0.3 passes 10^−0.3 at every wavelength (definition of optical density): twice the light, to 0.997 stop. */
const ND03_FACTOR = 10 ** 0.3;
/** As the meter is set: EI 250 → 125 (the ISO third-stop label of 125.3), twice the light. */
const ND03_RATIO = 2;
/** 1 fc = 10.7639 lux (definition: 1 lm/ft², 1 ft = 0.3048 m); six figures. */
const LUX_PER_FC = 10.7639;
const LUX_PER_FC_FIGURES = 1e-5;
/** ISO 2720 by hand at the panchromatic box speed 250 (the demo medium's model value), T2.8, 1/48 s: 250 · 2.8² · 48 / 250 = 376.32 lux. */
const LUX_T28_EI250 = 376.32;
/** The same at T4: 250 · 4² · 48 / 250 = 768 lux. */
const LUX_T4_EI250 = 768;

let t: TestApp;
let camera: Agent;
let producer: Agent;
let looks: LookView[];
let ndLookId: number;
let eyeLookId: number;
let strangerLookId: number;
const url = () => `/api/productions/${t.demoProductionId}/looks/light-budget`;
const rel = (x: number, y: number) => Math.abs(x / y - 1);
const byName = (name: string) => looks.find((l) => l.name === name)!;

beforeAll(async () => {
  t = await startTestApp();
  camera = await t.agent('camera@demo.grisaille.test');
  producer = await t.agent('producer@demo.grisaille.test');
  const pid = t.demoProductionId;
  const nd = await camera.post(`/api/productions/${pid}/looks`).send({
    name: 'Panchromatic, ND 0.3',
    light: { source: { id: 'tungsten-3200' } },
    filters: [{ filter: { source: { id: 'nd-0.3' } }, on: 'lens' }],
    medium: { source: { id: 'panchromatic' } },
  });
  expect(nd.status).toBe(201);
  ndLookId = nd.body.look.id;
  const eye = await camera.post(`/api/productions/${pid}/looks`).send({ name: 'By eye', light: { source: { id: 'tungsten-3200' } }, medium: { source: { id: 'eye' } } });
  expect(eye.status).toBe(201);
  eyeLookId = eye.body.look.id;
  const other = await camera.post('/api/productions').send({ name: 'Another production' });
  const otherLook = await camera.post(`/api/productions/${other.body.production.id}/looks`).send({ name: 'Stranger', light: { source: { id: 'd65' } }, medium: { source: { id: 'panchromatic' } } });
  expect(otherLook.status).toBe(201);
  strangerLookId = otherLook.body.look.id;
  looks = (await camera.get(`/api/productions/${pid}/looks`)).body.looks;
});
afterAll(async () => {
  await t.close();
});

describe('POST …/looks/light-budget', () => {
  it('a viewer gets every look in the order asked, the first at 1, with EI, lux and foot-candles', async () => {
    const ids = [byName('Panchromatic, no filter').id, byName('Orthochromatic').id, byName('Panchromatic + red-absorbing cyan').id, byName('Daylight exterior, yellow').id];
    const r = await producer.post(url()).send({ lookIds: ids });
    expect(r.status).toBe(200);
    const b = r.body as LightBudgetAnswer;
    expect(b.looks.map((l) => l.lookId)).toEqual(ids);
    for (const l of b.looks) {
      expect(Object.keys(l)).toEqual(expect.arrayContaining(['lookId', 'effectiveEI', 'lux', 'footcandles', 'relative']));
      expect(rel(l.lux! / l.footcandles!, LUX_PER_FC)).toBeLessThan(LUX_PER_FC_FIGURES);
      // the ratio of the effective EIs, so of the levels the gaffer lights to; and before the labels, of the exact EIs
      expect(rel(l.relative!, b.looks[0].effectiveEI! / l.effectiveEI!)).toBeLessThan(TOL);
      expect(rel(l.relative!, l.lux! / b.looks[0].lux!)).toBeLessThan(TOL);
      expect(rel(l.relative!, 2 ** l.stops!)).toBeLessThan(TOL);
      expect(rel(l.exactRelative!, b.looks[0].exactEI! / l.exactEI!)).toBeLessThan(TOL);
    }
    expect(b.looks[0].relative).toBe(1);
    expect(b.looks[0].effectiveEI).toBe(250);
    expect(rel(b.looks[0].lux!, LUX_T28_EI250)).toBeLessThan(TOL);
    // a filter or a slower medium costs light
    for (const l of b.looks.slice(1)) expect(l.relative!).toBeGreaterThan(1);
    expect(b.camera).toMatchObject({ tStop: 2.8, fps: 24, shutterAngle: 180, calibrationConstant: 250, defaultsFrom: { lookId: ids[0], name: 'Panchromatic, no filter' } });
    expect(b.camera.defaulted).toEqual(['tStop', 'fps', 'shutterAngle', 'calibrationConstant']);
  });

  it('a look is its sheet: same effective EI and the same level at its T-stop', async () => {
    const id = byName('Orthochromatic').id;
    const r = await producer.post(url()).send({ lookIds: [byName('Panchromatic, no filter').id, id] });
    const sheet = (await producer.get(`/api/productions/${t.demoProductionId}/looks/${id}/sheet`)).body.sheet as ExposureSheet;
    const row = sheet.lightLevels.find((x) => x.tStop === sheet.camera.tStop)!;
    expect(r.body.looks[1].effectiveEI).toBe(sheet.chain!.effectiveEI);
    expect(rel(r.body.looks[1].lux, row.lux)).toBeLessThan(TOL);
  });

  it('an ND 0.3 on the same light and medium needs twice the light', async () => {
    const r = await producer.post(url()).send({ lookIds: [byName('Panchromatic, no filter').id, ndLookId] });
    expect(r.status).toBe(200);
    expect(r.body.looks[1].effectiveEI).toBe(125);
    expect(rel(r.body.looks[1].relative, ND03_RATIO)).toBeLessThan(TOL);
    expect(rel(r.body.looks[1].exactRelative, ND03_FACTOR)).toBeLessThan(TOL);
  });

  it('takes the camera from the request', async () => {
    const r = await producer.post(url()).send({ lookIds: [byName('Panchromatic, no filter').id], tStop: 4 });
    expect(r.status).toBe(200);
    expect(rel(r.body.looks[0].lux, LUX_T4_EI250)).toBeLessThan(TOL);
    expect(r.body.camera.defaulted).toEqual(['fps', 'shutterAngle', 'calibrationConstant']);
  });

  it('the reference may be any look; relative is then against it', async () => {
    const [a, b] = [byName('Panchromatic, no filter').id, byName('Orthochromatic').id];
    const ab = (await producer.post(url()).send({ lookIds: [a, b] })).body as LightBudgetAnswer;
    const ba = (await producer.post(url()).send({ lookIds: [b, a] })).body as LightBudgetAnswer;
    expect(rel(ab.looks[1].relative! * ba.looks[1].relative!, 1)).toBeLessThan(TOL);
  });

  it('a look on the eye has no figures; a first look on the eye is a 400 on lookIds', async () => {
    const ok = await producer.post(url()).send({ lookIds: [byName('Panchromatic, no filter').id, eyeLookId] });
    expect(ok.status).toBe(200);
    expect(ok.body.looks[1]).toMatchObject({ lookId: eyeLookId, effectiveEI: null, lux: null, relative: null });
    const bad = await producer.post(url()).send({ lookIds: [eyeLookId] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('lookIds');
  });

  it('answers 400 naming lookIds for looks not in the production, repeats, an empty list or no list', async () => {
    const first = byName('Panchromatic, no filter').id;
    for (const body of [{ lookIds: [first, strangerLookId] }, { lookIds: [first, 999_999] }, { lookIds: [first, first] }, { lookIds: [] }, {}, { lookIds: ['x'] }]) {
      const r = await producer.post(url()).send(body);
      expect(r.status, JSON.stringify(body)).toBe(400);
      expect(r.body.error.field, JSON.stringify(body)).toMatch(/^lookIds/);
    }
    const stranger = await producer.post(url()).send({ lookIds: [first, strangerLookId] });
    expect(stranger.body.error.message).toContain(String(strangerLookId));
  });

  it('answers 400 for a camera out of range or an unknown field', async () => {
    const first = byName('Panchromatic, no filter').id;
    expect((await producer.post(url()).send({ lookIds: [first], shutterAngle: 400 })).body.error.field).toBe('shutterAngle');
    expect((await producer.post(url()).send({ lookIds: [first], fps: 0 })).status).toBe(400);
    expect((await producer.post(url()).send({ lookIds: [first], colour: 1 })).body.error.field).toBe('colour');
  });

  it('is not read as a look id by the /looks/:lookId routes, and needs a member', async () => {
    const anon = await t.agent();
    expect((await anon.post(url()).send({ lookIds: [1] })).status).toBe(401);
    expect((await producer.get(`/api/productions/${t.demoProductionId}/looks/light-budget`)).status).toBe(404);
  });
});

describe('the sheet\'s light budget', () => {
  it('lists every look of the production in id order at the sheet look\'s camera, and the PDF draws it', async () => {
    const id = byName('Orthochromatic').id;
    const svc = new LooksService(t.ctx.ds, t.dataDir);
    const b = await svc.sheetLightBudget(t.demoProductionId, id);
    expect(b.looks.map((l) => l.lookId)).toEqual(looks.map((l) => l.id));
    expect(b.camera.defaulted).toEqual(['calibrationConstant']);
    const sheet = (await producer.get(`/api/productions/${t.demoProductionId}/looks/${id}/sheet`)).body.sheet as ExposureSheet;
    const pdf = await renderSheetPdf({ ...sheet, lightBudget: b } as ExposureSheet);
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-budget-'));
    const file = path.join(dir, 'sheet.pdf');
    fs.writeFileSync(file, pdf);
    const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
    const ortho = b.looks.find((l) => l.lookId === id)!;
    expect(text).toMatch(/L\s*I\s*G\s*H\s*T\s*B\s*U\s*D\s*G\s*E\s*T/); // the heading is letter-spaced
    expect(text).toContain(`This look needs ${Number(ortho.relative!.toPrecision(2))}× the light of Panchromatic, no filter.`);
    if (process.env.LIGHT_BUDGET_PDF_PNG) execFileSync('pdftoppm', ['-png', '-r', '80', '-f', '1', '-l', '2', file, process.env.LIGHT_BUDGET_PDF_PNG]);
    fs.rmSync(dir, { recursive: true, force: true });
  });
});
