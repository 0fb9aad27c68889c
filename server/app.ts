import 'reflect-metadata';
import path from 'node:path';
import fs from 'node:fs';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import type { DataSource } from 'typeorm';
import { loadEnv, type Env } from './env';
import { createDataSource } from './db/data-source';
import { seedDemo } from './db/seed';
import { createMailService } from './services/mail';
import type { AppContext } from './context';
import { TypeormSessionStore } from './modules/auth/session-store';
import { createPassport } from './modules/auth/passport';
import { AuthService } from './modules/auth/auth.service';
import { authRouter } from './modules/auth/auth.router';
import { productionsRouter } from './modules/productions/productions.router';
import { teamRouter } from './modules/team/team.router';
import { outboxRouter } from './modules/outbox/outbox.router';
import { csrfCheck } from './middleware/csrf';
import { errorHandler } from './middleware/error-handler';
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
import { photosRouter } from './modules/photos/photos.router';
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
  const ds: DataSource = createDataSource(path.join(env.dataDir, 'app.sqlite'));
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  const mail = await createMailService(env, ds);
  const ctx: AppContext = { env, ds, mail };
  const seeded = (opts.seed ?? env.demo) ? await seedDemo(ctx) : false;

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
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
  app.use('/api', express.json({ limit: '2mb' }));
  app.use(
    session({
      name: 'grisaille.sid',
      secret: env.sessionSecret,
      store: new TypeormSessionStore(ds),
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: env.publicUrl.startsWith('https:'), maxAge: 14 * 24 * 3600 * 1000 },
    }),
  );
  const pp = createPassport(ds, new AuthService(ds, mail, env.publicUrl));
  app.use(pp.initialize());
  app.use(pp.session());
  app.use('/api', csrfCheck);
  app.use(
    '/api',
    rateLimit({
      windowMs: 60 * 1000,
      limit: env.writeRateLimit,
      skip: (req) => ['GET', 'HEAD', 'OPTIONS'].includes(req.method),
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
  app.use('/api/auth', authRouter(ctx, pp));
  app.use('/api', productionsRouter(ctx));
  app.use('/api', teamRouter(ctx));
  app.use('/api', outboxRouter(ctx));
  // ROUTES START
  for (const router of [exposureRouter, lightPlanRouter, simulateRouter, shadeRouter, libraryRouter, looksRouter, swatchesRouter, boardsRouter, sheetsRouter, photosRouter]) {
    app.use('/api', router(ctx));
  }
  // ROUTES END
  app.use('/api', (_req, _res, next) => next(new NotFoundError('That API route')));

  const dist = path.resolve('dist');
  if (opts.serveClient ?? fs.existsSync(path.join(dist, 'index.html'))) {
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(dist, 'index.html')));
  }
  app.use(errorHandler);

  return {
    app,
    ctx,
    seeded,
    close: async () => {
      await mail.close();
      if (ds.isInitialized) await ds.destroy();
    },
  };
}
