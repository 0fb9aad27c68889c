import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { Express } from 'express';
import { createApp, type GrisailleApp } from '../../server/app';
import { Production } from '../../server/db/entities/production.entity';
import { DEMO_PASSWORD, DEMO_PRODUCTION_NAME } from '../../server/db/seed';
import { MailMessage } from '../../server/db/entities/mail-message.entity';
import type { Env } from '../../server/env';

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
