import type { ErrorRequestHandler } from 'express';
import { AppError } from '../errors';

/** The one error middleware: typed errors keep their status; anything else is a 500 without a stack trace. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  if (err instanceof AppError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.field ? { field: err.field } : {}) } });
    return;
  }
  if (err && typeof err === 'object' && 'type' in err && err.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'invalid', message: 'The request body is not valid JSON.' } });
    return;
  }
  if (err && typeof err === 'object' && 'type' in err && err.type === 'entity.too.large') {
    res.status(413).json({ error: { code: 'too_large', message: 'The request body is too large.' } });
    return;
  }
  if (err && typeof err === 'object' && 'code' in err && err.code === 'LIMIT_FILE_SIZE') {
    res.status(413).json({ error: { code: 'too_large', message: 'The file is too large.', field: 'file' } });
    return;
  }
  if (process.env.NODE_ENV !== 'test' || process.env.GRISAILLE_LOG_ERRORS) console.error(err);
  res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on the server.' } });
};
