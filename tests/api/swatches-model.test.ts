/**
 * Stored skin and makeup swatches (parameters kept, reflectance and hex recomputed on edit), duplicating a
 * swatch (the department rule), editing a colour swatch's colour, a surface's own light (`lightStops`:
 * tones, ranges, flags and merges move by it) and the demo's modelled makeup board.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoAs, type Agent, type TestApp } from '../helpers/api';
import { Swatch } from '../../server/db/entities/swatch.entity';
import { GRID_SIZE } from '../../shared/spectral/policy';
import { spectrumFromStoredPairs } from '../../shared/spectral/spectrum';
import { hexOfReflectance } from '../../server/modules/swatches/swatch-colour';
import { NEGATIVE_HIGHLIGHT_ROLL_OFF_STOPS } from '../../shared/tone/media-tone';
import type { LookTones } from '../../shared/schemas/board';

/** Default tolerance of this file, stops (floating point only: the light moves tones by exact stops). */
const TOL = 1e-9;
/** Calm light skin: melanin 3 %, blood 2 %, saturation 0.75 (shared/spectral/skin-presets.ts CALM_SKIN). */
const CALM = { melanin: 0.03, blood: 0.02, oxygenation: 0.75 };
/** A flat 18 % reflectance: a neutral measured grey card. */
const GREY_CARD: [number, number][] = [[380, 0.18], [550, 0.18], [780, 0.18]];
/** A flat 90 % reflectance: a white wall. */
const WHITE: [number, number][] = [[380, 0.9], [550, 0.9], [780, 0.9]];

let t: TestApp;
let makeup: Agent;
let costume: Agent;
let viewer: Agent;
let base: string;
const count = () => t.ctx.ds.getRepository(Swatch).count();
const measured = (name: string, samples: [number, number][], lightStops?: number) => ({ name, ...(lightStops !== undefined ? { lightStops } : {}), origin: { type: 'measured', basis: 'fraction', table: { samples } } });
const tonesOf = async (id: number): Promise<LookTones[]> => (await viewer.get(`${base}/swatches/${id}/tones`)).body.looks;
const d65Hex = (pairs: [number, number][]) => hexOfReflectance(spectrumFromStoredPairs(pairs, 'hold'));

beforeAll(async () => {
  ({ t, base, as: { makeup, costume, viewer } } = await startDemoAs({ makeup: 'makeup', costume: 'costume', viewer: 'producer' }));
});
afterAll(async () => t?.close());

describe('skin swatches', () => {
  let id = 0;
  let first: { hex: string; reflectance: [number, number][] };
  it('are created from the model: parameters kept, the model reflectance stored, its D65 colour as hex', async () => {
    const r = await makeup.post(`${base}/swatches`).send({ name: 'Calm cheek', origin: { type: 'skin', skin: CALM } });
    expect(r.status).toBe(201);
    id = r.body.swatch.id;
    first = r.body.swatch;
    expect(r.body.swatch).toMatchObject({ department: 'makeup', spectrum: 'modelled', lightStops: 0, origin: { type: 'skin', skin: CALM } });
    expect(r.body.swatch.reflectance).toHaveLength(GRID_SIZE);
    expect(r.body.swatch.hex).toBe(d65Hex(r.body.swatch.reflectance));
    const g = await viewer.get(`${base}/swatches/${id}`);
    expect(g.body.swatch).toMatchObject({ origin: { type: 'skin', skin: CALM }, hex: first.hex, spectrum: 'modelled' });
  });

  it('are not estimated: their tones have a zero-width range', async () => {
    for (const l of await tonesOf(id)) {
      const [tone] = l.tones;
      expect(tone.range.possible[0]).toBeCloseTo(tone.range.possible[1], 12);
      expect(tone.range.plausible[1] - tone.range.plausible[0]).toBeLessThan(TOL);
    }
  });

  it('are edited: new parameters recompute the reflectance and the hex', async () => {
    const flushed = { ...CALM, blood: 0.08 };
    const r = await makeup.patch(`${base}/swatches/${id}`).send({ origin: { type: 'skin', skin: flushed } });
    expect(r.status).toBe(200);
    expect(r.body.swatch.origin).toEqual({ type: 'skin', skin: flushed });
    expect(r.body.swatch.reflectance).not.toEqual(first.reflectance);
    expect(r.body.swatch.hex).not.toBe(first.hex);
    expect(r.body.swatch.hex).toBe(d65Hex(r.body.swatch.reflectance));
    // more blood absorbs more green: the flushed cheek reflects less at 577 nm (an oxy-haemoglobin Q band)
    const at = (p: [number, number][], nm: number) => p.find(([x]) => x === nm)![1];
    expect(at(r.body.swatch.reflectance, 577)).toBeLessThan(at(first.reflectance, 577));
  });
});

