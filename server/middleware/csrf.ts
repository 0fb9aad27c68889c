import crypto from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { AppError } from '../errors';

/** Synchroniser-token CSRF check: every POST/PUT/PATCH/DELETE carries the session's token in X-CSRF-Token. */
export function issueCsrfToken(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = crypto.randomBytes(24).toString('base64url');
  return req.session.csrfToken;
}

export const csrfCheck: RequestHandler = (req, _res, next) => {
  if (['GET', 'HEAD', 'OPTIONS'].includes(req.method)) return next();
  const sent = req.get('x-csrf-token') ?? '';
  const expected = req.session?.csrfToken ?? '';
  const ok = expected.length > 0 && sent.length === expected.length && crypto.timingSafeEqual(Buffer.from(sent), Buffer.from(expected));
  if (!ok) return next(new AppError(403, 'csrf', 'Missing or stale CSRF token: fetch GET /api/auth/csrf and send it as X-CSRF-Token.'));
  next();
};
