import { describe, expect, it } from 'vitest';
import { signedInForFile } from '../helpers/api';
import { exposureResponseSchema } from '../../shared/schemas/exposure';

/** Shared default tolerance for this file (relative). */
const TOL = 1e-9;
/** Facts of the trade (common practice): 250, rated −⅔ stop, one-stop filter → 160 then 80. */
const RATED_EI = 160;
const EFFECTIVE_EI = 80;
/** ISO 2720, E = C·N²/(t·S) by hand: 250 · 2.8² · 48 / 100 = 940.8 lux; / 10.7639 = 87.40 fc. */
const LUX_T28_EI100 = 940.8;
const FC_T28_EI100 = 940.8 * 0.3048 ** 2;

const { app, agent } = signedInForFile('camera@demo.grisaille.test');

const rel = (x: number, y: number) => Math.abs(x / y - 1);

describe('POST /api/exposure', () => {
  it('answers the EI chain with each step and the effective EI', async () => {
    const r = await agent().post('/api/exposure').send({ boxSpeed: 250, ratingStops: -0.667, filterStops: 1 });
    expect(r.status).toBe(200);
    expect(exposureResponseSchema.safeParse(r.body).success).toBe(true);
    expect(r.body.effectiveEI).toBe(EFFECTIVE_EI);
    expect(r.body.unfilteredEI).toBe(RATED_EI);
    expect(r.body.steps.map((s: { step: string }) => s.step)).toEqual(['box', 'rating', 'filter']);
    expect(r.body.steps.map((s: { ei: number }) => s.ei)).toEqual([250, RATED_EI, EFFECTIVE_EI]);
    expect(r.body.steps[1].stopsLabel).toBe('−⅔');
    expect(r.body.steps[2].stops).toBe(-1);
    expect(r.body.lux).toBeUndefined();
  });

  it('answers the light level with the calibration constant used', async () => {
    const r = await agent().post('/api/exposure').send({ ei: 100, tStop: 2.8, fps: 24, shutterAngle: 180 });
    expect(r.status).toBe(200);
    expect(r.body.calibrationConstant).toBe(250);
    expect(r.body.calibrationNote).toMatch(/ISO 2720/);
    expect(rel(r.body.lux, LUX_T28_EI100)).toBeLessThan(TOL);
    expect(rel(r.body.footcandles, FC_T28_EI100)).toBeLessThan(TOL);
    expect(rel(r.body.exposureSeconds, 1 / 48)).toBeLessThan(TOL);
    expect(r.body.eiSource).toBe('request');
    expect(r.body.steps).toBeUndefined();
  });

  it('takes a settable constant', async () => {
    const r = await agent().post('/api/exposure').send({ ei: 100, tStop: 2.8, fps: 24, shutterAngle: 180, calibrationConstant: 330 });
    expect(r.status).toBe(200);
    expect(r.body.calibrationConstant).toBe(330);
    expect(rel(r.body.lux, (LUX_T28_EI100 * 330) / 250)).toBeLessThan(TOL);
  });

  it('combines both: the light level at the effective EI, and the cost of the filter in light', async () => {
    const r = await agent().post('/api/exposure').send({ boxSpeed: 250, ratingStops: -0.667, filterStops: 1.667, tStop: 2.8, fps: 24, shutterAngle: 180 });
    expect(r.status).toBe(200);
    expect(r.body.effectiveEI).toBe(50);
    expect(r.body.ei).toBe(50);
    expect(r.body.eiSource).toBe('chain');
    expect(rel(r.body.lux, (LUX_T28_EI100 * 100) / 50)).toBeLessThan(TOL);
    expect(r.body.lightCost.referenceEI).toBe(RATED_EI);
    expect(r.body.lightCost.ratio).toBeCloseTo(3.2, 12);
    expect(r.body.lightCost.text).toBe('needs 3.2× the light of the unfiltered one');
  });

  it('refuses without a session (401)', async () => {
    const anon = await app().agent();
    const r = await anon.post('/api/exposure').send({ boxSpeed: 250 });
    expect(r.status).toBe(401);
  });

  it.each([
    [{}, 'boxSpeed'],
    [{ boxSpeed: 'fast' }, 'boxSpeed'],
    [{ boxSpeed: -5 }, 'boxSpeed'],
    [{ ratingStops: -1 }, 'boxSpeed'],
    [{ boxSpeed: 250, ratingStops: 'slow' }, 'ratingStops'],
    [{ boxSpeed: 250, filterStops: 99 }, 'filterStops'],
    [{ ei: 100, tStop: 0, fps: 24, shutterAngle: 180 }, 'tStop'],
    [{ ei: 100, tStop: 2.8, fps: -1, shutterAngle: 180 }, 'fps'],
    [{ ei: 100, tStop: 2.8, fps: 24, shutterAngle: 400 }, 'shutterAngle'],
    [{ ei: 100, tStop: 2.8, shutterAngle: 180 }, 'fps'],
    [{ ei: 100, fps: 24, shutterAngle: 180 }, 'tStop'],
    [{ tStop: 2.8, fps: 24, shutterAngle: 180 }, 'ei'],
    [{ boxSpeed: 250, ei: 100, tStop: 2.8, fps: 24, shutterAngle: 180 }, 'ei'],
    [{ ei: 100, tStop: 2.8, fps: 24, shutterAngle: 180, calibrationConstant: 0 }, 'calibrationConstant'],
  ])('400 naming the field for %j', async (body, field) => {
    const r = await agent().post('/api/exposure').send(body);
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid');
    expect(r.body.error.field).toBe(field);
    expect(r.body.error.message).toContain(field);
  });
});
