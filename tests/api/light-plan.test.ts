import { describe, expect, it } from 'vitest';
import { signedInForFile } from '../helpers/api';

/** Shared default tolerance for this file (relative). */
const TOL = 1e-9;
const rel = (x: number, y: number) => Math.abs(x / y - 1);
/** ISO 2720, E = C·N²/(t·S) by hand: 250 · 2.8² · 48 / 100 = 940.8 lux at EI 100, T2.8, 24 fps, 180°. */
const LUX_T28_EI100 = 940.8;
/** 1 fc = 1 lm/ft², 1 ft = 0.3048 m (definition): 10.7639 lux. */
const LUX_PER_FC = 1 / 0.3048 ** 2;
/** Inverse-square and cosine laws by hand: 3,200 cd at 2 m, 0° → 800 lux; 1,600 cd at 2 m, 60° → 1600 · 0.5 / 4 = 200 lux. */
const KEY_LUX = 800;
const FILL_LUX = 200;
/** Lighting ratio (common practice): (800 + 200) / 200 = 5:1, log2 5 = 2.32 stops; within a modern negative's 5 stops. */
const RATIO = 5;
/** Uniform cone by hand: 10,000 lm over 60° → 11,879.49 cd; at 3 m, 1,319.94 lux. */
const CONE_CD = 11879.49;
const CONE_TOL = 1e-6;
/** The default threshold: a modern negative's 5 stops (common practice, shared/tone/media-tone.ts). */
const DEFAULT_SHADOW_STOPS = 5;

const { app, agent } = signedInForFile('gaffer@demo.grisaille.test');

const camera = { ei: 100, tStop: 2.8, fps: 24, shutterAngle: 180 };
const twoLamps = [
  { name: 'Key', intensityCd: 3200, distanceM: 2, role: 'key' },
  { name: 'Fill', intensityCd: 1600, distanceM: 2, angleDeg: 60, role: 'fill' },
];

