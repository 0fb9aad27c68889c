/**
 * Safe defaults for a real deployment (issue 14, items 1, 3 and 6): demo mode only on a local start, a
 * session secret required outside it, `trust proxy` only by configuration, private API answers not cached,
 * the data directory readable by the service's user only, and a stalled request body answered 408.
 */
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import type { AddressInfo } from 'node:net';
import { afterEach, describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import { startTestApp, withTestApp } from '../helpers/api';
import { ConfigError, checkEnv, isLocalUrl, loadEnv } from '../../server/env';
import { createApp } from '../../server/app';
import { User } from '../../server/db/entities/user.entity';

const SECRET = 'x'.repeat(48);
afterEach(() => vi.unstubAllEnvs());

describe('demo mode stays local', () => {
  it('is on for a local start and off when PUBLIC_URL names a real host', () => {
    vi.stubEnv('GRISAILLE_DEMO', undefined);
    for (const local of [undefined, 'http://localhost:5178', 'http://127.0.0.1:8080', 'http://[::1]:5178', 'http://studio.localhost']) {
      vi.stubEnv('PUBLIC_URL', local);
      expect(loadEnv().demo, String(local)).toBe(true);
    }
    vi.stubEnv('PUBLIC_URL', 'https://grisaille.example.org');
    expect(loadEnv().demo).toBe(false);
    expect(loadEnv().sessionSecret).toBe(''); // no built-in secret outside demo mode
    vi.stubEnv('GRISAILLE_DEMO', 'true');
    expect(loadEnv()).toMatchObject({ demo: true, demoOnPublicHost: true });
    vi.stubEnv('PUBLIC_URL', 'http://localhost:5178');
    vi.stubEnv('GRISAILLE_DEMO', 'false');
    expect(loadEnv().demo).toBe(false);
  });

  it('does not take a look-alike host for this machine', () => {
    for (const u of ['http://localhost.example.com', 'http://127.0.0.1.example.com', 'https://10.0.0.5', 'not a url']) expect(isLocalUrl(u), u).toBe(false);
  });

  it('stops the start without a long SESSION_SECRET outside demo mode, saying what to set', async () => {
    const env = { ...loadEnv(), demo: false, publicUrl: 'https://grisaille.example.org' };
    expect(() => checkEnv({ ...env, sessionSecret: '' })).toThrow(/SESSION_SECRET is not set.*openssl rand/);
    expect(() => checkEnv({ ...env, sessionSecret: 'short' })).toThrow(/5 characters long; it must be at least 32/);
    expect(() => checkEnv({ ...env, sessionSecret: 'grisaille-local-secret-change-me' })).toThrow(/published local default/);
    expect(() => checkEnv({ ...env, sessionSecret: SECRET })).not.toThrow();
    await expect(createApp({ env: { dataDir: fs.mkdtempSync('/tmp/grisaille-cfg-'), demo: false, sessionSecret: '' } })).rejects.toBeInstanceOf(ConfigError);
  });

  it('the server process exits with the message (npm start on a public address without a secret)', () => {
    const dataDir = fs.mkdtempSync('/tmp/grisaille-cfg-');
    const r = spawnSync(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      env: { ...process.env, NODE_ENV: 'production', PUBLIC_URL: 'https://grisaille.example.org', SESSION_SECRET: '', GRISAILLE_DEMO: '', DATA_DIR: dataDir, PORT: '0' },
      encoding: 'utf8',
      timeout: 60_000,
    });
    fs.rmSync(dataDir, { recursive: true, force: true });
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/Grisaille cannot start: SESSION_SECRET is not set/);
  });

  it('outside demo mode: no demo accounts are seeded, no outbox page, and /me says so', async () => {
    const dataDir = fs.mkdtempSync('/tmp/grisaille-cfg-');
    // createApp's own default for seeding (env.demo), as `npm start` uses it
    const g = await createApp({ env: { dataDir, demo: false, sessionSecret: SECRET, publicUrl: 'https://grisaille.example.org', nodeEnv: 'test' }, serveClient: false });
    try {
      expect(g.seeded).toBe(false);
      expect(await g.ctx.ds.getRepository(User).count()).toBe(0);
      const me = await request(g.app).get('/api/auth/me');
      expect(me.body).toMatchObject({ demo: false, demoPublic: false, needsSetup: true });
    } finally {
      await g.close();
      fs.rmSync(dataDir, { recursive: true, force: true });
    }
  });

  it('the outbox page (which shows reset links) answers only in demo mode', async () => {
    await withTestApp({ seed: true, env: { demo: false, sessionSecret: SECRET } }, async (t) => {
      const admin = await t.agent('admin@demo.grisaille.test');
      expect((await admin.get('/api/admin/outbox')).status).toBe(404);
    });
  });

  it('demo mode asked for on a public address is flagged for the banner', async () => {
    await withTestApp({ env: { demo: true, publicUrl: 'https://grisaille.example.org' } }, async (t) => {
      const me = (await (await t.agent()).get('/api/auth/me')).body;
      expect(me).toMatchObject({ demo: true, demoPublic: true });
    });
  });
});