describe('makeup swatches', () => {
  it('a colour paint over skin: kept, modelled, estimated (its tones have a range); coverage edits recompute it', async () => {
    const makeupOf = (coverage: number) => ({ over: { skin: CALM }, colour: '#a33b4a', coverage });
    const r = await makeup.post(`${base}/swatches`).send({ name: 'Lip colour on the lip', origin: { type: 'makeup', makeup: makeupOf(0.5) } });
    expect(r.status).toBe(201);
    expect(r.body.swatch).toMatchObject({ spectrum: 'modelled', origin: { type: 'makeup', makeup: makeupOf(0.5) } });
    expect(r.body.swatch.hex).toBe(d65Hex(r.body.swatch.reflectance));
    const widths = (await tonesOf(r.body.swatch.id)).map((l) => l.tones[0].range.possible[1] - l.tones[0].range.possible[0]);
    expect(Math.max(...widths)).toBeGreaterThan(0.01);
    const u = await makeup.patch(`${base}/swatches/${r.body.swatch.id}`).send({ origin: { type: 'makeup', makeup: makeupOf(0.9) } });
    expect(u.status).toBe(200);
    expect(u.body.swatch.origin.makeup.coverage).toBe(0.9);
    expect(u.body.swatch.hex).not.toBe(r.body.swatch.hex);
    expect(u.body.swatch.hex).toBe(d65Hex(u.body.swatch.reflectance));
  });

  it('a modelled paint (stage blood) over skin is not estimated', async () => {
    const r = await makeup.post(`${base}/swatches`).send({ name: 'Blood on skin', origin: { type: 'makeup', makeup: { over: { skin: CALM }, colour: { skin: { melanin: 0, blood: 0.3, oxygenation: 1 } }, coverage: 0.9 } } });
    expect(r.status).toBe(201);
    for (const l of await tonesOf(r.body.swatch.id)) expect(l.tones[0].range.possible[1] - l.tones[0].range.possible[0]).toBeLessThan(TOL);
  });

  it('bad parameters are a 400 naming the field, with nothing written', async () => {
    const n = await count();
    const r = await makeup.post(`${base}/swatches`).send({ name: 'x', origin: { type: 'makeup', makeup: { over: { skin: CALM }, colour: '#a33b4a', coverage: 1.5 } } });
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe('origin.makeup.coverage');
    expect(await count()).toBe(n);
  });
});

