/**
 * The built client's load graph, read from dist/ (no bundler needed): what the first page load fetches is
 * index.html's module script and modulepreload links plus every chunk they import statically; a dynamic
 * `import("./x.js")` (a lazy page or chart) is fetched later and only when used. Shared by bench/client.bench.ts
 * and tests/api/static-assets.test.ts.
 */
import fs from 'node:fs';
import path from 'node:path';

/** Class names recharts writes into the DOM: present in the chunk that holds recharts' chart code. */
export const RECHARTS_MARK = /recharts-(wrapper|surface|responsive-container)/;

/** `/assets/x.js` paths of index.html's module scripts and modulepreload links, in order. */
export function entryScripts(dist: string): string[] {
  const html = fs.readFileSync(path.join(dist, 'index.html'), 'utf8');
  const tags = html.match(/<(script|link)\b[^>]*>/g) ?? [];
  const out: string[] = [];
  for (const tag of tags) {
    const isModule = tag.startsWith('<script') && /type="module"/.test(tag);
    const isPreload = tag.startsWith('<link') && /rel="modulepreload"/.test(tag);
    const url = /(?:src|href)="([^"]+\.js)"/.exec(tag)?.[1];
    if ((isModule || isPreload) && url) out.push(url);
  }
  return out;
}

/**
 * `from` and every chunk it reaches through static imports (`import … from "./x.js"`, `import "./x.js"`),
 * as `/assets/x.js` paths. Dynamic `import("./x.js")` is not followed.
 */
export function staticGraph(dist: string, from: string[]): string[] {
  const seen = new Set<string>();
  const todo = [...from];
  while (todo.length) {
    const url = todo.pop()!;
    if (seen.has(url)) continue;
    seen.add(url);
    const code = fs.readFileSync(path.join(dist, url), 'utf8');
    for (const m of code.matchAll(/\b(?:from|import)\s*["'](\.{1,2}\/[^"']+\.js)["']/g)) {
      todo.push(path.posix.join(path.posix.dirname(url), m[1]));
    }
  }
  return [...seen].sort();
}

/** Every `.js` file of dist/, as `/assets/x.js` paths. */
export function allScripts(dist: string): string[] {
  return fs
    .readdirSync(path.join(dist, 'assets'))
    .filter((f) => f.endsWith('.js'))
    .map((f) => `/assets/${f}`)
    .sort();
}

/** Whether a chunk holds recharts' own code. */
export function holdsRecharts(dist: string, url: string): boolean {
  return RECHARTS_MARK.test(fs.readFileSync(path.join(dist, url), 'utf8'));
}
