import type { RequestHandler } from 'express';

/**
 * Every API answer is private to its user: `Cache-Control: no-store` (RFC 9111 §5.2.2.5) so no shared or
 * browser cache keeps it, unless a route sets its own policy afterwards (a photo's immutable files say
 * `private, max-age=…`: a private cache only, keyed by an address that changes with the content).
 */
export const privateAnswers: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};
