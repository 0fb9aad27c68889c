/**
 * The one small API client: JSON in and out, the session cookie, the CSRF header on every state-changing
 * request (fetched lazily, refreshed once on a 403 'csrf'), and a typed error carrying the server's
 * `{ error: { code, message, field? } }`. Components show the messages; this file never does.
 */
import { apiPaths } from './paths';

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
  ) {
    super(message);
  }
}

let csrfToken: string | null = null;
export function setCsrfToken(t: string | null) {
  csrfToken = t;
}
async function ensureCsrf(): Promise<string> {
  if (csrfToken) return csrfToken;
  const r = await fetch(apiPaths.auth.csrf(), { credentials: 'same-origin' });
  const body = await r.json();
  csrfToken = body.csrfToken as string;
  return csrfToken;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
export interface RequestOptions {
  body?: unknown;
  /** a FormData body is sent as multipart */
  signal?: AbortSignal;
  /** answer as a Blob (downloads) instead of JSON */
  blob?: boolean;
}

async function send<T>(method: Method, url: string, opts: RequestOptions = {}, retried = false): Promise<T> {
  const headers: Record<string, string> = {};
  let body: BodyInit | undefined;
  if (opts.body instanceof FormData) body = opts.body;
  else if (opts.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(opts.body);
  }
  if (method !== 'GET') headers['X-CSRF-Token'] = await ensureCsrf();
  let res: Response;
  try {
    res = await fetch(url, { method, headers, body, credentials: 'same-origin', signal: opts.signal });
  } catch (e) {
    if ((e as Error).name === 'AbortError') throw e;
    throw new ApiError(0, 'network', 'The server cannot be reached; check the connection and try again.');
  }
  if (!res.ok) {
    let err: { code?: string; message?: string; field?: string } = {};
    try {
      err = (await res.json()).error ?? {};
    } catch {
      /* not JSON */
    }
    if (res.status === 403 && err.code === 'csrf' && !retried) {
      csrfToken = null;
      return send<T>(method, url, opts, true);
    }
    throw new ApiError(res.status, err.code ?? 'http_' + res.status, err.message ?? `The server answered ${res.status}.`, err.field);
  }
  if (opts.blob) return (await res.blob()) as T;
  if (res.status === 204) return undefined as T;
  const json = await res.json();
  if (json && typeof json === 'object' && typeof json.csrfToken === 'string') csrfToken = json.csrfToken;
  return json as T;
}

export const api = {
  get: <T>(url: string, opts?: RequestOptions) => send<T>('GET', url, opts),
  post: <T>(url: string, body?: unknown, opts?: RequestOptions) => send<T>('POST', url, { ...opts, body }),
  put: <T>(url: string, body?: unknown, opts?: RequestOptions) => send<T>('PUT', url, { ...opts, body }),
  patch: <T>(url: string, body?: unknown, opts?: RequestOptions) => send<T>('PATCH', url, { ...opts, body }),
  delete: <T>(url: string, opts?: RequestOptions) => send<T>('DELETE', url, opts),
};
