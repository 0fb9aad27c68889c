import type { RequestHandler } from 'express';
import { logEvent } from '../services/log';

/**
 * A request whose body stalls (a slow or short body: fewer bytes than its Content-Length, then silence) is
 * answered 408 after `idleMs` without a byte and its connection closed, instead of holding a socket and a
 * parser until the server's overall request timeout. Only requests that carry a body are watched; the
 * watch ends when the body has arrived.
 */
export function bodyIdleTimeout(idleMs: number): RequestHandler {
  return (req, res, next) => {
    const hasBody = Number(req.headers['content-length'] ?? 0) > 0 || req.headers['transfer-encoding'] !== undefined;
    if (!hasBody || idleMs <= 0) return next();
    const socket = req.socket;
    const onTimeout = () => {
      logEvent('body-timeout', { method: req.method, path: req.originalUrl.split('?')[0], ip: req.ip }, 'warn');
      if (!res.headersSent) {
        res.status(408).set('Connection', 'close').json({
          error: { code: 'timeout', message: `The request body stopped arriving (nothing for ${Math.round(idleMs / 1000)} s); send it again.` },
        });
      }
      // end (not destroy) once the answer is written, so it is flushed before the connection closes
      if (res.writableFinished) socket.end();
      else res.on('finish', () => socket.end());
      setTimeout(() => socket.destroy(), 2000).unref();
    };
    // on the request (not the socket): the HTTP server destroys a timed-out socket unless the request handles it
    req.setTimeout(idleMs, onTimeout);
    const done = () => {
      socket.setTimeout(0);
      req.off('timeout', onTimeout);
    };
    req.on('end', done);
    req.on('close', done);
    res.on('finish', done);
    next();
  };
}
