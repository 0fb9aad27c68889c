/**
 * The production library of curves: upload a table (CSV / TSV / semicolons, decimal commas, header rows)
 * in a named basis, parametric filters, a light through a gel; roles; a bad file names its line and writes
 * nothing; a curve used by a look cannot be deleted.
 */
import { GRID_SIZE } from '../../shared/spectral/policy';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoAs, type Agent, type TestApp } from '../helpers/api';
import { Curve } from '../../server/db/entities/curve.entity';

/** One shared tolerance for this file: values are exact decimal inputs, read back after float arithmetic. */
const TOL = 1e-6;
/** The working grid's samples (350–900 nm at 1 nm; shared/spectral/policy.ts). */
const GRID_SAMPLES = GRID_SIZE;
/** Optical density D means transmittance 10^−D (definition of optical density). */
const T_OF_DENSITY = (d: number) => 10 ** -d;

let t: TestApp;
let editor: Agent;
let contributor: Agent;
let viewer: Agent;
let base: string;
const count = () => t.ctx.ds.getRepository(Curve).count();
const valueAt = (samples: [number, number][], nm: number) => samples.find((p) => p[0] === nm)![1];

/** A table of a green-ish filter in percent with two header lines, semicolons and decimal commas (invented). */
const GREEN_GEL_PERCENT = ['Invented test gel', 'nm;T (%)', ...Array.from({ length: 41 }, (_, i) => {
  const nm = 380 + 10 * i;
  return `${nm};${(10 + 70 * Math.exp(-(((nm - 530) / 60) ** 2))).toFixed(2).replace('.', ',')}`;
})].join('\n');

beforeAll(async () => {
  ({ t, base, as: { editor, contributor, viewer } } = await startDemoAs({ editor: 'gaffer', contributor: 'costume', viewer: 'producer' }));
});
afterAll(async () => t?.close());

describe('tables', () => {
  it('an editor uploads a semicolon file with decimal commas and header rows, in percent', async () => {
    const r = await editor.post(`${base}/curves`).send({ kind: 'filter', name: 'Green test gel', origin: { type: 'table', basis: 'percent', table: { text: GREEN_GEL_PERCENT, fileName: 'green-gel.csv' } } });
    expect(r.status).toBe(201);
    const c = r.body.curve;
    expect(c.samples).toHaveLength(GRID_SAMPLES);
    const expected530 = (10 + 70) / 100; // the file's own value at 530 nm, percent → fraction
    expect(Math.abs(valueAt(c.samples, 530) - expected530)).toBeLessThan(TOL);
    expect(c.source).toMatch(/green-gel\.csv/);
    expect(c.source).toMatch(/decimal commas/);
    expect(c.origin.headers).toEqual(['Invented test gel', 'nm;T (%)']);
  });

  it('reads optical density as transmittance 10^−D', async () => {
    const text = 'nm,D\n380,0.5\n550,0.5\n780,0.5\n';
    const r = await editor.post(`${base}/curves`).send({ kind: 'filter', name: 'Flat ND', origin: { type: 'table', basis: 'density', table: { text } } });
    expect(r.status).toBe(201);
    expect(Math.abs(valueAt(r.body.curve.samples, 600) - T_OF_DENSITY(0.5))).toBeLessThan(TOL);
  });

  it('reads a medium given as quantum efficiency (photon basis → energy basis: × λ, peak 1)', async () => {
    const text = '380\t0.5\n780\t0.5\n';
    const flat = Array.from({ length: 5 }, (_, i) => `${400 + 75 * i}\t0.5`).join('\n');
    const r = await editor.post(`${base}/curves`).send({ kind: 'medium', name: 'Flat QE sensor', origin: { type: 'table', basis: 'quantum', table: { text: `${text}${flat}` } } });
    expect(r.status).toBe(201);
    const s = r.body.curve.samples as [number, number][];
    // flat quantum efficiency → energy sensitivity ∝ λ, normalised to 1 at 780 nm (definition of the photon basis)
    expect(Math.abs(valueAt(s, 390) - 390 / 780)).toBeLessThan(TOL);
    expect(Math.abs(valueAt(s, 780) - 1)).toBeLessThan(TOL);
  });

  it('a light table is relative power, normalised to a peak of 1', async () => {
    const r = await editor.post(`${base}/curves`).send({ kind: 'light', name: 'Flat lamp', origin: { type: 'table', basis: 'power', table: { samples: [[380, 40], [580, 40], [780, 40]] } } });
    expect(r.status).toBe(201);
    expect(Math.abs(valueAt(r.body.curve.samples, 500) - 1)).toBeLessThan(TOL);
    expect(r.body.curve.source).toMatch(/pairs given through the API/);
  });
});

