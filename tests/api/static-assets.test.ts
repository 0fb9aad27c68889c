/**
 * The built client is sent compressed and charts load only where they are drawn (issue 15, item 4): `vite build`
 * writes brotli and gzip copies of the text assets, the server sends the copy a client accepts (with
 * Content-Encoding, Vary and the original Content-Type, RFC 9110 §8.4 and §12.5.5), the plain file to a client
 * that accepts none, and recharts is in no chunk that the entry or a page imports statically.
 * Reads the real dist/: `npm test` (scripts/test.sh) builds it first.
 */
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, type GrisailleApp } from '../../server/app';
import { preferredCoding } from '../../server/middleware/static-assets';
import { allScripts, entryScripts, holdsRecharts, staticGraph } from '../../bench/client-graph';

const DIST = path.resolve('dist');
const BUILT = fs.existsSync(path.join(DIST, 'index.html'));
if (!BUILT) console.warn('static-assets.test.ts: skipped, dist/ is missing; run `npx vite build` first (npm test does)');

interface Answer {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: Buffer;
}

/** A raw request: no client library that would decode the body on its own. */
function send(port: number, url: string, headers: Record<string, string> = {}, method = 'GET'): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = http.request({ host: '127.0.0.1', port, path: url, method, headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.end();
  });
}

const plain = (url: string) => fs.readFileSync(path.join(DIST, url));

describe('Accept-Encoding negotiation', () => {
  const both = new Set(['br', 'gzip'] as const);
  it('prefers brotli, honours q-values and q=0, and sends plain without the header', () => {
    expect(preferredCoding('gzip, deflate, br', both)).toBe('br');
    expect(preferredCoding('br;q=0.5, gzip', both)).toBe('gzip');
    expect(preferredCoding('br;q=0, gzip', both)).toBe('gzip');
    expect(preferredCoding('*', both)).toBe('br');
    expect(preferredCoding('*, br;q=0', both)).toBe('gzip');
    expect(preferredCoding('identity', both)).toBeNull();
    expect(preferredCoding('gzip;q=0, br;q=0', both)).toBeNull();
    expect(preferredCoding(undefined, both)).toBeNull();
    expect(preferredCoding('', both)).toBeNull();
    expect(preferredCoding('br, gzip', new Set(['gzip'] as const))).toBe('gzip');
  });
});

