/**
 * The client's weight, from a fresh `vite build` of the working tree into a temporary folder (dist/ is left alone):
 * - client_js_kb / client_js_br_kb: the JavaScript a first page load fetches (index.html's module script and
 *   modulepreload links and all they import statically, bench/client-graph.ts), as built and as sent to a
 *   client that accepts brotli (the build's .br copy, or the file itself when it has none);
 * - client_js_gz_kb: the same for a gzip-only client;
 * - client_js_total_kb / client_js_total_br_kb: every chunk, lazy pages and charts included;
 * - client_pages_with_recharts: pages (src/app/routes) whose chunk pulls recharts in statically (target 0:
 *   charts load when drawn).
 * Sizes, not times: they do not depend on the machine's load.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { allScripts, entryScripts, holdsRecharts, staticGraph } from './client-graph';

type Record = (name: string, value: number, unit: string) => void;

/** Bytes a client gets for `url`: the copy with `ext` when the build wrote one, else the file. */
function sentBytes(dist: string, url: string, ext: '' | '.br' | '.gz'): number {
  const copy = path.join(dist, url + ext);
  return fs.statSync(ext && fs.existsSync(copy) ? copy : path.join(dist, url)).size;
}

function kb(dist: string, urls: string[], ext: '' | '.br' | '.gz'): number {
  return urls.reduce((sum, u) => sum + sentBytes(dist, u, ext), 0) / 1024;
}

export default async function run(record: Record): Promise<void> {
  const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-client-bench-'));
  try {
    const built = spawnSync('npx', ['vite', 'build', '--outDir', dist, '--emptyOutDir', '--logLevel', 'error'], { stdio: 'inherit' });
    if (built.status !== 0) throw new Error('vite build failed');
    const entry = staticGraph(dist, entryScripts(dist));
    const all = allScripts(dist);
    record('client_js_kb', kb(dist, entry, ''), 'kB');
    record('client_js_br_kb', kb(dist, entry, '.br'), 'kB');
    record('client_js_gz_kb', kb(dist, entry, '.gz'), 'kB');
    record('client_js_total_kb', kb(dist, all, ''), 'kB');
    record('client_js_total_br_kb', kb(dist, all, '.br'), 'kB');
    const pages = fs.readdirSync('src/app/routes').filter((f) => f.endsWith('.tsx')).map((f) => f.slice(0, -'.tsx'.length));
    const pageChunks = all.filter((u) => pages.some((p) => new RegExp(`^/assets/${p}-[\\w-]{8}\\.js$`).test(u)));
    record('client_pages_with_recharts', pageChunks.filter((u) => staticGraph(dist, [u]).some((c) => holdsRecharts(dist, c))).length, 'pages');
  } finally {
    fs.rmSync(dist, { recursive: true, force: true });
  }
}
