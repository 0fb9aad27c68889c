import type { Request, RequestHandler } from 'express';
import type { z } from 'zod';
import { AppError, InvalidError } from '../errors';
// importing messages.ts installs the plain messages (zod's global error map)
import { fieldLabel } from '../../shared/schemas/messages';

/** A message as a sentence: a capital first letter and a full stop ("coverage goes from 0 to 1" → "Coverage goes from 0 to 1."). */
function sentence(message: string): string {
  const t = message.trim();
  if (!t) return 'This value is not accepted.';
  return `${t.charAt(0).toUpperCase()}${t.slice(1)}${/[.!?…)]$/.test(t) ? '' : '.'}`;
}

/**
 * A schema's own terse range wording ("must be 0..1", "must be 0..255", as the engine's source schemas
 * say it) in plain words naming the field: "Coverage goes from 0 to 1."
 */
function plainRange(message: string, path: readonly PropertyKey[]): string {
  const m = /^must be (-?[\d.]+)\s*\.\.\s*(-?[\d.]+)$/.exec(message.trim());
  if (!m) return sentence(message);
  const { label, plural } = fieldLabel(path);
  return `${label.charAt(0).toUpperCase()}${label.slice(1)} ${plural ? 'go' : 'goes'} from ${m[1]} to ${m[2]}.`;
}

/**
 * Turns the first zod issue into a 400 naming the field path and saying what is wrong in plain words,
 * e.g. `origin.colour.rgb.0: RGB values go from 0 to 255.` (shared/schemas/messages.ts).
 */
export function zodToInvalid(err: z.ZodError): InvalidError {
  const issue = err.issues[0];
  const path = issue?.path.map(String) ?? [];
  // an unknown key is named by the key itself
  if (issue && issue.code === 'unrecognized_keys' && 'keys' in issue && Array.isArray(issue.keys) && issue.keys.length) path.push(String(issue.keys[0]));
  const field = path.join('.') || undefined;
  const text = issue ? plainRange(issue.message, issue.path) : 'Invalid input.';
  const message = field ? `${field}: ${text}` : text;
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

/**
 * Multipart bodies are read as they arrive (multer does not decompress): one sent with a Content-Encoding
 * other than `identity` would be read as a damaged form, so it is refused with a 415 saying why (RFC 9110
 * §15.5.16: 415 for a content coding the server does not accept). Null when the request may go on.
 */
export function plainMultipartOnly(req: Request): AppError | null {
  const coding = String(req.headers['content-encoding'] ?? 'identity').trim().toLowerCase();
  if (coding === '' || coding === 'identity') return null;
  return new AppError(
    415,
    'unsupported_encoding',
    `An upload is sent uncompressed; its Content-Encoding "${coding.slice(0, 40)}" is not accepted (image files are compressed already).`,
    'file',
  );
}
