import type { ErrorRequestHandler } from 'express';
import { AppError, RetryLaterError } from '../errors';

/** An error body: `{ error: { code, message, field? } }` with its status. */
interface Answer {
  status: number;
  code: string;
  message: string;
  field?: string;
}

/** A property of an unknown error, when it has one. */
function prop(err: unknown, key: string): unknown {
  return err && typeof err === 'object' && key in err ? (err as Record<string, unknown>)[key] : undefined;
}

/**
 * body-parser's errors (http-errors with a `type`) in plain words. Every one is the client's: the body was
 * not what its headers said, or not what the server reads (JSON in UTF-8, uncompressed or gzip/deflate/br).
 */
function bodyParserAnswer(type: string, err: unknown): Answer | null {
  switch (type) {
    case 'entity.parse.failed':
      return { status: 400, code: 'invalid', message: 'The request body is not valid JSON.' };
    case 'entity.too.large':
      return { status: 413, code: 'too_large', message: 'The request body is too large.' };
    case 'encoding.unsupported':
      return {
        status: 415,
        code: 'unsupported_encoding',
        message: `The request body's Content-Encoding "${String(prop(err, 'encoding') ?? '').slice(0, 40)}" is not accepted; send it uncompressed, or compressed with gzip, deflate or br.`,
      };
    case 'charset.unsupported':
      return {
        status: 415,
        code: 'unsupported_charset',
        message: `The request body's charset "${String(prop(err, 'charset') ?? '').slice(0, 40)}" is not accepted; send JSON in UTF-8.`,
      };
    case 'request.aborted':
      return { status: 400, code: 'invalid', message: 'The request body ended before it was complete.' };
    case 'request.size.invalid':
      return { status: 400, code: 'invalid', message: 'The request body is not as long as its Content-Length says.' };
    default:
      return null;
  }
}

/**
 * What busboy (under multer) throws for a multipart body it cannot read: plain Errors known by their
 * message (busboy 1.6 lib/index.js and lib/types/multipart.js), since they carry no code or status.
 */
const MULTIPART_ERRORS: [RegExp, string][] = [
  [/^Multipart: Boundary not found$/, 'The upload is multipart/form-data without a boundary; send it as a form (the browser and HTTP clients add the boundary themselves).'],
  [/^Unexpected end of (form|file)$/, 'The upload ended before it was complete (the form is cut short); send the file again.'],
  [/^Malformed part header$/, 'The upload has a damaged part header; send the file again as multipart/form-data.'],
  [/^(Malformed content type|Missing Content-Type|Unsupported content type: .*)$/, 'The upload is not a multipart/form-data body; send the file as a form.'],
  [/^Malformed urlencoded form$/, 'The form body is damaged.'],
];

/** An error from zlib while inflating a body: its codes are Z_DATA_ERROR, Z_BUF_ERROR … (node:zlib). */
const isZlibError = (err: unknown) => typeof prop(err, 'code') === 'string' && /^Z_[A-Z_]+$/.test(prop(err, 'code') as string);

/** The answer to an error that is not one of ours, when it is the client's fault; null for a server fault (500). */
export function clientErrorAnswer(err: unknown): Answer | null {
  const type = prop(err, 'type');
  if (typeof type === 'string') {
    const a = bodyParserAnswer(type, err);
    if (a) return a;
  }
  if (isZlibError(err)) {
    return { status: 400, code: 'invalid', message: 'The request body is not valid compressed data for its Content-Encoding (gzip, deflate or br); send it again, or uncompressed.' };
  }
  if (prop(err, 'code') === 'LIMIT_FILE_SIZE') return { status: 413, code: 'too_large', message: 'The file is too large.', field: 'file' };
  const message = err instanceof Error ? err.message : '';
  for (const [re, text] of MULTIPART_ERRORS) if (re.test(message)) return { status: 400, code: 'invalid', message: text, field: 'file' };
  // any other http-errors error the library meant to show (expose) with a 4xx status keeps its status,
  // with our own words (the library's message is for developers)
  const status = Number(prop(err, 'status') ?? prop(err, 'statusCode'));
  if (prop(err, 'expose') === true && Number.isInteger(status) && status >= 400 && status < 500) {
    return { status, code: status === 415 ? 'unsupported' : status === 413 ? 'too_large' : 'invalid', message: 'The request could not be read: its headers or body are not in a form the server accepts.' };
  }
  return null;
}

/** The one error middleware: typed errors keep their status; the client's bad bodies are 4xx; anything else is a 500 without a stack trace. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  const a: Answer | null = err instanceof AppError ? { status: err.status, code: err.code, message: err.message, field: err.field } : clientErrorAnswer(err);
  if (res.headersSent) {
    // an error after the answer began (a stream failed half-way): nothing more can be said; an answer already
    // complete (e.g. the 408 of a stalled body, whose parser then reports the abort) is left to be delivered
    if (!res.writableFinished) res.destroy();
    return;
  }
  if (err instanceof RetryLaterError) res.set('Retry-After', String(err.retryAfterS));
  if (a) {
    res.status(a.status).json({ error: { code: a.code, message: a.message, ...(a.field ? { field: a.field } : {}) } });
    return;
  }
  if (process.env.NODE_ENV !== 'test' || process.env.GRISAILLE_LOG_ERRORS) console.error(err);
  res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on the server.' } });
};
