import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { InvalidError } from '../errors';

/** Turns the first zod issue into a 400 naming the field path, e.g. `swatches.2.srgb`. */
export function zodToInvalid(err: z.ZodError): InvalidError {
  const issue = err.issues[0];
  const path = issue?.path.map(String) ?? [];
  // an unknown key is named by the key itself
  if (issue && issue.code === 'unrecognized_keys' && 'keys' in issue && Array.isArray(issue.keys) && issue.keys.length) path.push(String(issue.keys[0]));
  const field = path.join('.') || undefined;
  const message = field ? `${field}: ${issue.message}` : (issue?.message ?? 'Invalid input.');
  return new InvalidError(message, field);
}

/** Checks `req[where]` against a schema; on success replaces it with the parsed value. */
export function validate<S extends z.ZodType>(schema: S, where: 'body' | 'query' | 'params' = 'body'): RequestHandler {
  return (req, _res, next) => {
    const result = schema.safeParse(req[where]);
    if (!result.success) return next(zodToInvalid(result.error));
    if (where === 'body') req.body = result.data;
    else Object.defineProperty(req, where, { value: result.data, writable: true, configurable: true });
    next();
  };
}
