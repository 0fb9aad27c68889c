import 'reflect-metadata';
import path from 'node:path';
import fs from 'node:fs';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import type { DataSource } from 'typeorm';
import { checkEnv, loadEnv, type Env } from './env';
import { lockDownDataDir } from './services/data-dir';
import { createDataSource } from './db/data-source';
import { seedDemo } from './db/seed';
import { createMailService } from './services/mail';
import { createComputePool } from './services/compute-pool';
import { MemoryFairUse } from './middleware/fair-use';
import type { AppContext } from './context';
import { TypeormSessionStore } from './modules/auth/session-store';
import { createPassport } from './modules/auth/passport';
import { AuthService } from './modules/auth/auth.service';
import { authRouter, IGNORED_FORWARDED_FOR } from './modules/auth/auth.router';
import { authCookies } from './modules/auth/cookies';
import { productionsRouter } from './modules/productions/productions.router';
import { teamRouter } from './modules/team/team.router';
import { outboxRouter } from './modules/outbox/outbox.router';
import { csrfCheck, csrfConfig } from './middleware/csrf';
import { privateAnswers } from './middleware/private-answers';
import { bodyIdleTimeout } from './middleware/body-timeout';
import { errorHandler } from './middleware/error-handler';
import { staticAssets } from './middleware/static-assets';
import { AppError, NotFoundError } from './errors';
import rateLimit from 'express-rate-limit';
// ROUTER IMPORTS START
import { exposureRouter } from './modules/exposure/exposure.router';
import { lightPlanRouter } from './modules/light-plan/light-plan.router';
import { simulateRouter } from './modules/simulate/simulate.router';
import { shadeRouter } from './modules/shade/shade.router';
import { libraryRouter } from './modules/library/library.router';
import { looksRouter } from './modules/looks/looks.router';
import { swatchesRouter } from './modules/swatches/swatches.router';
import { boardsRouter } from './modules/boards/boards.router';
import { sheetsRouter } from './modules/sheets/sheets.router';
import { closePhotos, photosRouter } from './modules/photos/photos.router';
import { activityRouter } from './modules/activity/activity.router';
// ROUTER IMPORTS END

export interface CreateAppOptions {
  env?: Partial<Env>;
  /** seed the demo production when the database has no users (default: env.demo) */
  seed?: boolean;
  /** serve the built client from dist/ (default: true when dist/index.html exists) */
  serveClient?: boolean;
}

export interface GrisailleApp {
  app: Express;
  ctx: AppContext;
  seeded: boolean;
  close(): Promise<void>;
}

/** Migrates the database, seeds the demo on first run, and builds the Express app. Tests import this. */
export async function createApp(opts: CreateAppOptions = {}): Promise<GrisailleApp> {
  const env = loadEnv(opts.env);
  checkEnv(env);
  lockDownDataDir(env.dataDir);
  const ds: DataSource = createDataSource(path.join(env.dataDir, 'app.sqlite'));
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  lockDownDataDir(env.dataDir); // the database files SQLite just created
  const mail = await createMailService(env, ds);
  // heavy computations run in worker threads (registered under ds for services built from it), limited per user
  const compute = createComputePool({ size: env.computeWorkers, queueLimit: env.computeQueueLimit }, ds);
  const fairUse = new MemoryFairUse({ concurrency: env.fairUseConcurrency, workPerMinute: env.fairUseWorkPerMinute });
  const ctx: AppContext = { env, ds, mail, compute, fairUse };
  const seeded = (opts.seed ?? env.demo) ? await seedDemo(ctx) : false;

  const app = express();
  app.disable('x-powered-by');
  // only by configuration: otherwise X-Forwarded-For is ignored and the client's address is the socket's
  app.set('trust proxy', env.trustProxy);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'img-src': ["'self'", 'data:', 'blob:'],
          'worker-src': ["'self'", 'blob:'],
          'connect-src': ["'self'"],
          upgradeInsecureRequests: null,
        },
      },
      strictTransportSecurity: env.publicUrl.startsWith('https:'),
    }),
  );
  app.use('/api', privateAnswers);
  app.use(bodyIdleTimeout(env.bodyIdleTimeoutMs));
  app.use('/api', express.json({ limit: '2mb' }));
  // signed-in sessions only (anonymous visitors get a CSRF cookie instead, middleware/csrf.ts); over https the
  // cookie is `__Host-grisaille.sid`, Secure, Path=/, no Domain (modules/auth/cookies.ts, RFC 6265bis §4.1.3.2)
  const cookies = authCookies(env.publicUrl);
  const DAY_MS = 24 * 3600 * 1000;
  const sessionStore = new TypeormSessionStore(ds, { idleTtlMs: 14 * DAY_MS, maxAgeMs: env.sessionMaxAgeDays * DAY_MS });
  app.use(
    session({
      name: cookies.session,
      secret: env.sessionSecret,
      store: sessionStore,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { ...cookies.options, maxAge: 14 * DAY_MS },
    }),
  );
  const pp = createPassport(ds, new AuthService(ds, mail, env.publicUrl));
  app.use(pp.initialize());
  app.use(pp.session());
  app.use('/api', csrfCheck(csrfConfig(env)));
  app.use(
    '/api',
    rateLimit({
      windowMs: 60 * 1000,
      limit: env.writeRateLimit,
      skip: (req) => ['GET', 'HEAD', 'OPTIONS'].includes(req.method),
      // X-Forwarded-For is ignored on purpose unless TRUST_PROXY is set: no warning for a client that sends it
      validate: IGNORED_FORWARDED_FOR,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'Too many changes in a minute; wait a moment and try again.')),
    }),
  );

  app.get('/api/health', async (_req, res, next) => {
    try {
      await ds.query('SELECT 1');
      res.json({ ok: true });
    } catch (e) {
      next(e);
    }
  });
  app.use('/api/auth', authRouter(ctx, pp, sessionStore));
  app.use('/api', productionsRouter(ctx));
  app.use('/api', teamRouter(ctx));
  app.use('/api', outboxRouter(ctx));
  // ROUTES START
  for (const router of [exposureRouter, lightPlanRouter, simulateRouter, shadeRouter, libraryRouter, looksRouter, swatchesRouter, boardsRouter, sheetsRouter, photosRouter, activityRouter]) {
    app.use('/api', router(ctx));
  }
  // ROUTES END
  app.use('/api', (_req, _res, next) => next(new NotFoundError('That API route')));

  const dist = path.resolve('dist');
  if (opts.serveClient ?? fs.existsSync(path.join(dist, 'index.html'))) {
    // the build's brotli/gzip copies when the client accepts them; hashed assets cached for good, index.html revalidated
    const client = staticAssets(dist);
    app.use(client.files);
    // a hashed file that is not (or no longer) in the build is a 404, not index.html: a browser holding an
    // old page after a deploy must not run HTML as a script
    app.get('/assets/{*splat}', (_req, res) => void res.status(404).type('text/plain').send('Not found.'));
    app.get('/{*splat}', client.index);
  }
  app.use(errorHandler);
  if (env.nodeEnv !== 'test') void compute.warm(); // a server starts its compute threads now; tests start them on first use

  return {
    app,
    ctx,
    seeded,
    close: async () => {
      await compute.close();
      await mail.close();
      await closePhotos(ctx);
      if (ds.isInitialized) await ds.destroy();
    },
  };
}