describe('duplicating and editing', () => {
  it('duplicates a swatch as "<name> (copy)": origin, colour, reflectance, notes and light kept', async () => {
    const s = (await makeup.post(`${base}/swatches`).send({ name: 'Base, to copy', notes: 'n', lightStops: -1, origin: { type: 'skin', skin: CALM } })).body.swatch;
    const r = await makeup.post(`${base}/swatches/${s.id}/duplicate`);
    expect(r.status).toBe(201);
    expect(r.body.swatch.id).not.toBe(s.id);
    expect(r.body.swatch).toMatchObject({ name: 'Base, to copy (copy)', department: 'makeup', notes: 'n', lightStops: -1, hex: s.hex, origin: s.origin, spectrum: 'modelled' });
    expect(r.body.swatch.reflectance).toEqual(s.reflectance);
    const long = (await makeup.post(`${base}/swatches`).send({ name: 'x'.repeat(120), origin: { type: 'colour', colour: { space: 'hex', hex: '#808080' } } })).body.swatch;
    const c = await makeup.post(`${base}/swatches/${long.id}/duplicate`);
    expect(c.body.swatch.name).toHaveLength(120);
    expect(c.body.swatch.name.endsWith(' (copy)')).toBe(true);
  });

  it('the department rule applies: a contributor of another department gets 403; an unknown swatch 404', async () => {
    const s = (await makeup.post(`${base}/swatches`).send({ name: 'Makeup only', origin: { type: 'colour', colour: { space: 'hex', hex: '#aa3344' } } })).body.swatch;
    const n = await count();
    expect((await costume.post(`${base}/swatches/${s.id}/duplicate`)).status).toBe(403);
    expect((await viewer.post(`${base}/swatches/${s.id}/duplicate`)).status).toBe(403);
    expect((await makeup.post(`${base}/swatches/999999/duplicate`)).status).toBe(404);
    expect(await count()).toBe(n);
  });

  it('PATCH edits name, notes, department and colour; a new colour is re-estimated', async () => {
    const s = (await makeup.get(`${base}/swatches?spectra=1`)).body.swatches.find((x: { name: string }) => x.name === 'Makeup only');
    const r = await makeup.patch(`${base}/swatches/${s.id}`).send({ name: 'Renamed', notes: 'edited', origin: { type: 'colour', colour: { space: 'rgb', rgb: [40, 90, 160] } } });
    expect(r.status).toBe(200);
    expect(r.body.swatch).toMatchObject({ name: 'Renamed', notes: 'edited', hex: '#285aa0', spectrum: 'estimated' });
    expect(r.body.swatch.reflectance).not.toEqual(s.reflectance);
  });
});

describe("a surface's own light", () => {
  it('moves a neutral measured swatch’s tones by exactly that many stops (medium, eye, range, zone)', async () => {
    const a = (await makeup.post(`${base}/swatches`).send(measured('Grey card at key', GREY_CARD))).body.swatch;
    const b = (await makeup.post(`${base}/swatches/${a.id}/duplicate`)).body.swatch;
    const p = await makeup.patch(`${base}/swatches/${b.id}`).send({ lightStops: 1.5 });
    expect(p.body.swatch.lightStops).toBe(1.5);
    const [ta, tb] = [await tonesOf(a.id), await tonesOf(b.id)];
    expect(ta.length).toBeGreaterThan(0);
    ta.forEach((l, i) => {
      const [x, y] = [l.tones[0], tb[i].tones[0]];
      expect(y.stops - x.stops).toBeCloseTo(1.5, 9);
      expect(y.eyeStops - x.eyeStops).toBeCloseTo(1.5, 9);
      expect(y.zone - x.zone).toBeCloseTo(1.5, 9);
      expect(y.range.possible[0] - x.range.possible[0]).toBeCloseTo(1.5, 9);
      expect(y.range.plausible[1] - x.range.plausible[1]).toBeCloseTo(1.5, 9);
      expect(y.grey).toBeGreaterThan(x.grey);
    });
  });

  it('flags a white lit four stops hot as blown, by the pipeline’s highlight threshold', async () => {
    const w = (await makeup.post(`${base}/swatches`).send(measured('White wall, hot', WHITE, 4))).body.swatch;
    const w0 = (await makeup.post(`${base}/swatches`).send(measured('White wall, at key', WHITE))).body.swatch;
    const [hot, key] = [await tonesOf(w.id), await tonesOf(w0.id)];
    hot.forEach((l, i) => {
      expect(l.tones[0].stops - key[i].tones[0].stops).toBeCloseTo(4, 9);
      // the demo looks are negatives with default tone settings: blown above NEGATIVE_HIGHLIGHT_ROLL_OFF_STOPS after the key
      expect(l.tones[0].blown).toBe(l.tones[0].stops > NEGATIVE_HIGHLIGHT_ROLL_OFF_STOPS);
    });
    expect(hot.some((l) => l.tones[0].blown)).toBe(true);
  });

  it('refuses lights beyond ±4 stops', async () => {
    const r = await makeup.post(`${base}/swatches`).send(measured('x', GREY_CARD, 5));
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe('lightStops');
  });

  it('board tones and merges use the moved tones: a merging pair stops merging when one is lit 3 stops hotter', async () => {
    const boards = (await viewer.get(`${base}/boards`)).body.boards as { id: number; department: string; swatchIds: number[] }[];
    for (const b of boards) {
      const tones = (await viewer.get(`${base}/boards/${b.id}/tones`)).body.tones as { looks: LookTones[] };
      const look = tones.looks.find((l) => l.merges.length);
      if (!look) continue;
      const m = { a: look.merges[0].swatchId, b: look.merges[0].partners[0].swatchId };
      const sw = (await viewer.get(`${base}/swatches/${m.b}`)).body.swatch;
      const owner = await t.agent('camera@demo.grisaille.test');
      expect((await owner.patch(`${base}/swatches/${m.b}`).send({ lightStops: 3 })).status).toBe(200);
      const after = (await viewer.get(`${base}/boards/${b.id}/tones`)).body.tones as { looks: LookTones[] };
      const l2 = after.looks.find((l) => l.lookId === look.lookId)!;
      const before = look.tones.find((x) => x.swatchId === m.b)!;
      expect(l2.tones.find((x) => x.swatchId === m.b)!.stops - before.stops).toBeCloseTo(3, 9);
      // neither lists the other, and neither's list is merely capped
      const of = (id: number) => l2.merges.find((x) => x.swatchId === id);
      for (const [p, q] of [[m.a, m.b], [m.b, m.a]]) {
        expect(of(p)?.partners.some((x) => x.swatchId === q) ?? false).toBe(false);
        expect((of(p)?.count ?? 0) - (of(p)?.partners.length ?? 0)).toBe(0);
      }
      await owner.patch(`${base}/swatches/${m.b}`).send({ lightStops: sw.lightStops });
      return;
    }
    throw new Error('no demo board has a merge');
  });
});

