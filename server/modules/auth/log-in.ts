import type { Request } from 'express';
import type { User } from '../../db/entities/user.entity';
import { sessionCsrfToken } from '../../middleware/csrf';
import { logEvent } from '../../services/log';

/**
 * Starts a signed-in session for `user` on a fresh session id (passport regenerates it, against session
 * fixation), notes the browser and address for the session list, and answers the session's new CSRF token.
 */
export function startSession(req: Request, user: User): Promise<string> {
  return new Promise((resolve, reject) =>
    req.login(user, (err) => {
      if (err) return reject(err);
      req.session.csrfToken = undefined;
      req.session.client = { userAgent: (req.get('user-agent') ?? '').slice(0, 160), ip: req.ip ?? '' };
      resolve(sessionCsrfToken(req));
    }),
  );
}

/**
 * Signs the user in (sign-in, first account, accepting an invitation) and logs 'sign-in' for the operator
 * with the route it came through (its pattern, so no token from the path reaches the log).
 */
export async function logIn(req: Request, user: User): Promise<string> {
  const token = await startSession(req, user);
  logEvent('sign-in', { userId: user.id, ip: req.ip, route: `${req.baseUrl}${req.route?.path ?? ''}`.replace(/\/[A-Za-z0-9_-]{24,}/g, '/:token') });
  return token;
}
