/**
 * The import graph of src/, server/ and shared/: no cycles between files, none between server module folders,
 * and the layer boundaries of DEVELOPERS.md ("imports point inward"). Type-only imports count: a cycle of types
 * is still a cycle for whoever reads the code. Dependency-free: the imports are found by regular expressions
 * over the source (statements at the start of a line, and `import('…')`), and relative paths are resolved the
 * way the bundler does (x.ts, x.tsx, x/index.ts, x/index.tsx). ESLint checks the same rules (eslint.config.js).
 */
import fs from 'node:fs';
import { builtinModules } from 'node:module';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(import.meta.dirname, '../..');
const SCANNED = ['src', 'server', 'shared'];

type Graph = Map<string, Set<string>>;

interface ImportRef {
  /** the specifier as written */
  spec: string;
  /** 1-based line of the statement */
  line: number;
}

/** Every .ts/.tsx file under `dir` (repository-relative, forward slashes). */
function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  const walk = (rel: string) => {
    for (const d of fs.readdirSync(path.join(ROOT, rel), { withFileTypes: true })) {
      const child = `${rel}/${d.name}`;
      if (d.isDirectory()) {
        if (d.name !== 'node_modules') walk(child);
      } else if (/\.tsx?$/.test(d.name)) out.push(child);
    }
  };
  if (fs.existsSync(path.join(ROOT, dir))) walk(dir);
  return out.sort();
}

