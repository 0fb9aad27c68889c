import crypto from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { AppError } from '../errors';
import { logEvent } from '../services/log';
import { authCookies, readCookie, type AuthCookies } from '../modules/auth/cookies';
import type { Env } from '../env';

/**
 * CSRF protection for every POST/PUT/PATCH/DELETE under /api: the client sends a token in X-CSRF-Token.
 *
 * - Signed in: the session's own token (synchroniser token pattern), as before.
 * - Anonymous (sign-in, setup, reset, accepting an invitation): a "signed double-submit cookie" (OWASP CSRF
 *   Prevention Cheat Sheet): a random value in an httpOnly, SameSite=Lax cookie and the token
 *   HMAC-SHA256(secret, value). Nothing is stored on the server, so anonymous visits write no session row
 *   (issue 14 item 3). Over https the cookie carries the __Host- prefix (see cookies.ts), so a subdomain
 *   cannot plant a value of its own.
 */
export interface CsrfConfig {
  /** the session secret; the anonymous token is an HMAC under it */
  secret: string;
  cookies: AuthCookies;
}

/** The configuration from the environment: the session secret and the cookie names for the public URL. */
export function csrfConfig(env: Pick<Env, 'sessionSecret' | 'publicUrl'>): CsrfConfig {
  return { secret: env.sessionSecret, cookies: authCookies(env.publicUrl) };
}

/** The signed-in session's token, made on first use (logIn clears it, so each sign-in gets a fresh one). */
export function sessionCsrfToken(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = crypto.randomBytes(24).toString('base64url');
  return req.session.csrfToken;
}

/** 32 random bytes as base64url (43 characters); anything else in the cookie is replaced */
const COOKIE_VALUE = /^[A-Za-z0-9_-]{43}$/;

/** HMAC of the cookie's value; the 'csrf:' label keeps it apart from the session cookie's own signature under the same secret. */
function anonymousToken(secret: string, value: string): string {
  return crypto.createHmac('sha256', secret).update(`csrf:${value}`).digest('base64url');
}

/** The anonymous visitor's cookie value, when it has a well-formed one. */
function anonymousCookie(req: Request, cfg: CsrfConfig): string | undefined {
  const v = readCookie(req.headers.cookie, cfg.cookies.csrf);
  return v && COOKIE_VALUE.test(v) ? v : undefined;
}

/** The anonymous token, setting the cookie first when the visitor has none. */
function anonymousCsrfToken(req: Request, res: Response, cfg: CsrfConfig): string {
  let value = anonymousCookie(req, cfg);
  if (!value) {
    value = crypto.randomBytes(32).toString('base64url');
    res.cookie(cfg.cookies.csrf, value, cfg.cookies.options);
  }
  return anonymousToken(cfg.secret, value);
}

/** The token the client should send: the session's when signed in, else the anonymous cookie's. */
export function issueCsrfToken(req: Request, res: Response, cfg: CsrfConfig): string {
  return req.user ? sessionCsrfToken(req) : anonymousCsrfToken(req, res, cfg);
}

/** What the request's token must equal, or '' when there is nothing to compare with. */
function expectedToken(req: Request, cfg: CsrfConfig): string {
  if (req.user) return req.session?.csrfToken ?? '';
  const value = anonymousCookie(req, cfg);
  return value ? anonymousToken(cfg.secret, value) : '';
}

function sameToken(sent: string, expected: string): boolean {
  const a = Buffer.from(sent);
  const b = Buffer.from(expected);
  return b.length > 0 && a.length === b.length && crypto.timingSafeEqual(a, b);
}

/** The path for the operator's log, with long segments (invitation and reset tokens) masked. */
function loggedPath(req: Request): string {
  return req.originalUrl.split('?')[0].split('/').map((s) => (s.length >= 24 ? ':token' : s)).join('/');
}

/** Refuses a state-changing request without the right token (403 'csrf') and logs it for the operator. */
export function csrfCheck(cfg: CsrfConfig): RequestHandler {
  return (req, _res, next) => {
    if (['GET', 'HEAD', 'OPTIONS'].includes(req.method)) return next();
    if (sameToken(req.get('x-csrf-token') ?? '', expectedToken(req, cfg))) return next();
    logEvent('csrf-refused', { method: req.method, path: loggedPath(req), ip: req.ip, userId: req.user?.id ?? null }, 'warn');
    next(new AppError(403, 'csrf', 'Missing or stale CSRF token: fetch GET /api/auth/csrf and send it as X-CSRF-Token.'));
  };
}
