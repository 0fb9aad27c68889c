import fs from 'node:fs';
import { afterAll, beforeAll } from 'vitest';
import { copyRunUpsampleTable } from '../setup/upsample-table-file';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { Express } from 'express';
import { createApp, type GrisailleApp } from '../../server/app';
import { Production } from '../../server/db/entities/production.entity';
import { DEMO_PASSWORD, DEMO_PRODUCTION_NAME } from '../../server/db/seed';
import { MailMessage } from '../../server/db/entities/mail-message.entity';
import type { Env } from '../../server/env';
import { onLogEvent } from '../../server/services/log';
import { emailHash } from '../../server/modules/auth/sign-in-throttle';

export type Agent = ReturnType<typeof request.agent> & { csrfToken: string };

export interface TestApp extends GrisailleApp {
  dataDir: string;
  demoProductionId: number;
  /** a supertest agent with a session and the CSRF header set; signed in when an e-mail is given */
  agent(email?: string, password?: string): Promise<Agent>;
  /** messages in the fake outbox, newest first */
  outbox(): Promise<MailMessage[]>;
  linkIn(text: string, prefix: string): string;
}

/** The real app on a temporary SQLite file (demo production seeded unless seed: false). */
export async function startTestApp(opts: { seed?: boolean; env?: Partial<Env> } = {}): Promise<TestApp> {
  process.env.NODE_ENV = 'test';
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-test-'));
  copyRunUpsampleTable(dataDir); // the run's table (tests/setup), so no test file rebuilds it
  const g = await createApp({ env: { dataDir, demo: true, nodeEnv: 'test', authRateLimit: 10_000, writeRateLimit: 100_000, publicUrl: 'http://localhost:5178', ...opts.env }, seed: opts.seed ?? true, serveClient: false });
  const prod = await g.ctx.ds.getRepository(Production).findOneBy({ name: DEMO_PRODUCTION_NAME });
  const app: Express = g.app;
  return {
    ...g,
    dataDir,
    demoProductionId: prod?.id ?? 0,
    async agent(email?: string, password = DEMO_PASSWORD) {
      const a = request.agent(app) as Agent;
      const c = await a.get('/api/auth/csrf');
      a.csrfToken = c.body.csrfToken;
      a.set('X-CSRF-Token', a.csrfToken);
      if (email) {
        const r = await a.post('/api/auth/sign-in').send({ email, password });
        if (r.status !== 200) throw new Error(`sign-in as ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
        a.csrfToken = r.body.csrfToken;
        a.set('X-CSRF-Token', a.csrfToken);
      }
      return a;
    },
    /** the link a mail carries, e.g. /invitation/<token> */
    linkIn(text: string, prefix: string) {
      const m = text.match(new RegExp(`http://localhost:5178${prefix}([A-Za-z0-9_-]+)`));
      if (!m) throw new Error(`no ${prefix} link in: ${text}`);
      return m[1];
    },
    outbox: () => g.ctx.ds.getRepository(MailMessage).find({ order: { id: 'DESC' } }),
    async close() {
      await g.close();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** A demo user's e-mail from the part before the @, e.g. `demoEmail('camera')` (the accounts of server/db/seed.ts). */
const demoEmail = (who: string) => `${who}@demo.grisaille.test`;

export interface DemoSession<K extends string> {
  t: TestApp;
  /** the demo production's id */
  pid: number;
  /** `/api/productions/<pid>` */
  base: string;
  /** one signed-in agent per key */
  as: Record<K, Agent>;
}

/**
 * The app with the demo production, signed in as each demo user named: `{ owner: 'camera', viewer: 'lab' }`
 * gives `as.owner` signed in as camera@demo.grisaille.test and `as.viewer` as lab@demo.grisaille.test.
 */
export async function startDemoAs<K extends string>(who: Record<K, string>): Promise<DemoSession<K>> {
  const t = await startTestApp();
  const as = {} as Record<K, Agent>;
  for (const [key, user] of Object.entries(who) as [K, string][]) as[key] = await t.agent(demoEmail(user));
  return { t, pid: t.demoProductionId, base: `/api/productions/${t.demoProductionId}`, as };
}

/** Runs `fn` against an app of its own (e.g. with other limits or no seed) and closes it afterwards. */
export async function withTestApp(opts: Parameters<typeof startTestApp>[0], fn: (app: TestApp) => Promise<void>): Promise<void> {
  const app = await startTestApp(opts);
  try {
    await fn(app);
  } finally {
    await app.close();
  }
}

/**
 * For a test file that only needs one signed-in user: starts the app with the demo before the file's tests
 * and closes it after; `app()` and `agent()` are ready inside the tests.
 */
export function signedInForFile(email: string): { app: () => TestApp; agent: () => Agent } {
  let t: TestApp | undefined;
  let a: Agent | undefined;
  beforeAll(async () => {
    t = await startTestApp();
    a = await t.agent(email);
  });
  afterAll(async () => t?.close());
  return { app: () => t!, agent: () => a! };
}

/**
 * The answer to a reset request comes before the account lookup and the mail (so its timing reveals
 * nothing); this resolves when that background work for `email` is done. Call it before the request.
 */
export function resetHandled(email: string): Promise<void> {
  return new Promise((resolve) => {
    const off = onLogEvent((l) => {
      if ((l.event === 'reset-requested' || l.event === 'reset-request-failed') && l.emailHash === emailHash(email)) {
        off();
        resolve();
      }
    });
  });
}
