import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import net from 'node:net';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { copyRunUpsampleTable } from '../setup/upsample-table-file';

/** Where browser tests save their screenshots (ignored by git). */
export const SHOTS_DIR = path.resolve('test-output/screenshots');

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const a = s.address();
      const port = typeof a === 'object' && a ? a.port : 0;
      s.close(() => resolve(port));
    });
    s.on('error', reject);
  });
}

export interface RunningApp {
  url: string;
  dataDir: string;
  stop(): Promise<void>;
}

/**
 * Starts the real built app (dist/ must exist: `npm run build`) on a free port with a temporary DATA_DIR.
 * A port found free can be taken by another process before the app binds it (the suites run side by side):
 * then the start is tried again on another port.
 */
export async function startServer(): Promise<RunningApp> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await startServerOnce();
    } catch (e) {
      if (attempt < 4 && e instanceof Error && /EADDRINUSE/.test(e.message)) continue;
      throw e;
    }
  }
}

async function startServerOnce(): Promise<RunningApp> {
  if (!fs.existsSync('dist/index.html')) throw new Error('dist/ is missing: run `npm run build` before the browser tests');
  const port = await freePort();
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-e2e-'));
  copyRunUpsampleTable(dataDir);
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, PORT: String(port), DATA_DIR: dataDir, NODE_ENV: 'test', AUTH_RATE_LIMIT: '10000', WRITE_RATE_LIMIT: '100000' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let log = '';
  child.stdout!.on('data', (d) => (log += d));
  child.stderr!.on('data', (d) => (log += d));
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) {
      fs.rmSync(dataDir, { recursive: true, force: true });
      throw new Error(`server exited early:\n${log}`);
    }
    try {
      const r = await fetch(`${url}/api/health`);
      if (r.ok) break;
    } catch {
      /* not up yet */
    }
    if (Date.now() > deadline) throw new Error(`server did not start:\n${log}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    url,
    dataDir,
    async stop() {
      child.kill('SIGTERM');
      await new Promise((r) => setTimeout(r, 300));
      if (child.exitCode === null) child.kill('SIGKILL');
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** Debian's Chromium, headless, through playwright-core. */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync', '--enable-unsafe-swiftshader'],
  });
}

export async function shot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(SHOTS_DIR, { recursive: true });
  const file = path.join(SHOTS_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Signs in through the real form. */
export async function signIn(page: Page, url: string, email: string, password = 'grisaille-demo'): Promise<void> {
  await page.goto(`${url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}

/** Collects the page's uncaught errors; a test ends with `expect(errors).toEqual([])`. */
export function pageErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  return errors;
}

/** The id of the first production the signed-in user sees (the demo production in a fresh app). */
export function firstProductionId(page: Page): Promise<number> {
  return page.evaluate(() => fetch('/api/productions').then((r) => r.json()).then((b) => b.productions[0].id));
}

export interface SignedInPage {
  page: Page;
  /** the page's uncaught errors (see pageErrors) */
  errors: string[];
  /** the demo production's id */
  pid: number;
}

/** A new page (options as for `browser.newPage`) signed in as `email` through the real form, watching for errors. */
export async function openSignedIn(env: { app: RunningApp; browser: Browser }, email: string, options: Parameters<Browser['newPage']>[0]): Promise<SignedInPage> {
  const page = await env.browser.newPage(options);
  const errors = pageErrors(page);
  await signIn(page, env.app.url, email);
  return { page, errors, pid: await firstProductionId(page) };
}

/**
 * Registers beforeAll/afterAll that start the built app and Chromium for a test file, and stop them.
 * Read `env.app` and `env.browser` inside the tests.
 */
export function useAppAndBrowser(): { app: RunningApp; browser: Browser } {
  const env = {} as { app: RunningApp; browser: Browser };
  beforeAll(async () => {
    env.app = await startServer();
    env.browser = await launchBrowser();
  });
  afterAll(async () => {
    await env.browser?.close();
    await env.app?.stop();
  });
  return env;
}

/**
 * RGB of the photo page's main preview canvas (`canvas[data-renderer]`) at points given as fractions of its
 * size, read through a 2-D copy (a WebGL canvas cannot be read directly); also the canvas's width.
 */
export function previewPixels(page: Page, points: readonly (readonly [number, number])[]): Promise<{ width: number; rgb: number[][] }> {
  return page.evaluate((pts) => {
    const c = document.querySelector('canvas[data-renderer]') as HTMLCanvasElement;
    const t = document.createElement('canvas');
    t.width = c.width;
    t.height = c.height;
    const ctx = t.getContext('2d')!;
    ctx.drawImage(c, 0, 0);
    const d = ctx.getImageData(0, 0, c.width, c.height).data;
    return { width: c.width, rgb: pts.map(([x, y]) => { const i = (Math.floor(y * c.height) * c.width + Math.floor(x * c.width)) * 4; return [d[i], d[i + 1], d[i + 2]]; }) };
  }, points as unknown as [number, number][]);
}
