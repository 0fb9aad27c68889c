/**
 * Swatches: from a colour (hex, RGB, L*a*b*) or a measured file; department rules for contributors; bad
 * input with nothing written; the tones of one swatch through every look.
 */
import { GRID_SIZE } from '../../shared/spectral/policy';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoAs, type Agent, type TestApp } from '../helpers/api';
import { Swatch } from '../../server/db/entities/swatch.entity';

/** Default tolerance of this file, stops. */
const TOL_STOPS = 1e-6;
/** Middle grey: 18 % reflectance reads 0 stops, zone V, through any look (DESIGN.md §3; zone system, common practice). */
const MIDDLE_GREY = 0.18;
const ZONE_V = 5;
/** sRGB #ff0000 is L*a*b* about (53.24, 80.09, 67.20) under D65 (culori 4.0.2, lab65). */
const RED_LAB: [number, number, number] = [53.24, 80.09, 67.2];
const RED_HEX = '#ff0000';

let t: TestApp;
let makeup: Agent;
let costume: Agent;
let editor: Agent;
let viewer: Agent;
let base: string;
const count = () => t.ctx.ds.getRepository(Swatch).count();
const hexSwatch = (name: string, hex: string, department?: string) => ({ name, ...(department ? { department } : {}), origin: { type: 'colour', colour: { space: 'hex', hex } } });

beforeAll(async () => {
  ({ t, base, as: { makeup, costume, editor, viewer } } = await startDemoAs({ makeup: 'makeup', costume: 'costume', editor: 'gaffer', viewer: 'producer' }));
});
afterAll(async () => t?.close());

describe('the makeup member adds a lip colour and sees its zone through each look', () => {
  let id = 0;
  it('adds it by hex, in the makeup department, with an estimated spectrum', async () => {
    const r = await makeup.post(`${base}/swatches`).send(hexSwatch('Lip colour, test red', '#9e2b35'));
    expect(r.status).toBe(201);
    id = r.body.swatch.id;
    expect(r.body.swatch).toMatchObject({ department: 'makeup', hex: '#9e2b35', spectrum: 'estimated' });
    expect(r.body.swatch.reflectance).toHaveLength(GRID_SIZE);
  });

  it('reads darker through the red-absorbing cyan than without it (a red absorbs what the cyan passes)', async () => {
    const r = await viewer.get(`${base}/swatches/${id}/tones`);
    expect(r.status).toBe(200);
    const by = Object.fromEntries(r.body.looks.map((l: { lookName: string; tones: unknown[] }) => [l.lookName, l.tones[0]]));
    const plain = by['Panchromatic, no filter'];
    const cyan = by['Panchromatic + red-absorbing cyan'];
    const ortho = by['Orthochromatic'];
    // physics: the cyan absorbs red, so a red surface loses exposure relative to a neutral; a red-blind emulsion likewise
    expect(cyan.stops).toBeLessThan(plain.stops - 1);
    expect(ortho.stops).toBeLessThan(plain.stops - 1);
    expect(cyan.zone).toBeCloseTo(ZONE_V + cyan.stops, 9);
    expect(cyan.shift).toBeCloseTo(cyan.stops - cyan.eyeStops, 9);
    expect(cyan.numeral).not.toBe(plain.numeral);
  });
});

describe('colours and measured files', () => {
  it('takes RGB 0–255 and L*a*b*', async () => {
    const a = await makeup.post(`${base}/swatches`).send({ name: 'Red by RGB', origin: { type: 'colour', colour: { space: 'rgb', rgb: [255, 0, 0] } } });
    expect(a.body.swatch.hex).toBe(RED_HEX);
    const b = await makeup.post(`${base}/swatches`).send({ name: 'Red by Lab', origin: { type: 'colour', colour: { space: 'lab', lab: RED_LAB } } });
    expect(b.status).toBe(201);
    expect(b.body.swatch.hex).toBe(RED_HEX);
  });

  it('a measured flat 18 % card is zone V with no shift through every look (a neutral keeps its stops through any filter)', async () => {
    const text = 'Wavelength;Reflectance (%)\n' + Array.from({ length: 41 }, (_, i) => `${380 + 10 * i};18,0`).join('\n');
    const r = await makeup.post(`${base}/swatches`).send({ name: 'Grey card (test)', origin: { type: 'measured', basis: 'percent', table: { text, fileName: 'card.csv' } } });
    expect(r.status).toBe(201);
    expect(r.body.swatch.spectrum).toBe('measured');
    expect(r.body.swatch.origin).toMatchObject({ type: 'measured', basis: 'percent', fileName: 'card.csv', points: 41 });
    expect(Math.abs(r.body.swatch.reflectance[40][1] - MIDDLE_GREY)).toBeLessThan(TOL_STOPS);
    const tones = (await viewer.get(`${base}/swatches/${r.body.swatch.id}/tones`)).body.looks;
    expect(tones.length).toBeGreaterThanOrEqual(3);
    for (const l of tones) {
      expect(Math.abs(l.tones[0].stops)).toBeLessThan(TOL_STOPS);
      expect(Math.abs(l.tones[0].shift)).toBeLessThan(TOL_STOPS);
      expect(l.tones[0].numeral).toBe('V');
    }
  });
});