const STATIC_FROM = /^[ \t]*(?:import|export)\b[^;()=]*?\bfrom\s*(['"])([^'"\n]+)\1/gm;
const SIDE_EFFECT = /^[ \t]*import\s*(['"])([^'"\n]+)\1/gm;
const DYNAMIC = /\bimport\s*\(\s*(['"])([^'"\n]+)\1\s*\)/g;

/** The module specifiers a source file imports or re-exports (static, side-effect, type-only and dynamic). */
function importsOf(source: string): ImportRef[] {
  const lineAt = (index: number) => source.slice(0, index).split('\n').length;
  const refs: ImportRef[] = [];
  for (const re of [STATIC_FROM, SIDE_EFFECT]) {
    for (const m of source.matchAll(re)) refs.push({ spec: m[2], line: lineAt(m.index + m[0].length) });
  }
  for (const m of source.matchAll(DYNAMIC)) {
    const lineStart = source.lastIndexOf('\n', m.index) + 1;
    const before = source.slice(lineStart, m.index).trimStart();
    if (before.startsWith('//') || before.startsWith('*') || before.startsWith('/*')) continue; // a comment
    refs.push({ spec: m[2], line: lineAt(m.index) });
  }
  return refs;
}

/** A relative specifier resolved to a repository-relative file (or the bare resolved path when no file matches). */
function resolveRelative(fromFile: string, spec: string): { file: string; found: boolean } {
  const base = path.posix.normalize(path.posix.join(path.posix.dirname(fromFile), spec));
  const candidates = [base, `${base}.ts`, `${base}.tsx`, `${base}/index.ts`, `${base}/index.tsx`];
  if (/\.js$/.test(base)) candidates.push(base.replace(/\.js$/, '.ts'), base.replace(/\.js$/, '.tsx'));
  for (const c of candidates) {
    const abs = path.join(ROOT, c);
    if (fs.existsSync(abs) && fs.statSync(abs).isFile()) return { file: c, found: true };
  }
  return { file: base, found: false };
}

interface Edge {
  from: string;
  to: string;
  line: number;
  spec: string;
}

interface Scan {
  files: string[];
  /** edges between files, relative imports only */
  edges: Edge[];
  /** package (non-relative) imports */
  packages: Edge[];
  /** relative imports that match no file with a source extension (assets, JSON, or a typo) */
  unresolved: Edge[];
  /** files with a line ending in `from '…'` that the statement pattern did not read (a blind spot of the scan) */
  misread: string[];
}

/** Lines ending in `from '…'` outside comments: a cross-check of STATIC_FROM, which reads whole statements. */
const FROM_LINE = /^(?![ \t]*(?:\/\/|\*|\/\*)).*\bfrom\s*(['"])([^'"\n]+)\1\s*;?[ \t]*$/gm;

function scan(): Scan {
  const files = SCANNED.flatMap(sourceFiles);
  const edges: Edge[] = [];
  const packages: Edge[] = [];
  const unresolved: Edge[] = [];
  const misread: string[] = [];
  for (const from of files) {
    const source = fs.readFileSync(path.join(ROOT, from), 'utf8');
    const statements = [...source.matchAll(STATIC_FROM)].map((m) => m[2]).sort();
    const lines = [...source.matchAll(FROM_LINE)].map((m) => m[2]).sort();
    if (statements.join('\n') !== lines.join('\n')) misread.push(from);
    for (const { spec, line } of importsOf(source)) {
      if (spec.startsWith('./') || spec.startsWith('../') || spec === '.' || spec === '..') {
        const { file, found } = resolveRelative(from, spec);
        (found ? edges : unresolved).push({ from, to: file, line, spec });
      } else {
        packages.push({ from, to: spec, line, spec });
      }
    }
  }
  return { files, edges, packages, unresolved, misread };
}

function graphOf(edges: { from: string; to: string }[], nodes: Iterable<string> = []): Graph {
  const g: Graph = new Map();
  for (const n of nodes) g.set(n, new Set());
  for (const { from, to } of edges) {
    if (!g.has(from)) g.set(from, new Set());
    if (!g.has(to)) g.set(to, new Set());
    g.get(from)!.add(to);
  }
  return g;
}

/** Strongly connected components (Tarjan, iterative), each sorted; components of one node without a self-loop are left out. */
function stronglyConnected(g: Graph): string[][] {
  let counter = 0;
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const onStack = new Set<string>();
  const stack: string[] = [];
  const out: string[][] = [];
  for (const start of [...g.keys()].sort()) {
    if (index.has(start)) continue;
    const work: { node: string; next: Iterator<string> }[] = [];
    const enter = (node: string) => {
      index.set(node, counter);
      low.set(node, counter++);
      stack.push(node);
      onStack.add(node);
      work.push({ node, next: [...(g.get(node) ?? [])].sort()[Symbol.iterator]() });
    };
    enter(start);
    while (work.length) {
      const top = work[work.length - 1];
      const step = top.next.next();
      if (!step.done) {
        const w = step.value;
        if (!index.has(w)) enter(w);
        else if (onStack.has(w)) low.set(top.node, Math.min(low.get(top.node)!, index.get(w)!));
        continue;
      }
      work.pop();
      if (work.length) {
        const parent = work[work.length - 1].node;
        low.set(parent, Math.min(low.get(parent)!, low.get(top.node)!));
      }
      if (low.get(top.node) === index.get(top.node)) {
        const comp: string[] = [];
        let w: string;
        do {
          w = stack.pop()!;
          onStack.delete(w);
          comp.push(w);
        } while (w !== top.node);
        if (comp.length > 1 || g.get(top.node)?.has(top.node)) out.push(comp.sort());
      }
    }
  }
  return out.sort((a, b) => a[0].localeCompare(b[0]));
}

/** The shortest cycle through `start` inside `within` (breadth-first), as a path that ends where it starts. */
function shortestCycleThrough(g: Graph, start: string, within: Set<string>): string[] {
  const prev = new Map<string, string>();
  const queue = [start];
  for (let i = 0; i < queue.length; i++) {
    const n = queue[i];
    for (const w of [...(g.get(n) ?? [])].sort()) {
      if (!within.has(w)) continue;
      if (w === start) {
        const path = [n];
        for (let at = n; at !== start; ) path.unshift((at = prev.get(at)!));
        return [...path, start];
      }
      if (!prev.has(w) && w !== start) {
        prev.set(w, n);
        queue.push(w);
      }
    }
  }
  return [];
}

/**
 * Cycles of the graph, as paths `[a, b, …, a]`: for each strongly connected component, the shortest cycle through
 * each member that no cycle reported before it passes through (so every member shows up in some cycle, without
 * listing every one of the possibly many cycles).
 */
function findCycles(g: Graph): string[][] {
  const cycles: string[][] = [];
  for (const comp of stronglyConnected(g)) {
    const within = new Set(comp);
    const covered = new Set<string>();
    for (const n of comp) {
      if (covered.has(n)) continue;
      const c = shortestCycleThrough(g, n, within);
      c.forEach((x) => covered.add(x));
      cycles.push(c);
    }
  }
  return cycles;
}

const featureOf = (f: string) => /^src\/features\/([^/]+)\//.exec(f)?.[1];
const under = (dir: string) => (f: string) => f.startsWith(`${dir}/`);

/** The layer boundaries (DEVELOPERS.md): an import from `from` to `to` (repository-relative files) that breaks one. */
const BOUNDARIES: { name: string; breaks: (from: string, to: string) => boolean }[] = [
  { name: 'shared/ imports nothing of src/ or server/', breaks: (from, to) => under('shared')(from) && (under('src')(to) || under('server')(to)) },
  { name: 'server/services/ never imports server/modules/', breaks: (from, to) => under('server/services')(from) && under('server/modules')(to) },
  { name: 'features do not import each other', breaks: (from, to) => !!featureOf(from) && !!featureOf(to) && featureOf(from) !== featureOf(to) },
  { name: 'src/ and server/ do not import each other', breaks: (from, to) => (under('src')(from) && under('server')(to)) || (under('server')(from) && under('src')(to)) },
];

/** Packages shared/ may not import: UI, HTTP, database, DOM-only and Node modules (as eslint.config.js). */
const FORBIDDEN_IN_SHARED = new RegExp(
  `^(node:|@tanstack/|@fontsource/|(${[
    'react', 'react-dom', 'react-router', 'react-router-dom', 'recharts',
    'express', 'express-rate-limit', 'express-session', 'helmet', 'multer', 'passport', 'passport-local', 'supertest',
    'typeorm', 'better-sqlite3', 'reflect-metadata', 'sharp', 'pdfkit', 'nodemailer', 'mailparser', 'smtp-server',
    ...builtinModules.filter((m) => !m.startsWith('_')),
  ].join('|')})($|/))`,
);

const showCycle = (c: string[]) => c.join('\n      → ');

describe('the cycle finder (on small graphs)', () => {
  const g = (o: Record<string, string[]>) => graphOf(Object.entries(o).flatMap(([from, tos]) => tos.map((to) => ({ from, to }))), Object.keys(o));

  it('finds no cycle in a graph without one', () => {
    expect(findCycles(g({ a: ['b', 'c'], b: ['c'], c: [], d: ['a'] }))).toEqual([]);
  });

  it('finds a three-file cycle, a self-import and two cycles sharing a file', () => {
    expect(findCycles(g({ a: ['b'], b: ['c'], c: ['a'], d: ['a'] }))).toEqual([['a', 'b', 'c', 'a']]);
    expect(findCycles(g({ a: ['a'], b: [] }))).toEqual([['a', 'a']]);
    expect(findCycles(g({ a: ['b', 'c'], b: ['a'], c: ['a'] }))).toEqual([['a', 'b', 'a'], ['c', 'a', 'c']]);
  });

  it('reads static, type-only, re-export, side-effect and dynamic imports, and skips comments', () => {
    const src = [
      "import { a } from './a';",
      "import type { B } from '../b';",
      'import {',
      '  c,',
      '  type D,',
      "} from './c/index';",
      "export * from './e';",
      "export { f } from './f';",
      "export type { G } from './g';",
      "import './h.css';",
      "const lazy = () => import('./i');",
      "// import { z } from './commented';",
      " * see import('./in-doc')",
      "export const from = 'x';",
      "import React from 'react';",
    ].join('\n');
    expect(importsOf(src).map((r) => r.spec).sort()).toEqual(['../b', './a', './c/index', './e', './f', './g', './h.css', './i', 'react'].sort());
  });
});

describe('the boundary rules (on example imports)', () => {
  const broken = (from: string, to: string) => BOUNDARIES.filter((r) => r.breaks(from, to)).map((r) => r.name);

  it('catch each kind of crossing', () => {
    expect(broken('shared/tone/zones.ts', 'server/env.ts')).toEqual(['shared/ imports nothing of src/ or server/']);
    expect(broken('shared/tone/zones.ts', 'src/lib/zones.ts')).toEqual(['shared/ imports nothing of src/ or server/']);
    expect(broken('server/services/mail.ts', 'server/modules/auth/auth.service.ts')).toEqual(['server/services/ never imports server/modules/']);
    expect(broken('src/features/auth/api/sign-in.ts', 'src/features/boards/api/get-boards.ts')).toEqual(['features do not import each other']);
    expect(broken('src/lib/api-client.ts', 'server/errors.ts')).toEqual(['src/ and server/ do not import each other']);
    expect(broken('server/app.ts', 'src/main.tsx')).toEqual(['src/ and server/ do not import each other']);
  });

  it('let the inward imports through', () => {
    expect(broken('src/features/auth/components/x.tsx', 'src/features/auth/api/sign-in.ts')).toEqual([]);
    expect(broken('src/features/auth/api/sign-in.ts', 'src/lib/api-client.ts')).toEqual([]);
    expect(broken('src/features/auth/api/sign-in.ts', 'shared/schemas/auth.ts')).toEqual([]);
    expect(broken('server/modules/auth/auth.service.ts', 'server/services/mail.ts')).toEqual([]);
    expect(broken('server/modules/auth/auth.router.ts', 'shared/schemas/auth.ts')).toEqual([]);
    expect(broken('shared/spectral/upsample-table.ts', 'data/upsample/method.json')).toEqual([]);
  });

  it('name the packages shared/ may not use', () => {
    for (const p of ['react', 'react/jsx-runtime', 'react-dom/client', '@tanstack/react-query', 'express', 'express-session', 'typeorm', 'node:fs', 'fs', 'fs/promises', 'path', 'sharp']) {
      expect(FORBIDDEN_IN_SHARED.test(p), p).toBe(true);
    }
    for (const p of ['zod', 'culori', 'mathjs', 'papaparse', 'reactive-thing', 'pathlike']) expect(FORBIDDEN_IN_SHARED.test(p), p).toBe(false);
  });
});

describe('the import graph of src/, server/ and shared/', () => {
  const { files, edges, packages, unresolved, misread } = scan();
  const where = (e: Edge) => `${e.from}:${e.line} imports '${e.spec}'`;

  it('finds the source files and their imports', () => {
    expect(files.filter((f) => f.startsWith('shared/')).length).toBeGreaterThan(10);
    expect(files.filter((f) => f.startsWith('server/')).length).toBeGreaterThan(10);
    expect(files.filter((f) => f.startsWith('src/')).length).toBeGreaterThan(10);
    expect(edges.length).toBeGreaterThan(100);
  });

  it('reads every import and resolves every relative one to a file (a missed one would hide its edges)', () => {
    expect(misread, 'files where a line ends in from \'…\' but no import statement was read').toEqual([]);
    expect(unresolved.map(where)).toEqual([]);
  });

  it('has no cycle between files', () => {
    const cycles = findCycles(graphOf(edges, files));
    expect(cycles.map(showCycle), `${cycles.length} import cycle(s):\n${cycles.map((c) => `  ${showCycle(c)}`).join('\n')}`).toEqual([]);
  });

  it('has no cycle between server module folders (server/modules/<name> as one node)', () => {
    const folderOf = (f: string) => /^server\/modules\/([^/]+)\//.exec(f)?.[0].slice(0, -1) ?? f;
    const contracted = edges.map((e) => ({ from: folderOf(e.from), to: folderOf(e.to) })).filter((e) => e.from !== e.to);
    const g = graphOf(contracted);
    const isFolder = (n: string) => /^server\/modules\/[^/]+$/.test(n);
    const cycles = stronglyConnected(g)
      .filter((comp) => comp.filter(isFolder).length >= 2)
      .flatMap((comp) => {
        const within = new Set(comp);
        const seen = new Set<string>();
        return comp.filter(isFolder).flatMap((n) => {
          if (seen.has(n)) return [];
          const c = shortestCycleThrough(g, n, within);
          c.forEach((x) => seen.add(x));
          return [c];
        });
      });
    expect(cycles.map(showCycle), `${cycles.length} cycle(s) between module folders:\n${cycles.map((c) => `  ${showCycle(c)}`).join('\n')}`).toEqual([]);
  });

  for (const rule of BOUNDARIES) {
    it(rule.name, () => {
      expect(edges.filter((e) => rule.breaks(e.from, e.to)).map(where)).toEqual([]);
    });
  }

  it('shared/ imports no React, Express, TypeORM, DOM-only or Node modules', () => {
    expect(packages.filter((e) => e.from.startsWith('shared/') && FORBIDDEN_IN_SHARED.test(e.spec)).map(where)).toEqual([]);
  });
});
