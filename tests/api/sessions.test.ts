/**
 * Sessions (issue 14 items 2, 3 and 6): anonymous visits store no row, session ids are stored hashed,
 * the __Host- prefix over https, the absolute lifetime, touch at most once a minute, the user's session
 * list, and the operator's 'csrf-refused' events.
 */
import crypto from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import { startTestApp, withTestApp, type Agent, type TestApp } from '../helpers/api';
import { SessionRow } from '../../server/db/entities/session.entity';
import { User } from '../../server/db/entities/user.entity';
import { sessionKey } from '../../server/modules/auth/session-store';
import { onLogEvent } from '../../server/services/log';

let t: TestApp;
beforeAll(async () => void (t = await startTestApp()));
afterAll(async () => t.close());

const PASSWORD = 'grisaille-demo';
const DAY_MS = 24 * 3600 * 1000;
/** the issue measured 3,000 rows from 3,000 visits; 1,000 keep the test quick and show the same */
const ANONYMOUS_VISITS = 1000;
const rows = () => t.ctx.ds.getRepository(SessionRow);

/** The Set-Cookie lines of a response. */
const setCookies = (r: request.Response): string[] => ([] as string[]).concat(r.headers['set-cookie'] ?? []);
/** The raw session id inside express-session's signed cookie value (`s:<id>.<signature>`, URL-encoded). */
function sidOf(cookieLine: string): string {
  const value = decodeURIComponent(cookieLine.split(';')[0].split('=').slice(1).join('='));
  return value.slice(2, value.lastIndexOf('.'));
}
/** A cookie value signed the way express-session signs one (cookie-signature: HMAC-SHA256, base64 without padding). */
function signedCookieValue(id: string, secret: string): string {
  const sig = crypto.createHmac('sha256', secret).update(id).digest('base64').replace(/=+$/, '');
  return encodeURIComponent(`s:${id}.${sig}`);
}
/** Signs in a fresh agent and answers it with its raw session id. */
async function signInWithSid(email: string, userAgent = 'test-agent/1.0'): Promise<{ a: Agent; sid: string }> {
  const a = await t.agent();
  a.set('User-Agent', userAgent);
  const r = await a.post('/api/auth/sign-in').send({ email, password: PASSWORD });
  expect(r.status).toBe(200);
  a.csrfToken = r.body.csrfToken;
  a.set('X-CSRF-Token', a.csrfToken);
  const line = setCookies(r).find((c) => c.startsWith('grisaille.sid='));
  return { a, sid: sidOf(line!) };
}
const whoIs = async (a: Agent) => (await a.get('/api/auth/me')).body.user?.email ?? null;

describe('anonymous visits', () => {
  it('GET /api/auth/csrf and /api/auth/me without a cookie write no session row (1,000 requests)', async () => {
    const before = await rows().count();
    const server = t.app.listen(0);
    try {
      const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
      const paths = Array.from({ length: ANONYMOUS_VISITS }, (_, i) => (i % 2 ? '/api/auth/me' : '/api/auth/csrf'));
      let next = 0;
      let withCookie = 0;
      const worker = async () => {
        while (next < paths.length) {
          const r = await fetch(base + paths[next++]);
          if (r.headers.get('set-cookie')?.includes('grisaille.sid')) withCookie++;
          await r.arrayBuffer();
        }
      };
      await Promise.all(Array.from({ length: 8 }, worker));
      const written = (await rows().count()) - before;
      console.log(`anonymous visits: ${ANONYMOUS_VISITS} requests (half /api/auth/csrf, half /api/auth/me, no cookie) wrote ${written} session rows`);
      expect(written).toBe(0);
      expect(withCookie).toBe(0);
    } finally {
      await new Promise((r) => server.close(r));
    }
  });

  it('an anonymous token is bound to its own cookie; a signed-in session uses its own token', async () => {
    const one = await t.agent();
    const two = await t.agent();
    expect(one.csrfToken).not.toBe(two.csrfToken);
    const cross = await one.post('/api/auth/sign-in').set('X-CSRF-Token', two.csrfToken).send({ email: 'lab@demo.grisaille.test', password: PASSWORD });
    expect(cross.status).toBe(403);
    const noCookie = await request(t.app).post('/api/auth/sign-in').set('X-CSRF-Token', one.csrfToken).send({ email: 'lab@demo.grisaille.test', password: PASSWORD });
    expect(noCookie.status).toBe(403);
    const ok = await one.post('/api/auth/sign-in').send({ email: 'lab@demo.grisaille.test', password: PASSWORD });
    expect(ok.status).toBe(200);
    expect(ok.body.csrfToken).not.toBe(one.csrfToken);
    // once signed in, the anonymous token no longer passes
    expect((await one.post('/api/productions').send({ name: 'X' })).status).toBe(403);
    expect((await one.post('/api/productions').set('X-CSRF-Token', ok.body.csrfToken).send({ name: 'X' })).status).toBe(201);
  });
});

