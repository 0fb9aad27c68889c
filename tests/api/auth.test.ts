import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, withTestApp, type TestApp } from '../helpers/api';
import { User } from '../../server/db/entities/user.entity';

let t: TestApp;
beforeAll(async () => void (t = await startTestApp()));
afterAll(async () => t.close());

describe('sign-in', () => {
  it('signs in with the right password and sets an httpOnly, SameSite session cookie', async () => {
    const a = await t.agent();
    const r = await a.post('/api/auth/sign-in').send({ email: 'camera@demo.grisaille.test', password: 'grisaille-demo' });
    expect(r.status).toBe(200);
    expect(r.body.user).toMatchObject({ email: 'camera@demo.grisaille.test', isAdmin: false });
    expect(typeof r.body.csrfToken).toBe('string');
    const cookie = ([] as string[]).concat(r.headers['set-cookie'] ?? []).find((c) => c.startsWith('grisaille.sid='));
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // plain http on localhost
    a.set('X-CSRF-Token', r.body.csrfToken);
    const me = await a.get('/api/auth/me');
    expect(me.body.user.email).toBe('camera@demo.grisaille.test');
  });

  it('accepts the e-mail in any case and with spaces around it', async () => {
    const a = await t.agent();
    const r = await a.post('/api/auth/sign-in').send({ email: '  Camera@Demo.Grisaille.TEST ', password: 'grisaille-demo' });
    expect(r.status).toBe(200);
  });

  it('refuses a wrong password and an unknown address with the same answer', async () => {
    const a = await t.agent();
    const wrong = await a.post('/api/auth/sign-in').send({ email: 'camera@demo.grisaille.test', password: 'not-the-password' });
    const unknown = await a.post('/api/auth/sign-in').send({ email: 'nobody@demo.grisaille.test', password: 'grisaille-demo' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.code).toBe('bad_credentials');
    expect((await a.get('/api/auth/me')).body.user).toBeNull();
  });

  it('needs the CSRF token, sign-in included', async () => {
    const r = await request(t.app).post('/api/auth/sign-in').send({ email: 'camera@demo.grisaille.test', password: 'grisaille-demo' });
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('csrf');
    const a = await t.agent('camera@demo.grisaille.test');
    const stale = await a.post('/api/productions').set('X-CSRF-Token', 'stale-token-of-the-same-length-000000').send({ name: 'X' });
    expect(stale.status).toBe(403);
  });

  it('names the field of a malformed sign-in', async () => {
    const a = await t.agent();
    const r = await a.post('/api/auth/sign-in').send({ email: 'not-an-address', password: 'x' });
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe('email');
    const r2 = await a.post('/api/auth/sign-in').send({ email: 'camera@demo.grisaille.test' });
    expect(r2.body.error.field).toBe('password');
  });

  it('signs out: the session is gone', async () => {
    const a = await t.agent('makeup@demo.grisaille.test');
    expect((await a.get('/api/productions')).status).toBe(200);
    const r = await a.post('/api/auth/sign-out');
    expect(r.status).toBe(200);
    expect((await a.get('/api/productions')).status).toBe(401);
    expect((await a.get('/api/auth/me')).body.user).toBeNull();
  });

  it('stores only a memory-hard hash of each password', async () => {
    const u = await t.ctx.ds.getRepository(User).findOneByOrFail({ email: 'camera@demo.grisaille.test' });
    expect(u.passwordHash.startsWith('scrypt$')).toBe(true);
    expect(u.passwordHash).not.toContain('grisaille-demo');
  });
});

describe('errors and health', () => {
  it('answers health after checking the database', async () => {
    expect((await request(t.app).get('/api/health')).body).toEqual({ ok: true });
  });
  it('answers unknown API routes and bad JSON with the error shape, never a stack trace', async () => {
    const a = await t.agent('camera@demo.grisaille.test');
    const nf = await a.get('/api/no-such-thing');
    expect(nf.status).toBe(404);
    expect(nf.body.error.code).toBe('not_found');
    const bad = await a.post('/api/productions').set('Content-Type', 'application/json').send('{"name": ');
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).not.toMatch(/at .*\.ts:\d+/);
    expect(bad.body.error.code).toBe('invalid');
  });
  it('sets the usual security headers (helmet)', async () => {
    const r = await request(t.app).get('/api/health');
    expect(r.headers['x-content-type-options']).toBe('nosniff');
    expect(r.headers['content-security-policy']).toContain("default-src 'self'");
    expect(r.headers['x-powered-by']).toBeUndefined();
  });
});

describe('first account', () => {
  it('on an empty database the first account becomes site admin, and only once', async () => {
    await withTestApp({ seed: false }, async (empty) => {
      const a = await empty.agent();
      expect((await a.get('/api/auth/me')).body.needsSetup).toBe(true);
      const r = await a.post('/api/auth/setup').send({ email: 'first@example.test', name: 'First', password: 'a-long-password' });
      expect(r.status).toBe(201);
      expect(r.body.user.isAdmin).toBe(true);
      const b = await empty.agent();
      const again = await b.post('/api/auth/setup').send({ email: 'second@example.test', name: 'Second', password: 'a-long-password' });
      expect(again.status).toBe(409);
      expect(await empty.ctx.ds.getRepository(User).count()).toBe(1);
    });
  });
});

describe('rate limits', () => {
  it('limits sign-in attempts', async () => {
    await withTestApp({ env: { authRateLimit: 3 } }, async (limited) => {
      const a = await limited.agent();
      const codes: number[] = [];
      for (let i = 0; i < 5; i++) codes.push((await a.post('/api/auth/sign-in').send({ email: 'camera@demo.grisaille.test', password: 'wrong-password' })).status);
      expect(codes.slice(0, 3)).toEqual([401, 401, 401]);
      expect(codes[4]).toBe(429);
    });
  });
});

describe('rate limit on changes', () => {
  it('limits state-changing requests, not reads', async () => {
    await withTestApp({ env: { writeRateLimit: 2 } }, async (limited) => {
      const a = await limited.agent('camera@demo.grisaille.test'); // the sign-in is the first change
      const codes: number[] = [];
      for (let i = 0; i < 3; i++) codes.push((await a.post('/api/productions').send({ name: `P${i}` })).status);
      expect(codes).toEqual([201, 429, 429]);
      expect((await a.get('/api/productions')).status).toBe(200);
    });
  });
});