describe('POST /api/light-plan', () => {
  it('answers the level needed, each lamp, the total and the key-to-fill ratio', async () => {
    const r = await agent().post('/api/light-plan').send({ ...camera, lamps: twoLamps });
    expect(r.status).toBe(200);
    const b = r.body;
    expect(rel(b.neededLux, LUX_T28_EI100)).toBeLessThan(TOL);
    expect(rel(b.neededFc, LUX_T28_EI100 / LUX_PER_FC)).toBeLessThan(TOL);
    expect(b.meterConstant).toBe(250);
    expect(b.meterNote).toMatch(/ISO 2720/);
    expect(b.lamps.map((l: { name: string }) => l.name)).toEqual(['Key', 'Fill']);
    for (const l of b.lamps) expect(Object.keys(l)).toEqual(expect.arrayContaining(['name', 'lux', 'fc', 'stopsVsNeeded']));
    expect(rel(b.lamps[0].lux, KEY_LUX)).toBeLessThan(TOL);
    expect(rel(b.lamps[1].lux, FILL_LUX)).toBeLessThan(TOL);
    expect(rel(b.lamps[0].fc, KEY_LUX / LUX_PER_FC)).toBeLessThan(TOL);
    expect(rel(b.lamps[0].stopsVsNeeded, Math.log2(KEY_LUX / LUX_T28_EI100))).toBeLessThan(TOL);
    expect(rel(b.totalLux, KEY_LUX + FILL_LUX)).toBeLessThan(TOL);
    expect(rel(b.totalFc, (KEY_LUX + FILL_LUX) / LUX_PER_FC)).toBeLessThan(TOL);
    expect(rel(b.stopsVsNeeded, Math.log2((KEY_LUX + FILL_LUX) / LUX_T28_EI100))).toBeLessThan(TOL);
    expect(b.shadowDetailStops).toBe(DEFAULT_SHADOW_STOPS);
    expect(rel(b.keyToFill.ratio, RATIO)).toBeLessThan(TOL);
    expect(rel(b.keyToFill.stops, Math.log2(RATIO))).toBeLessThan(TOL);
    expect(b.keyToFill.exceeds).toBe(false);
    expect(b.cautions.map((c: { title: string }) => c.title)).toEqual(expect.arrayContaining(['Eyes', 'Heat and load', 'Authority']));
    expect(b.model.join(' ')).toMatch(/five-times rule/);
  });

  it('takes lumens and beam angle through the uniform-cone model, and says so', async () => {
    const r = await agent().post('/api/light-plan').send({ ...camera, lamps: [{ name: 'Open face', lumens: 10_000, beamAngleDeg: 60, distanceM: 3 }] });
    expect(r.status).toBe(200);
    expect(r.body.lamps[0].intensityFrom).toBe('cone');
    expect(rel(r.body.lamps[0].intensityCd, CONE_CD)).toBeLessThan(CONE_TOL);
    expect(rel(r.body.lamps[0].lux, CONE_CD / 9)).toBeLessThan(CONE_TOL);
    expect(r.body.keyToFill).toBeNull();
    expect(r.body.warnings.join(' ')).toMatch(/uniform-cone model/);
  });

  it('warns when a lamp is closer than five times its size, and says the fill must come closer past the threshold', async () => {
    const r = await agent().post('/api/light-plan').send({
      ...camera,
      meterConstant: 330,
      shadowDetailStops: 4,
      lamps: [
        { name: 'Key', intensityCd: 20_000, distanceM: 2, role: 'key' },
        { name: 'Soft fill', intensityCd: 400, distanceM: 5, sizeM: 1.2, role: 'fill' },
      ],
    });
    expect(r.status).toBe(200);
    expect(rel(r.body.neededLux, (LUX_T28_EI100 * 330) / 250)).toBeLessThan(TOL);
    expect(r.body.lamps[1].pointSource.ok).toBe(false);
    expect(r.body.warnings.join(' ')).toMatch(/Soft fill: Too close for the point-source model/);
    expect(r.body.keyToFill.exceeds).toBe(true);
    expect(r.body.keyToFill.text).toMatch(/bring Soft fill to [\d.]+ m or closer/);
    expect(r.body.keyToFill.fillMaxDistanceM).toBeLessThan(5);
  });

  it('refuses without a session (401)', async () => {
    const anon = await app().agent();
    const r = await anon.post('/api/light-plan').send({ ...camera, lamps: twoLamps });
    expect(r.status).toBe(401);
  });

  it('refuses without the CSRF header (403)', async () => {
    const r = await agent().post('/api/light-plan').set('X-CSRF-Token', 'wrong').send({ ...camera, lamps: twoLamps });
    expect(r.status).toBe(403);
    agent().set('X-CSRF-Token', agent().csrfToken);
  });

  const lamp = { name: 'Key', intensityCd: 1000, distanceM: 2 };
  it.each([
    [{ ...camera, ei: 0, lamps: [lamp] }, 'ei'],
    [{ ...camera, tStop: 'wide', lamps: [lamp] }, 'tStop'],
    [{ ...camera, fps: -1, lamps: [lamp] }, 'fps'],
    [{ ...camera, shutterAngle: 400, lamps: [lamp] }, 'shutterAngle'],
    [{ ...camera, meterConstant: 0, lamps: [lamp] }, 'meterConstant'],
    [{ ...camera, lamps: [] }, 'lamps'],
    [{ ...camera }, 'lamps'],
    [{ ...camera, lamps: [{ ...lamp, name: ' ' }] }, 'lamps.0.name'],
    [{ ...camera, lamps: [{ ...lamp, distanceM: 0 }] }, 'lamps.0.distanceM'],
    [{ ...camera, lamps: [lamp, { ...lamp, angleDeg: 90 }] }, 'lamps.1.angleDeg'],
    [{ ...camera, lamps: [{ name: 'Bare', distanceM: 2 }] }, 'lamps.0.intensityCd'],
    [{ ...camera, lamps: [{ ...lamp, lumens: 5000, beamAngleDeg: 40 }] }, 'lamps.0.intensityCd'],
    [{ ...camera, lamps: [{ name: 'Open face', lumens: 5000, distanceM: 2 }] }, 'lamps.0.beamAngleDeg'],
    [{ ...camera, lamps: [{ ...lamp, role: 'key' }, { ...lamp, role: 'key' }] }, 'lamps.1.role'],
    [{ ...camera, lamps: [{ ...lamp, distance: 3 }] }, 'lamps.0.distance'],
  ])('400 naming the field for %j', async (body, field) => {
    const r = await agent().post('/api/light-plan').send(body);
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid');
    expect(r.body.error.field).toBe(field);
    expect(r.body.error.message).toContain(field);
  });
});
