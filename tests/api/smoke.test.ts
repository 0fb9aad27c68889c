import { afterAll, beforeAll, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../helpers/api';

let t: TestApp;
beforeAll(async () => void (t = await startTestApp()));
afterAll(async () => t.close());

it('health answers ok after checking the database', async () => {
  const a = await t.agent();
  const r = await a.get('/api/health');
  expect(r.status).toBe(200);
  expect(r.body).toEqual({ ok: true });
});

it('signs in a demo member and lists the demo production', async () => {
  const a = await t.agent('camera@demo.grisaille.test');
  const r = await a.get('/api/productions');
  expect(r.status).toBe(200);
  expect(r.body.productions[0].myRole).toBe('owner');
});