describe('parametric filters and gels', () => {
  it('makes a parametric long-pass from a form', async () => {
    const r = await editor.post(`${base}/curves`).send({ kind: 'filter', name: 'Orange 575', origin: { type: 'parametric', filter: { longPass: { cutOnNm: 575, slopeNm: 20, peak: 0.9 } } } });
    expect(r.status).toBe(201);
    // the cut-on is the 50 % point of the edge (model definition, shared/spectral/filters.ts)
    expect(Math.abs(valueAt(r.body.curve.samples, 575) - 0.45)).toBeLessThan(TOL);
    expect(r.body.curve.source).toMatch(/long-pass, cut-on 575 nm/);
  });

  it('makes a light through a gel from a built-in lamp and a production filter', async () => {
    const gel = (await viewer.get(`${base}/curves`)).body.curves.find((c: { name: string }) => c.name === 'Green test gel');
    const r = await editor.post(`${base}/curves`).send({ kind: 'light', name: 'Tungsten through green', origin: { type: 'gel', light: { source: { id: 'tungsten-3200' } }, gels: [{ curveId: gel.id }] } });
    expect(r.status).toBe(201);
    expect(Math.max(...r.body.curve.samples.map((p: number[]) => p[1]))).toBeCloseTo(1, 9);
    expect(r.body.curve.source).toBe('Tungsten 3200 K through Green test gel');
  });

  it('only filters are parametric; only lights go through gels', async () => {
    const n = await count();
    const a = await editor.post(`${base}/curves`).send({ kind: 'light', name: 'x', origin: { type: 'parametric', filter: { longPass: { cutOnNm: 500 } } } });
    expect(a.status).toBe(400);
    expect(a.body.error.field).toBe('origin.type');
    const b = await editor.post(`${base}/curves`).send({ kind: 'filter', name: 'x', origin: { type: 'table', basis: 'power', table: { samples: [[400, 1], [500, 1], [700, 1]] } } });
    expect(b.status).toBe(400);
    expect(b.body.error.field).toBe('origin.basis');
    expect(await count()).toBe(n);
  });
});

describe('bad files name the line and write nothing', () => {
  const bad: [string, string, RegExp][] = [
    ['a malformed value', 'nm,T\n400,0.5\n500,0.5x\n700,0.5', /^line 3: the value "0.5x" at 500 nm is not a number$/],
    ['an empty value', 'nm;T\n400;0,5\n500;\n700;0,5', /^line 3: there is no value after 500 nm$/],
    ['a wavelength twice', '400,0.5\n500,0.6\n500,0.7\n700,0.5', /^line 3: wavelength 500 nm appears twice$/],
    ['a value above 1 for transmittance 0..1', '400,0.5\n500,1.4\n700,0.5', /^line 2: the transmittance at 500 nm is above 1/],
    ['too short a range', '450,0.5\n500,0.5\n600,0.5', /must cover at least 400–700 nm/],
    ['an empty file', '\n\n', /the file is empty/],
  ];
  it.each(bad)('%s', async (_label, text, message) => {
    const n = await count();
    const r = await editor.post(`${base}/curves`).send({ kind: 'filter', name: 'bad', origin: { type: 'table', basis: 'transmittance', table: { text } } });
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe('origin.table.text');
    expect(r.body.error.message).toMatch(message);
    expect(await count()).toBe(n);
  });
});

describe('roles, rename, delete', () => {
  it('contributors and viewers read the library but cannot change it', async () => {
    expect((await viewer.get(`${base}/curves`)).status).toBe(200);
    const id = (await viewer.get(`${base}/curves`)).body.curves[0].id;
    for (const a of [contributor, viewer]) {
      expect((await a.post(`${base}/curves`).send({ kind: 'filter', name: 'x', origin: { type: 'parametric', filter: { neutralDensity: 0.3 } } })).status).toBe(403);
      expect((await a.patch(`${base}/curves/${id}`).send({ name: 'x' })).status).toBe(403);
      expect((await a.delete(`${base}/curves/${id}`)).status).toBe(403);
    }
  });

  it('renames a curve; a curve in use by a look cannot be deleted, an unused one can', async () => {
    const curves = (await viewer.get(`${base}/curves`)).body.curves as { id: number; name: string }[];
    const medium = curves.find((c) => c.name === 'Flat QE sensor')!;
    expect((await editor.patch(`${base}/curves/${medium.id}`).send({ name: 'Flat QE sensor (test)' })).body.curve.name).toBe('Flat QE sensor (test)');
    const look = await editor.post(`${base}/looks`).send({ name: 'On the flat sensor', light: { source: { id: 'd65' } }, filters: [], medium: { curveId: medium.id } });
    expect(look.status).toBe(201);
    const an = await viewer.get(`${base}/looks/${look.body.look.id}/analysis`);
    expect(an.body.analysis.curves[1].label).toBe('Flat QE sensor (test)');
    const inUse = await editor.delete(`${base}/curves/${medium.id}`);
    expect(inUse.status).toBe(409);
    expect(inUse.body.error.message).toMatch(/On the flat sensor/);
    const nd = curves.find((c) => c.name === 'Flat ND')!;
    expect((await editor.delete(`${base}/curves/${nd.id}`)).status).toBe(204);
    expect((await viewer.get(`${base}/curves/${nd.id}`)).status).toBe(404);
  });

  it('a look cannot use a light curve as its medium', async () => {
    const lamp = (await viewer.get(`${base}/curves`)).body.curves.find((c: { name: string }) => c.name === 'Flat lamp');
    const r = await editor.post(`${base}/looks`).send({ name: 'x', light: { source: { id: 'd65' } }, filters: [], medium: { curveId: lamp.id } });
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/is a light, not a medium/);
  });
});
