import { afterAll, beforeAll, expect, it } from 'vitest';
import { resetHandled, startTestApp, type TestApp } from '../helpers/api';
import { PasswordReset } from '../../server/db/entities/password-reset.entity';

let t: TestApp;
beforeAll(async () => void (t = await startTestApp()));
afterAll(async () => t.close());


it('resets a password through the mailed link, once, within the hour', async () => {
  const a = await t.agent();
  const before = (await t.outbox()).length;
  const handled = resetHandled('gaffer@demo.grisaille.test');
  const r = await a.post('/api/auth/reset/request').send({ email: 'gaffer@demo.grisaille.test' });
  expect(r.status).toBe(200);
  await handled;
  const mails = await t.outbox();
  expect(mails.length).toBe(before + 1);
  expect(mails[0].to).toContain('gaffer@demo.grisaille.test');
  expect(mails[0].html).toContain('/reset/');
  const token = t.linkIn(mails[0].text, '/reset/');
  const row = await t.ctx.ds.getRepository(PasswordReset).findOneByOrFail({});
  expect(Math.abs(new Date(row.expiresAt).getTime() - Date.now() - 3600e3)).toBeLessThan(60e3); // 1 hour
  expect(row.tokenHash).not.toBe(token); // only a hash is stored

  const signedIn = await t.agent('gaffer@demo.grisaille.test');
  const short = await a.post('/api/auth/reset/confirm').send({ token, password: 'short' });
  expect(short.status).toBe(400);
  expect(short.body.error.field).toBe('password');
  const ok = await a.post('/api/auth/reset/confirm').send({ token, password: 'a-brand-new-password' });
  expect(ok.status).toBe(200);
  expect((await signedIn.get('/api/productions')).status).toBe(401); // signed out everywhere
  const reuse = await a.post('/api/auth/reset/confirm').send({ token, password: 'yet-another-password' });
  expect(reuse.status).toBe(400);
  expect(reuse.body.error.field).toBe('token');

  const old = await a.post('/api/auth/sign-in').send({ email: 'gaffer@demo.grisaille.test', password: 'grisaille-demo' });
  expect(old.status).toBe(401);
  await t.agent('gaffer@demo.grisaille.test', 'a-brand-new-password');
});

it('answers the same for an unknown address and sends nothing', async () => {
  const a = await t.agent();
  const before = (await t.outbox()).length;
  const handled = resetHandled('nobody@example.test');
  const r = await a.post('/api/auth/reset/request').send({ email: 'nobody@example.test' });
  expect(r.status).toBe(200);
  await handled;
  expect((await t.outbox()).length).toBe(before);
});

it('refuses an expired reset link', async () => {
  const a = await t.agent();
  const handled = resetHandled('art@demo.grisaille.test');
  await a.post('/api/auth/reset/request').send({ email: 'art@demo.grisaille.test' });
  await handled;
  const token = t.linkIn((await t.outbox())[0].text, '/reset/');
  await t.ctx.ds.getRepository(PasswordReset).createQueryBuilder().update().set({ expiresAt: new Date(Date.now() - 1000) }).where('usedAt IS NULL').execute();
  const r = await a.post('/api/auth/reset/confirm').send({ token, password: 'a-brand-new-password' });
  expect(r.status).toBe(400);
});