describe('sessions and load', () => {
  it('ignores X-Forwarded-For unless TRUST_PROXY says so (the address limit cannot be dodged)', async () => {
    const failedSignIns = async (t: Awaited<ReturnType<typeof startTestApp>>) => {
      const a = await t.agent();
      const statuses: number[] = [];
      for (let i = 0; i < 5; i++) {
        const r = await a.post('/api/auth/sign-in').set('X-Forwarded-For', `203.0.113.${i + 1}`).send({ email: `nobody${i}@example.org`, password: 'wrong-password' });
        statuses.push(r.status);
      }
      return statuses;
    };
    await withTestApp({ env: { authRateLimit: 3 } }, async (t) => {
      expect(await failedSignIns(t)).toEqual([401, 401, 401, 429, 429]);
    });
    await withTestApp({ env: { authRateLimit: 3, trustProxy: 'loopback' } }, async (t) => {
      expect(await failedSignIns(t)).toEqual([401, 401, 401, 401, 401]); // each forwarded address is its own client
    });
  });

  it('answers 408 to a body that stops arriving, and closes the connection', async () => {
    await withTestApp({ env: { bodyIdleTimeoutMs: 300 } }, async (t) => {
      const server = t.app.listen(0);
      await new Promise((r) => server.once('listening', r));
      const { port } = server.address() as AddressInfo;
      try {
        const res = await new Promise<{ status: number; body: string }>((resolve, reject) => {
          const req = http.request({ port, method: 'POST', path: '/api/auth/sign-in', headers: { 'content-type': 'application/json', 'content-length': '200' } }, (r) => {
            let body = '';
            r.on('data', (c) => (body += c));
            r.on('end', () => resolve({ status: r.statusCode ?? 0, body }));
          });
          req.on('error', reject);
          req.write('{"email":"someone@'); // 19 of the 200 bytes announced, then silence
        });
        expect(res.status).toBe(408);
        expect(JSON.parse(res.body).error.message).toMatch(/request body stopped arriving/);
      } finally {
        server.closeAllConnections();
        server.close();
      }
    });
  });
});

describe('headers and files', () => {
  it('marks private API answers Cache-Control: no-store (RFC 9111 §5.2.2.5), errors included', async () => {
    await withTestApp({}, async (t) => {
      const a = await t.agent('camera@demo.grisaille.test');
      for (const url of ['/api/auth/me', '/api/productions', `/api/productions/${t.demoProductionId}`, `/api/productions/${t.demoProductionId}/swatches`, '/api/no-such-route']) {
        expect((await a.get(url)).headers['cache-control'], url).toBe('no-store');
      }
    });
  });

  it('keeps the data directory readable by the service user only: folders 0700, database 0600', async () => {
    await withTestApp({}, async (t) => {
      const mode = (p: string) => fs.statSync(path.join(t.dataDir, p)).mode & 0o777;
      for (const d of ['', 'uploads', 'uploads/photos', 'cache']) expect(mode(d).toString(8), d || 'data dir').toBe('700');
      expect(mode('app.sqlite').toString(8)).toBe('600');
    });
  });
});
