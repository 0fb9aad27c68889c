import fs from 'node:fs';
import path from 'node:path';
import express, { type NextFunction, type Request, type RequestHandler, type Response } from 'express';

/**
 * Serving the built client (dist/) with the brotli and gzip copies that `vite build` writes beside each text
 * or font file of 1 kB and more (vite.config.ts). The files themselves are sent by express.static
 * (serve-static), which keeps path traversal out, answers HEAD, conditional and Range requests, and sets
 * ETag and Last-Modified from the file actually sent (so each encoding has its own validator).
 */

/** Content codings we have copies for, in our order of preference (brotli is the smaller). */
const ENCODINGS = [
  { coding: 'br', ext: '.br' },
  { coding: 'gzip', ext: '.gz' },
] as const;
type Coding = (typeof ENCODINGS)[number]['coding'];

/** Hashed build output: the name changes with the content, so a cache may keep it for good (common practice). */
const IMMUTABLE = 'public, max-age=31536000, immutable';
/** index.html names the current hashed files: kept, but revalidated on every use (RFC 9111 §5.2.2.4 no-cache). */
const REVALIDATE = 'no-cache';
/** Anything else at the top of dist/ (favicon): an hour, as before. */
const SHORT = 'public, max-age=3600';

/**
 * The q-value the request's Accept-Encoding gives each of our codings (RFC 9110 §12.5.3): a coding named
 * with q=0 is refused, `*` stands for the ones not named. Without the header no coding is used: the plain file
 * is what every client understands.
 */
export function preferredCoding(acceptEncoding: string | undefined, available: ReadonlySet<Coding>): Coding | null {
  if (!acceptEncoding) return null;
  const q = new Map<string, number>();
  for (const part of acceptEncoding.split(',')) {
    const [name, ...params] = part.trim().toLowerCase().split(';');
    if (!name) continue;
    const qParam = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
    const value = qParam ? Number(qParam.slice(2)) : 1;
    q.set(name, Number.isFinite(value) ? value : 0);
  }
  let best: Coding | null = null;
  let bestQ = 0;
  for (const { coding } of ENCODINGS) {
    if (!available.has(coding)) continue;
    const value = q.get(coding) ?? (coding === 'gzip' ? q.get('x-gzip') : undefined) ?? q.get('*') ?? 0;
    if (value > bestQ) [best, bestQ] = [coding, value]; // ties keep the earlier (preferred) coding
  }
  return best;
}

/** URL path (`/assets/index-abc.js`) → the codings that have a copy beside the file, read once from `root`. */
function findCopies(root: string): Map<string, Set<Coding>> {
  const copies = new Map<string, Set<Coding>>();
  if (!fs.existsSync(root)) return copies; // no build yet: express.static answers nothing either
  const files = fs.readdirSync(root, { recursive: true, withFileTypes: true }).filter((d) => d.isFile());
  const present = new Set(files.map((d) => path.join(d.parentPath, d.name)));
  for (const file of present) {
    for (const { coding, ext } of ENCODINGS) {
      if (!file.endsWith(ext) || !present.has(file.slice(0, -ext.length))) continue;
      const url = '/' + path.relative(root, file.slice(0, -ext.length)).split(path.sep).join('/');
      if (!copies.has(url)) copies.set(url, new Set());
      copies.get(url)!.add(coding);
    }
  }
  return copies;
}

/** Cache-Control and, for a compressed copy, Content-Encoding and the original file's Content-Type. */
function setHeaders(root: string) {
  const assetsDir = path.join(root, 'assets') + path.sep;
  return (res: Response, file: string) => {
    const encoded = ENCODINGS.find((e) => file.endsWith(e.ext));
    const original = encoded ? file.slice(0, -encoded.ext.length) : file;
    if (encoded) {
      res.setHeader('Content-Encoding', encoded.coding);
      res.type(path.extname(original)); // text/javascript for app.js.br, not the type of a .br file
      // byte ranges are offered on the plain file only: no range of a compressed stream (RFC 9110 §14.3)
      res.setHeader('Accept-Ranges', 'none');
    }
    res.setHeader('Cache-Control', original.startsWith(assetsDir) ? IMMUTABLE : path.basename(original) === 'index.html' ? REVALIDATE : SHORT);
  };
}

export interface StaticAssets {
  /** serves a file of `root`, its brotli or gzip copy when the client accepts one; passes on when none exists */
  files: RequestHandler;
  /** serves `root`/index.html the same way (the client's routes: /p/1/looks…) */
  index: RequestHandler;
}

/** The built client's files, precompressed copies preferred (br, then gzip) when the request accepts them. */
export function staticAssets(root: string): StaticAssets {
  const copies = findCopies(root);
  const serve = express.static(root, { index: false, cacheControl: false, setHeaders: setHeaders(root) });

  const files: RequestHandler = (req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const available = copies.get(req.path);
    if (!available) return serve(req, res, next);
    res.vary('Accept-Encoding'); // the same URL answers differently by Accept-Encoding (RFC 9110 §12.5.5)
    // a Range request gets a range of the plain file: ranges of a compressed copy confuse clients and caches
    const coding = req.headers.range ? null : preferredCoding(req.headers['accept-encoding'], available);
    if (!coding) return serve(req, res, next);
    const url = req.url;
    const query = url.indexOf('?');
    req.url = req.path + ENCODINGS.find((e) => e.coding === coding)!.ext + (query >= 0 ? url.slice(query) : '');
    serve(req, res, (err?: unknown) => {
      req.url = url; // the copy vanished (dist/ rebuilt under a running server): later handlers see the real URL
      next(err);
    });
  };

  const index: RequestHandler = (req, res, next) => {
    const url = req.url;
    req.url = '/index.html';
    files(req, res, (err?: unknown) => {
      req.url = url;
      next(err);
    });
  };

  return { files, index };
}