describe('the demo makeup board made with the model', () => {
  it('holds skin, a flush, bruises, stage blood and two lip colours, all modelled, through the tungsten looks', async () => {
    const boards = (await viewer.get(`${base}/boards`)).body.boards as { id: number; name: string; department: string; swatchIds: number[]; notes: string; lookIds: number[] }[];
    const b = boards.find((x) => x.name === 'Skin and blood, modelled')!;
    expect(b).toBeDefined();
    expect(b.department).toBe('makeup');
    expect(b.notes).toMatch(/Invented demo/);
    expect(b.lookIds).toHaveLength(3);
    const all = (await viewer.get(`${base}/swatches?department=makeup`)).body.swatches as { id: number; name: string; spectrum: string; origin: { type: string } }[];
    const on = all.filter((s) => b.swatchIds.includes(s.id));
    expect(on.every((s) => s.spectrum === 'modelled')).toBe(true);
    expect(on.filter((s) => s.origin.type === 'skin').length).toBeGreaterThanOrEqual(5);
    expect(on.filter((s) => /lip colour/i.test(s.name) && s.origin.type === 'makeup')).toHaveLength(2);
    for (const word of [/flush/i, /bruise/i, /blood/i]) expect(on.some((s) => word.test(s.name))).toBe(true);
  });

  it('the flush reads darker against calm skin through the cyan and on ortho than on the panchromatic medium alone', async () => {
    const boards = (await viewer.get(`${base}/boards`)).body.boards as { id: number; name: string }[];
    const b = boards.find((x) => x.name === 'Skin and blood, modelled')!;
    const all = (await viewer.get(`${base}/swatches?department=makeup`)).body.swatches as { id: number; name: string }[];
    const calm = all.find((s) => s.name === 'Light skin')!.id;
    const flush = all.find((s) => s.name === 'Flushed cheek')!.id;
    const tones = (await viewer.get(`${base}/boards/${b.id}/tones`)).body.tones as { looks: LookTones[] };
    const drop = (name: RegExp) => {
      const l = tones.looks.find((x) => name.test(x.lookName))!;
      return l.tones.find((x) => x.swatchId === calm)!.stops - l.tones.find((x) => x.swatchId === flush)!.stops;
    };
    const pan = drop(/^Panchromatic, no filter/);
    expect(drop(/cyan/)).toBeGreaterThan(pan);
    expect(drop(/^Orthochromatic/)).toBeGreaterThan(pan);
  });
});
