import fs from 'node:fs';
import { GRID_SIZE } from '../../shared/spectral/policy';
import { describe, expect, it } from 'vitest';
import { signedInForFile } from '../helpers/api';
import { decodeUpsampleTable, UPSAMPLE_METHOD } from '../../shared/spectral/upsample-table';
import { upsampleCacheFile } from '../../server/services/upsample-table';

/** Shared default tolerance for this file (stops). */
const TOL = 1e-6;
/** Middle grey: 0.18 (common practice). */
const GREY = 0.18;

const { app, agent } = signedInForFile('lab@demo.grisaille.test'); // a viewer: the engine needs no production role

const flatGrey = [[380, GREY], [580, GREY], [780, GREY]];

describe('POST /api/simulate', () => {
  it('answers filter factor and tones per swatch, as documented', async () => {
    const r = await agent().post('/api/simulate').send({
      light: { cie: 'D65' },
      filters: [{ id: 'red-590' }],
      medium: { id: 'panchromatic' },
      swatches: [{ name: 'grey card', reflectance: flatGrey }, { name: 'lipstick', srgb: '#b01c2e' }],
    });
    expect(r.status).toBe(200);
    expect(Object.keys(r.body).sort()).toEqual(['filterFactor', 'filterStops', 'opaque', 'swatches', 'white']);
    expect(r.body.filterFactor).toBeCloseTo(2 ** r.body.filterStops, 9);
    expect(r.body.opaque).toBe(false);
    const [grey, lips] = r.body.swatches;
    expect(Object.keys(grey).sort()).toEqual(['estimated', 'exposure', 'eyeStops', 'lab', 'name', 'range', 'shift', 'stops', 'xyz', 'zone']);
    expect(grey.name).toBe('grey card');
    expect(Math.abs(grey.stops)).toBeLessThanOrEqual(TOL);
    expect(Math.abs(grey.zone - 5)).toBeLessThanOrEqual(TOL);
    expect(grey.estimated).toBe(false);
    expect(lips.estimated).toBe(true);
    expect(lips.shift).toBeGreaterThan(1); // a red filter lightens red
    expect(lips.xyz).toHaveLength(3);
    expect(lips.lab).toHaveLength(3);
  });

  it('accepts daylight, blackbody, samples, LED and gels', async () => {
    for (const light of [{ daylight: 5600 }, { blackbody: 3200, gels: [{ id: 'cyan-530' }] }, { samples: [[380, 1], [780, 1], [550, 1]] }, { id: 'white-led' }]) {
      const r = await agent().post('/api/simulate').send({ light, medium: { id: 'orthochromatic' }, swatches: [{ name: 'g', reflectance: flatGrey }] });
      expect(r.status, JSON.stringify(light)).toBe(200);
    }
  });

  it('flags an effectively opaque filter', async () => {
    const r = await agent().post('/api/simulate').send({ light: { id: 'd65' }, filters: [{ id: 'red-590' }], medium: { id: 'orthochromatic' } });
    expect(r.status).toBe(200);
    expect(r.body.opaque).toBe(true);
  });

  it.each([
    [{ light: { cie: 'D65' }, medium: { id: 'panchromatic' }, swatches: [{ name: 'x', reflectance: [[400, 0.1], [500, 0.2], [500, 0.3], [700, 0.1]] }] }, 'swatches.0.reflectance.2.0', /appears twice/],
    [{ light: { daylight: 2000 }, medium: { id: 'panchromatic' } }, 'light.daylight', /4000–25000 K/],
    [{ light: { cie: 'D65' }, medium: { id: 'nope' } }, 'medium.id', /no built-in medium/],
    [{ light: { cie: 'D65' }, medium: { id: 'panchromatic' }, swatches: [{ name: 'x', lab: [50, 150, 0] }] }, 'swatches.0.lab', /outside the sRGB gamut/],
    [{ light: { cie: 'D65' } }, 'medium', /.+/],
  ])('400 names the field: %#', async (body, field, message) => {
    const r = await agent().post('/api/simulate').send(body);
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe(field);
    expect(r.body.error.message).toMatch(message);
  });

  it('needs a session', async () => {
    const anon = await app().agent();
    expect((await anon.post('/api/simulate').send({ light: { cie: 'D65' }, medium: { id: 'eye' } })).status).toBe(401);
    expect((await anon.get('/api/library')).status).toBe(401);
    expect((await anon.get('/api/library/upsample-table')).status).toBe(401);
  });
});

describe('GET /api/library', () => {
  it('lists lights, filters and media with ids, names, descriptions, kind and curves on the working grid', async () => {
    const r = await agent().get('/api/library');
    expect(r.status).toBe(200);
    expect(r.body.grid).toEqual({ startNm: 350, endNm: 900, stepNm: 1 }); // shared/spectral/policy.ts
    const kinds = new Set(r.body.items.map((i: { kind: string }) => i.kind));
    expect([...kinds].sort()).toEqual(['filter', 'light', 'medium']);
    for (const i of r.body.items) {
      expect(typeof i.id).toBe('string');
      expect(i.name.length).toBeGreaterThan(0);
      expect(i.description.length).toBeGreaterThan(0);
      expect(i.values).toHaveLength(GRID_SIZE);
    }
    expect(r.body.upsample.source).toMatch(/Jakob and J\. Hanika/);
  });
});

describe('GET /api/library/upsample-table', () => {
  it('serves the coefficient table as binary and caches it in DATA_DIR/cache', async () => {
    const r = await agent().get('/api/library/upsample-table').buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/application\/octet-stream/);
    const table = decodeUpsampleTable(new Uint8Array(r.body as Buffer));
    expect(table.resolution).toBe(UPSAMPLE_METHOD.resolution);
    expect(fs.existsSync(upsampleCacheFile(app().dataDir))).toBe(true);
  });
});