describe('session ids stored hashed', () => {
  it('keys rows by sha256(id): no row key is a cookie id, and a row key cannot be used as a cookie', async () => {
    const { a, sid } = await signInWithSid('makeup@demo.grisaille.test');
    const all = await rows().find();
    expect(all.map((r) => r.sid)).not.toContain(sid);
    const mine = all.find((r) => r.sid === sessionKey(sid));
    expect(mine).toBeDefined();
    expect(mine!.data).not.toContain(sid);
    expect(await whoIs(a)).toBe('makeup@demo.grisaille.test');

    const secret = t.ctx.env.sessionSecret;
    // the crafting is right: the real id, signed, is the session …
    const real = await request(t.app).get('/api/auth/me').set('Cookie', `grisaille.sid=${signedCookieValue(sid, secret)}`);
    expect(real.body.user?.email).toBe('makeup@demo.grisaille.test');
    // … but the stolen row key, even signed with the secret, is nobody's session
    const stolen = await request(t.app).get('/api/auth/me').set('Cookie', `grisaille.sid=${signedCookieValue(mine!.sid, secret)}`);
    expect(stolen.body.user).toBeNull();
  });
});

describe('__Host- cookies over https', () => {
  it('names the cookies __Host-…, Secure, Path=/, no Domain (RFC 6265bis §4.1.3.2)', async () => {
    await withTestApp({ env: { publicUrl: 'https://grisaille.example', trustProxy: 'loopback' } }, async (app) => {
      const csrf = await request(app.app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
      const csrfCookie = setCookies(csrf).find((c) => c.startsWith('__Host-grisaille.csrf='));
      expect(csrfCookie).toBeDefined();
      for (const attr of [/;\s*Secure/i, /;\s*Path=\/(;|$)/i, /;\s*HttpOnly/i, /;\s*SameSite=Lax/i]) expect(csrfCookie).toMatch(attr);
      expect(csrfCookie).not.toMatch(/Domain=/i);

      const r = await request(app.app)
        .post('/api/auth/sign-in')
        .set('X-Forwarded-Proto', 'https')
        .set('Cookie', csrfCookie!.split(';')[0])
        .set('X-CSRF-Token', csrf.body.csrfToken)
        .send({ email: 'camera@demo.grisaille.test', password: PASSWORD });
      expect(r.status).toBe(200);
      const sid = setCookies(r).find((c) => c.startsWith('__Host-grisaille.sid='));
      expect(sid).toBeDefined();
      for (const attr of [/;\s*Secure/i, /;\s*Path=\/(;|$)/i, /;\s*HttpOnly/i, /;\s*SameSite=Lax/i]) expect(sid).toMatch(attr);
      expect(sid).not.toMatch(/Domain=/i);
      expect(setCookies(r).some((c) => c.startsWith('grisaille.sid='))).toBe(false);

      const me = await request(app.app).get('/api/auth/me').set('X-Forwarded-Proto', 'https').set('Cookie', sid!.split(';')[0]);
      expect(me.body.user.email).toBe('camera@demo.grisaille.test');
      const out = await request(app.app).post('/api/auth/sign-out').set('X-Forwarded-Proto', 'https').set('Cookie', sid!.split(';')[0]).set('X-CSRF-Token', r.body.csrfToken);
      expect(out.status).toBe(200);
      expect(setCookies(out).find((c) => c.startsWith('__Host-grisaille.sid=;'))).toMatch(/;\s*Secure/i);
    });
  });
});

describe('lifetime', () => {
  it('ends a session 30 days after sign-in whatever its activity', async () => {
    const young = await signInWithSid('art@demo.grisaille.test');
    const old = await signInWithSid('art@demo.grisaille.test');
    await rows().update({ sid: sessionKey(young.sid) }, { createdAt: Date.now() - 29 * DAY_MS });
    await rows().update({ sid: sessionKey(old.sid) }, { createdAt: Date.now() - 30 * DAY_MS - 60_000 });
    expect(await whoIs(young.a)).toBe('art@demo.grisaille.test');
    expect(await whoIs(old.a)).toBeNull();
    expect(await rows().countBy({ sid: sessionKey(old.sid) })).toBe(0);
  });

  it('follows SESSION_MAX_AGE_DAYS', async () => {
    await withTestApp({ env: { sessionMaxAgeDays: 1 } }, async (app) => {
      const a = await app.agent('art@demo.grisaille.test');
      await app.ctx.ds.getRepository(SessionRow).createQueryBuilder().update().set({ createdAt: Date.now() - DAY_MS - 60_000 }).execute();
      expect(await whoIs(a)).toBeNull();
    });
  });

  it('moves the idle expiry at most once a minute (no write per GET)', async () => {
    const { a, sid } = await signInWithSid('costume@demo.grisaille.test');
    const key = sessionKey(sid);
    const first = await rows().findOneByOrFail({ sid: key });
    for (let i = 0; i < 3; i++) expect((await a.get('/api/productions')).status).toBe(200);
    const after = await rows().findOneByOrFail({ sid: key });
    expect(Number(after.expiresAt)).toBe(Number(first.expiresAt));
    expect(Number(after.lastSeenAt)).toBe(Number(first.lastSeenAt));

    // two minutes on: the next request moves it
    const earlier = Number(first.expiresAt) - 120_000;
    await rows().update({ sid: key }, { expiresAt: earlier, lastSeenAt: Date.now() - 120_000 });
    // and the server's clock two minutes on too (the store also remembers its own last touch in memory)
    vi.useFakeTimers({ toFake: ['Date'], now: Date.now() + 120_000 });
    try {
      await a.get('/api/productions');
    } finally {
      vi.useRealTimers();
    }
    const moved = await rows().findOneByOrFail({ sid: key });
    expect(Number(moved.expiresAt)).toBeGreaterThan(earlier + 100_000);
    expect(Number(moved.lastSeenAt)).toBeGreaterThan(Date.now() - 10_000);
    // a second request within the minute writes nothing, not even through the conditional update
    await rows().update({ sid: key }, { lastSeenAt: 1 });
    await a.get('/api/productions');
    expect(Number((await rows().findOneByOrFail({ sid: key })).lastSeenAt)).toBe(1);
  });
});

describe('your sessions', () => {
  it('lists the user\'s sessions with an opaque id, ends one, then all others', async () => {
    const email = 'producer@demo.grisaille.test';
    const here = await signInWithSid(email, 'browser-here/1.0');
    const phone = await signInWithSid(email, 'browser-phone/2.0');
    const laptop = await signInWithSid(email, `browser-laptop/3.0 ${'x'.repeat(300)}`);
    const other = await signInWithSid('lab@demo.grisaille.test');

    const list = await here.a.get('/api/auth/sessions');
    expect(list.status).toBe(200);
    const sessions = list.body.sessions as { id: string; createdAt: string; lastSeenAt: string; userAgent: string; ip: string; current: boolean }[];
    expect(sessions).toHaveLength(3);
    expect(sessions.filter((s) => s.current).map((s) => s.userAgent)).toEqual(['browser-here/1.0']);
    const keys = (await rows().find()).map((r) => r.sid);
    for (const s of sessions) {
      expect(s.id).toMatch(/^[A-Za-z0-9_-]{16,}$/);
      expect([here.sid, phone.sid, laptop.sid, ...keys]).not.toContain(s.id);
      expect(keys.some((k) => k.startsWith(s.id) || s.id.startsWith(k.slice(0, 8)))).toBe(false);
      expect(Number.isNaN(Date.parse(s.createdAt))).toBe(false);
      expect(Number.isNaN(Date.parse(s.lastSeenAt))).toBe(false);
      expect(s.ip).toMatch(/127\.0\.0\.1|::1/);
      expect(s.userAgent.length).toBeLessThanOrEqual(120);
    }

    const phoneId = sessions.find((s) => s.userAgent === 'browser-phone/2.0')!.id;
    const currentId = sessions.find((s) => s.current)!.id;
    expect((await other.a.delete(`/api/auth/sessions/${phoneId}`)).status).toBe(404); // not theirs
    expect(await whoIs(phone.a)).toBe(email);
    expect((await here.a.delete(`/api/auth/sessions/${currentId}`)).status).toBe(400);
    expect((await here.a.delete(`/api/auth/sessions/${phoneId}`)).status).toBe(204);
    expect(await whoIs(phone.a)).toBeNull();
    expect(await whoIs(laptop.a)).toBe(email);

    const ended = await here.a.post('/api/auth/sessions/end-others');
    expect(ended.body).toEqual({ ended: 1 });
    expect(await whoIs(laptop.a)).toBeNull();
    expect(await whoIs(here.a)).toBe(email);
    expect(await whoIs(other.a)).toBe('lab@demo.grisaille.test');
    expect((await here.a.get('/api/auth/sessions')).body.sessions).toHaveLength(1);

    const anon = await t.agent();
    expect((await anon.get('/api/auth/sessions')).status).toBe(401);
    expect((await anon.post('/api/auth/sessions/end-others')).status).toBe(401);
  });
});

describe('operator log', () => {
  it("logs 'csrf-refused' with method, path (tokens masked), address and user", async () => {
    const seen: Record<string, unknown>[] = [];
    const off = onLogEvent((l) => seen.push(l));
    try {
      await request(t.app).post('/api/auth/sign-in').send({ email: 'lab@demo.grisaille.test', password: PASSWORD });
      await request(t.app).post(`/api/invitations/${'A'.repeat(43)}/accept`).send({ password: 'whatever-password' });
      const a = await t.agent('lab@demo.grisaille.test');
      await a.post('/api/productions').set('X-CSRF-Token', 'stale-token-of-the-same-length-000000').send({ name: 'X' });
    } finally {
      off();
    }
    const refused = seen.filter((e) => e.event === 'csrf-refused');
    expect(refused).toHaveLength(3);
    expect(refused[0]).toMatchObject({ method: 'POST', path: '/api/auth/sign-in', userId: null });
    expect(refused[0].ip).toMatch(/127\.0\.0\.1|::1/);
    expect(refused[1].path).toBe('/api/invitations/:token/accept');
    const lab = await t.ctx.ds.getRepository(User).findOneByOrFail({ email: 'lab@demo.grisaille.test' });
    expect(refused[2]).toMatchObject({ method: 'POST', path: '/api/productions', userId: lab.id });
    expect(JSON.stringify(refused)).not.toContain('A'.repeat(43));
  });
});
