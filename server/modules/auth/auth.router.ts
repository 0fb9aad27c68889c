import { Router } from 'express';
import rateLimit from 'express-rate-limit';
import type passport from 'passport';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { issueCsrfToken } from '../../middleware/csrf';
import { AppError } from '../../errors';
import { resetConfirmSchema, resetRequestSchema, setupSchema, signInSchema, type MeResponse } from '../../../shared/schemas/auth';
import { AuthService, publicUser } from './auth.service';
import type { User } from '../../db/entities/user.entity';
import type { Request } from 'express';

/** Signs the user in on a fresh session id and answers with a fresh CSRF token. */
function logIn(req: Request, user: User): Promise<string> {
  return new Promise((resolve, reject) =>
    req.login(user, (err) => {
      if (err) return reject(err);
      req.session.csrfToken = undefined;
      resolve(issueCsrfToken(req));
    }),
  );
}
export { logIn };

export function authRouter(ctx: AppContext, pp: passport.PassportStatic): Router {
  const r = Router();
  const auth = new AuthService(ctx.ds, ctx.mail, ctx.env.publicUrl);
  const limiter = rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: ctx.env.authRateLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'Too many attempts; wait a few minutes and try again.')),
  });

  r.get('/csrf', (req, res) => {
    res.json({ csrfToken: issueCsrfToken(req) });
  });

  r.get('/me', async (req, res) => {
    const body: MeResponse = { user: req.user ? publicUser(req.user) : null, needsSetup: await auth.needsSetup(), demo: ctx.env.demo };
    res.json(body);
  });

  r.post('/sign-in', limiter, validate(signInSchema), (req, res, next) => {
    pp.authenticate('local', { session: false }, (err: unknown, user: User | false) => {
      if (err) return next(err);
      if (!user) return next(new AppError(401, 'bad_credentials', 'That e-mail and password do not match an account.'));
      logIn(req, user).then((csrfToken) => res.json({ user: publicUser(user), csrfToken }), next);
    })(req, res, next);
  });

  r.post('/sign-out', (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy((e) => {
        if (e) return next(e);
        res.clearCookie('grisaille.sid');
        res.json({ ok: true });
      });
    });
  });

  r.post('/setup', limiter, validate(setupSchema), async (req, res, next) => {
    try {
      const user = await auth.setup(req.body);
      const csrfToken = await logIn(req, user);
      res.status(201).json({ user: publicUser(user), csrfToken });
    } catch (e) {
      next(e);
    }
  });

  r.post('/reset/request', limiter, validate(resetRequestSchema), async (req, res, next) => {
    try {
      await auth.requestReset(req.body.email);
      res.json({ ok: true, message: 'If that address has an account, a reset link is on its way.' });
    } catch (e) {
      next(e);
    }
  });

  r.post('/reset/confirm', limiter, validate(resetConfirmSchema), async (req, res, next) => {
    try {
      const user = await auth.confirmReset(req.body);
      res.json({ ok: true, email: user.email });
    } catch (e) {
      next(e);
    }
  });

  return r;
}
