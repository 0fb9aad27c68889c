import { Router, type Request, type Response } from 'express';
import rateLimit from 'express-rate-limit';
import type passport from 'passport';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { csrfConfig, issueCsrfToken } from '../../middleware/csrf';
import { AppError } from '../../errors';
import { logEvent } from '../../services/log';
import { handle } from '../route-registry';
import { resetConfirmSchema, resetRequestSchema, setupSchema, signInSchema, type MeResponse } from '../../../shared/schemas/auth';
import { AuthService, publicUser } from './auth.service';
import type { User } from '../../db/entities/user.entity';
import { authCookies } from './cookies';
import { logIn } from './log-in';
import { emailHash, SignInThrottle } from './sign-in-throttle';
import { accountRouter } from './account.router';
import type { TypeormSessionStore } from './session-store';

export { logIn };

/** The 429 of an address that tried too often (express-rate-limit). */
const tooMany = (_req: Request, _res: unknown, next: (e: unknown) => void) =>
  next(new AppError(429, 'rate_limited', 'Too many attempts; wait a few minutes and try again.'));

/** passport-local's verdict as a promise: the user, or null for a wrong e-mail or password. */
function authenticate(pp: passport.PassportStatic, req: Request, res: Response): Promise<User | null> {
  return new Promise((resolve, reject) =>
    pp.authenticate('local', { session: false }, (err: unknown, user: User | false) => (err ? reject(err) : resolve(user || null)))(req, res, reject),
  );
}

/** X-Forwarded-For is ignored on purpose unless TRUST_PROXY is set (server/env.ts): no warning when a client sends it. */
export const IGNORED_FORWARDED_FOR = { xForwardedForHeader: false } as const;

export function authRouter(ctx: AppContext, pp: passport.PassportStatic, store: TypeormSessionStore): Router {
  const r = Router();
  const auth = new AuthService(ctx.ds, ctx.mail, ctx.env.publicUrl);
  const csrf = csrfConfig(ctx.env);
  const cookies = authCookies(ctx.env.publicUrl);
  const throttle = new SignInThrottle();
  const limit = { windowMs: 15 * 60 * 1000, limit: ctx.env.authRateLimit, standardHeaders: 'draft-8', legacyHeaders: false, handler: tooMany, validate: IGNORED_FORWARDED_FOR } as const;
  /** per address, on setup and the reset routes: every request counts */
  const limiter = rateLimit(limit);
  /** per address, on sign-in: only failures count, so a shared office address is not locked out by its own successes */
  const signInLimiter = rateLimit({ ...limit, skipSuccessfulRequests: true });

  r.get('/csrf', (req, res) => {
    res.json({ csrfToken: issueCsrfToken(req, res, csrf) });
  });

  r.get('/me', async (req, res) => {
    const body: MeResponse = { user: req.user ? publicUser(req.user) : null, needsSetup: await auth.needsSetup(), demo: ctx.env.demo, demoPublic: ctx.env.demoOnPublicHost };
    res.json(body);
  });

  r.post('/sign-in', signInLimiter, validate(signInSchema), handle(async (req, res) => {
    const { email } = req.body as { email: string };
    const who = { emailHash: emailHash(email), ip: req.ip };
    const waitMs = await throttle.lockedForMs(email);
    if (waitMs > 0) {
      logEvent('sign-in-throttled', who, 'warn');
      const minutes = Math.ceil(waitMs / 60_000);
      res.set('Retry-After', String(Math.ceil(waitMs / 1000)));
      throw new AppError(429, 'rate_limited', `Too many failed sign-ins for this account; wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again, or reset the password.`);
    }
    const user = await authenticate(pp, req, res);
    if (!user) {
      await throttle.failed(email);
      logEvent('sign-in-failed', who, 'warn');
      throw new AppError(401, 'bad_credentials', 'That e-mail and password do not match an account.');
    }
    await throttle.succeeded(email);
    const csrfToken = await logIn(req, user);
    res.json({ user: publicUser(user), csrfToken });
  }));

  r.post('/sign-out', (req, res, next) => {
    const userId = req.user?.id;
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy((e) => {
        if (e) return next(e);
        if (userId) logEvent('sign-out', { userId, ip: req.ip });
        res.clearCookie(cookies.session, cookies.options);
        res.json({ ok: true });
      });
    });
  });

  r.post('/setup', limiter, validate(setupSchema), handle(async (req, res) => {
    const user = await auth.setup(req.body);
    const csrfToken = await logIn(req, user);
    res.status(201).json({ user: publicUser(user), csrfToken });
  }));

  /**
   * Answers at once, the same for every address, and only then looks the address up and mails a link: no
   * account-specific work happens before the answer, so its timing cannot reveal which addresses have
   * accounts (issue 14 item 2; OWASP Forgot Password Cheat Sheet, "consistent response time").
   */
  r.post('/reset/request', limiter, validate(resetRequestSchema), (req, res) => {
    const { email } = req.body as { email: string };
    const ip = req.ip;
    res.json({ ok: true, message: 'If that address has an account, a reset link is on its way.' });
    setImmediate(() => {
      auth.requestReset(email).then(
        (user) => logEvent('reset-requested', { userId: user?.id ?? null, emailHash: emailHash(email), ip }),
        (e: unknown) => logEvent('reset-request-failed', { emailHash: emailHash(email), ip, error: String(e) }, 'warn'),
      );
    });
  });

  r.post('/reset/confirm', limiter, validate(resetConfirmSchema), handle(async (req, res) => {
    const user = await auth.confirmReset(req.body);
    logEvent('password-reset', { userId: user.id, ip: req.ip });
    res.json({ ok: true, email: user.email });
  }));

  r.use(accountRouter(ctx, auth, store, throttle));
  return r;
}
