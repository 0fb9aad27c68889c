import { Router } from 'express';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { requireAuth } from '../../middleware/require-role';
import { AppError } from '../../errors';
import { logEvent } from '../../services/log';
import { handle } from '../route-registry';
import { changePasswordSchema } from '../../../shared/schemas/auth';
import type { AuthService } from './auth.service';
import { SessionsService } from './sessions.service';
import { startSession } from './log-in';
import { emailHash, type SignInThrottle } from './sign-in-throttle';
import type { TypeormSessionStore } from './session-store';

/**
 * The signed-in user's own account (mounted under /api/auth): change the password, list the sessions,
 * end one or all others. Every route needs a session (401 without).
 */
export function accountRouter(ctx: AppContext, auth: AuthService, store: TypeormSessionStore, throttle: SignInThrottle): Router {
  const r = Router();
  const sessions = new SessionsService(ctx.ds, store);

  /**
   * Wrong current password → 400 naming currentPassword, counted by the account's sign-in throttle (a
   * stolen session cannot guess it at will). On success every other session ends and this browser stays
   * signed in on a fresh session id, with a fresh CSRF token.
   */
  r.post('/password', requireAuth, validate(changePasswordSchema), handle(async (req, res) => {
    const me = req.user!;
    const waitMs = await throttle.lockedForMs(me.email);
    if (waitMs > 0) {
      logEvent('sign-in-throttled', { userId: me.id, emailHash: emailHash(me.email), ip: req.ip }, 'warn');
      res.set('Retry-After', String(Math.ceil(waitMs / 1000)));
      throw new AppError(429, 'rate_limited', 'Too many wrong passwords for this account; wait a few minutes and try again.');
    }
    let user;
    try {
      user = await auth.changePassword(me.id, req.body);
    } catch (e) {
      if (e instanceof AppError && e.field === 'currentPassword') {
        await throttle.failed(me.email);
        logEvent('password-change-failed', { userId: me.id, ip: req.ip }, 'warn');
      }
      throw e;
    }
    await throttle.succeeded(me.email);
    const csrfToken = await startSession(req, user);
    logEvent('password-changed', { userId: user.id, ip: req.ip });
    res.json({ ok: true, csrfToken });
  }));

  r.get('/sessions', requireAuth, handle(async (req, res) => {
    res.json({ sessions: await sessions.list(req.user!.id, req.sessionID) });
  }));

  r.post('/sessions/end-others', requireAuth, handle(async (req, res) => {
    const ended = await sessions.endOthers(req.user!.id, req.sessionID);
    logEvent('sessions-ended', { userId: req.user!.id, ip: req.ip, count: ended });
    res.json({ ended });
  }));

  r.delete('/sessions/:id', requireAuth, handle(async (req, res) => {
    await sessions.end(req.user!.id, String(req.params.id), req.sessionID);
    logEvent('sessions-ended', { userId: req.user!.id, ip: req.ip, count: 1 });
    res.status(204).end();
  }));

  return r;
}