describe('departments and roles', () => {
  it('a contributor cannot add to, change or delete another department’s swatches', async () => {
    const n = await count();
    expect((await makeup.post(`${base}/swatches`).send(hexSwatch('Not mine', '#123456', 'costume'))).status).toBe(403);
    expect(await count()).toBe(n);
    const fabric = (await viewer.get(`${base}/swatches`)).body.swatches.find((s: { department: string }) => s.department === 'costume');
    expect((await makeup.patch(`${base}/swatches/${fabric.id}`).send({ name: 'x' })).status).toBe(403);
    expect((await makeup.delete(`${base}/swatches/${fabric.id}`)).status).toBe(403);
    const mine = (await costume.patch(`${base}/swatches/${fabric.id}`).send({ notes: 'checked' })).body.swatch;
    expect(mine.notes).toBe('checked');
    expect((await costume.patch(`${base}/swatches/${fabric.id}`).send({ department: 'makeup' })).status).toBe(403);
  });

  it('an editor files swatches under any department; a viewer adds none', async () => {
    const r = await editor.post(`${base}/swatches`).send(hexSwatch('Gaffer’s test card', '#808080', 'art'));
    expect(r.status).toBe(201);
    expect(r.body.swatch.department).toBe('art');
    expect((await viewer.post(`${base}/swatches`).send(hexSwatch('x', '#808080'))).status).toBe(403);
  });

  it('changes its colour and deletes it (and it leaves the boards)', async () => {
    const s = (await makeup.post(`${base}/swatches`).send(hexSwatch('To delete', '#aa3344'))).body.swatch;
    const board = (await viewer.get(`${base}/boards`)).body.boards.find((b: { department: string }) => b.department === 'makeup');
    expect((await makeup.patch(`${base}/boards/${board.id}`).send({ swatchIds: [...board.swatchIds, s.id] })).status).toBe(200);
    const u = await makeup.patch(`${base}/swatches/${s.id}`).send({ origin: { type: 'colour', colour: { space: 'hex', hex: '#AA3355' } } });
    expect(u.body.swatch.hex).toBe('#aa3355');
    expect((await makeup.delete(`${base}/swatches/${s.id}`)).status).toBe(204);
    expect((await viewer.get(`${base}/swatches/${s.id}`)).status).toBe(404);
    expect((await viewer.get(`${base}/boards/${board.id}`)).body.board.swatchIds).not.toContain(s.id);
  });
});

describe('bad input writes nothing', () => {
  const cases: [string, object, string, RegExp?][] = [
    ['no name', { origin: { type: 'colour', colour: { space: 'hex', hex: '#112233' } } }, 'name'],
    ['a malformed hex', hexSwatch('x', '#12345g'), 'origin.colour.hex'],
    ['RGB above 255', { name: 'x', origin: { type: 'colour', colour: { space: 'rgb', rgb: [300, 0, 0] } } }, 'origin.colour.rgb.0'],
    ['L*a*b* outside the sRGB gamut', { name: 'x', origin: { type: 'colour', colour: { space: 'lab', lab: [50, 120, -120] } } }, 'origin.colour.lab', /outside the sRGB gamut/],
    ['a measured file with a bad line', { name: 'x', origin: { type: 'measured', basis: 'fraction', table: { text: '400,0.2\n550,abc\n700,0.3' } } }, 'origin.table.text', /^line 2: the value "abc" at 550 nm is not a number$/],
    ['reflectance in percent sent as a fraction', { name: 'x', origin: { type: 'measured', basis: 'fraction', table: { text: '400,20\n550,30\n700,40' } } }, 'origin.table.text', /^line 1: the reflectance at 400 nm is above 1\.5/],
    ['both file text and samples', { name: 'x', origin: { type: 'measured', basis: 'fraction', table: { text: '400,0.2', samples: [[400, 0.2], [550, 0.2], [700, 0.2]] } } }, 'origin.table.text'],
  ];
  it.each(cases)('%s → 400 naming the field', async (_l, body, field, message) => {
    const n = await count();
    const r = await makeup.post(`${base}/swatches`).send(body);
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe(field);
    if (message) expect(r.body.error.message).toMatch(message);
    expect(await count()).toBe(n);
  });
});

describe('deleting a key swatch', () => {
  it('puts the looks keyed on it back on middle grey, so they stay editable', async () => {
    const owner = await t.agent('camera@demo.grisaille.test');
    const s = await owner.post(`${base}/swatches`).send(hexSwatch('Key face, temporary', '#c89a80', 'makeup'));
    const looks = (await owner.get(`${base}/looks`)).body.looks as { id: number }[];
    const look = (await owner.get(`${base}/looks/${looks[0].id}`)).body.look;
    const keyed = await owner.patch(`${base}/looks/${look.id}`).send({ tone: { ...look.tone, keySwatchId: s.body.swatch.id, keyZone: 6 } });
    expect(keyed.status).toBe(200);
    expect((await owner.delete(`${base}/swatches/${s.body.swatch.id}`)).status).toBe(204);
    const after = (await owner.get(`${base}/looks/${look.id}`)).body.look;
    expect(after.tone.keySwatchId).toBeNull();
    expect((await owner.patch(`${base}/looks/${look.id}`).send({ name: after.name })).status).toBe(200);
  });
});