describe.skipIf(!BUILT)('the built client, served compressed', () => {
  let g: GrisailleApp;
  let server: http.Server;
  let port: number;
  let entry: string;
  let css: string;

  beforeAll(async () => {
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-static-'));
    g = await createApp({ env: { dataDir, demo: true, nodeEnv: 'test', publicUrl: 'http://localhost:5178' }, seed: false, serveClient: true });
    server = g.app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    port = (server.address() as AddressInfo).port;
    entry = entryScripts(DIST)[0];
    css = /href="(\/assets\/[^"]+\.css)"/.exec(fs.readFileSync(path.join(DIST, 'index.html'), 'utf8'))![1];
  });
  afterAll(async () => {
    await new Promise((r) => server?.close(r));
    await g?.close();
  });

  it('writes a .br and a .gz beside every script and stylesheet of 1 kB and more, each decoding to the file', () => {
    const files = fs.readdirSync(path.join(DIST, 'assets')).filter((f) => /\.(js|css)$/.test(f));
    let checked = 0;
    for (const f of files) {
      const file = path.join(DIST, 'assets', f);
      const bytes = fs.readFileSync(file);
      if (bytes.length < 1024) {
        expect(fs.existsSync(`${file}.br`), `${f} is under 1 kB`).toBe(false);
        continue;
      }
      expect(zlib.brotliDecompressSync(fs.readFileSync(`${file}.br`)).equals(bytes), f).toBe(true);
      expect(zlib.gunzipSync(fs.readFileSync(`${file}.gz`)).equals(bytes), f).toBe(true);
      expect(fs.statSync(`${file}.br`).size, f).toBeLessThan(bytes.length);
      checked++;
    }
    expect(checked).toBeGreaterThan(10);
  });

  it('sends the brotli copy to a client that accepts br, with the JavaScript type, Vary and the long cache', async () => {
    const r = await send(port, entry, { 'Accept-Encoding': 'gzip, deflate, br' });
    expect(r.status).toBe(200);
    expect(r.headers['content-encoding']).toBe('br');
    expect(r.headers['content-type']).toBe('text/javascript; charset=utf-8');
    expect(r.headers.vary).toMatch(/accept-encoding/i);
    expect(r.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(Number(r.headers['content-length'])).toBe(r.body.length);
    expect(r.body.length).toBeLessThan(plain(entry).length / 2);
    expect(zlib.brotliDecompressSync(r.body).equals(plain(entry))).toBe(true);
  });

  it('sends the gzip copy to a gzip-only client', async () => {
    const r = await send(port, entry, { 'Accept-Encoding': 'gzip' });
    expect(r.headers['content-encoding']).toBe('gzip');
    expect(r.headers['content-type']).toBe('text/javascript; charset=utf-8');
    expect(r.headers.vary).toMatch(/accept-encoding/i);
    expect(zlib.gunzipSync(r.body).equals(plain(entry))).toBe(true);
  });

  it('sends the plain file without Accept-Encoding, to identity only, or when br and gzip are refused', async () => {
    for (const headers of [{}, { 'Accept-Encoding': 'identity' }, { 'Accept-Encoding': 'br;q=0, gzip;q=0' }] as Record<string, string>[]) {
      const r = await send(port, entry, headers);
      expect(r.status).toBe(200);
      expect(r.headers['content-encoding'], JSON.stringify(headers)).toBeUndefined();
      expect(r.headers['content-type']).toBe('text/javascript; charset=utf-8');
      expect(r.headers.vary).toMatch(/accept-encoding/i); // a cache must still key on the header
      expect(r.headers['cache-control']).toBe('public, max-age=31536000, immutable');
      expect(r.body.equals(plain(entry))).toBe(true);
    }
  });

  it('gives each encoding its own ETag and answers a revalidation with 304', async () => {
    const br = await send(port, entry, { 'Accept-Encoding': 'br' });
    const none = await send(port, entry);
    expect(br.headers.etag).toBeTruthy();
    expect(br.headers.etag).not.toBe(none.headers.etag);
    const again = await send(port, entry, { 'Accept-Encoding': 'br', 'If-None-Match': br.headers.etag! });
    expect(again.status).toBe(304);
    expect(again.body.length).toBe(0);
  });

  it('answers HEAD with the headers of the copy it would send and no body', async () => {
    const r = await send(port, entry, { 'Accept-Encoding': 'br' }, 'HEAD');
    expect(r.status).toBe(200);
    expect(r.headers['content-encoding']).toBe('br');
    expect(r.headers['content-type']).toBe('text/javascript; charset=utf-8');
    expect(Number(r.headers['content-length'])).toBe(fs.statSync(path.join(DIST, `${entry}.br`)).size);
    expect(r.body.length).toBe(0);
  });

  it('serves a Range request from the plain file, never a range of a compressed copy', async () => {
    const r = await send(port, entry, { 'Accept-Encoding': 'br, gzip', Range: 'bytes=0-99' });
    expect(r.status).toBe(206);
    expect(r.headers['content-encoding']).toBeUndefined();
    expect(r.headers['content-range']).toBe(`bytes 0-99/${plain(entry).length}`);
    expect(r.body.equals(plain(entry).subarray(0, 100))).toBe(true);
    // a compressed answer does not offer ranges (RFC 9110 §14.3)
    expect((await send(port, entry, { 'Accept-Encoding': 'br' })).headers['accept-ranges']).toBe('none');
  });

  it('sends stylesheets compressed as text/css', async () => {
    const r = await send(port, css, { 'Accept-Encoding': 'br' });
    expect(r.headers['content-encoding']).toBe('br');
    expect(r.headers['content-type']).toBe('text/css; charset=utf-8');
    expect(zlib.brotliDecompressSync(r.body).equals(plain(css))).toBe(true);
  });

  it('sends a file with no copy (under 1 kB) plain, whatever the client accepts', async () => {
    const small = allScripts(DIST).find((u) => fs.statSync(path.join(DIST, u)).size < 1024)!;
    const r = await send(port, small, { 'Accept-Encoding': 'br, gzip' });
    expect(r.status).toBe(200);
    expect(r.headers['content-encoding']).toBeUndefined();
    expect(r.body.equals(plain(small))).toBe(true);
  });

  it('still serves index.html for a client route, revalidated on every use (RFC 9111 §5.2.2.4)', async () => {
    const html = fs.readFileSync(path.join(DIST, 'index.html'));
    for (const url of ['/p/1/looks', '/', '/index.html']) {
      const r = await send(port, url, { 'Accept-Encoding': 'br, gzip' });
      expect(r.status, url).toBe(200);
      expect(r.headers['content-type']).toBe('text/html; charset=utf-8');
      expect(r.headers['cache-control']).toBe('no-cache');
      const body = r.headers['content-encoding'] === 'br' ? zlib.brotliDecompressSync(r.body) : r.headers['content-encoding'] === 'gzip' ? zlib.gunzipSync(r.body) : r.body;
      expect(body.equals(html), url).toBe(true);
    }
    const head = await send(port, '/p/1/looks', {}, 'HEAD');
    expect(head.status).toBe(200);
    expect(head.body.length).toBe(0);
  });

  it('answers 404 for a hashed file that is not in the build (an old page after a deploy), never index.html', async () => {
    const r = await send(port, '/assets/index-00000000.js', { 'Accept-Encoding': 'br, gzip' });
    expect(r.status).toBe(404);
    expect(r.headers['content-type']).toMatch(/^text\/plain/);
  });

  it('keeps files outside dist/ out of reach and API routes to the API', async () => {
    for (const url of ['/assets/..%2f..%2fpackage.json', '/..%2fpackage.json', '/assets/%2e%2e/%2e%2e/package.json']) {
      const r = await send(port, url, { 'Accept-Encoding': 'br, gzip' });
      expect(r.body.toString('latin1'), url).not.toContain('"name": "grisaille"');
    }
    const api = await send(port, '/api/no-such-route', { 'Accept-Encoding': 'br' });
    expect(api.status).toBe(404);
    expect(api.headers['content-type']).toMatch(/application\/json/);
  });

  it('leaves recharts out of the entry and of every page: only the chart drawings import it', () => {
    const charts = allScripts(DIST).filter((u) => holdsRecharts(DIST, u));
    expect(charts.length, 'a chunk with recharts in it (the mark may have changed)').toBeGreaterThan(0);
    const first = staticGraph(DIST, entryScripts(DIST));
    expect(first.filter((u) => charts.includes(u))).toEqual([]);
    const pages = fs.readdirSync('src/app/routes').filter((f) => f.endsWith('.tsx')).map((f) => f.slice(0, -'.tsx'.length));
    const pageChunks = allScripts(DIST).filter((u) => pages.some((p) => new RegExp(`^/assets/${p}-[\\w-]{8}\\.js$`).test(u)));
    expect(pageChunks.map((u) => path.basename(u).replace(/-[\w-]{8}\.js$/, ''))).toEqual(expect.arrayContaining(['bench', 'library', 'exposure-sheet', 'looks-compare']));
    for (const page of pageChunks) expect(staticGraph(DIST, [page]).filter((u) => charts.includes(u)), page).toEqual([]);
    // the drawings pull recharts in when a chart is first drawn
    const drawings = allScripts(DIST).filter((u) => /-drawing-[\w-]{8}\.js$/.test(u));
    expect(drawings.length).toBe(3);
    for (const d of drawings) expect(staticGraph(DIST, [d]).some((u) => charts.includes(u)), d).toBe(true);
  });
});
