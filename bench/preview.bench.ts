/**
 * The photo page's live preview, from a slider's move to the painted frame, in the browser tests' harness:
 * the built app (dist/) started as tests/helpers/browser.ts starts it, Debian's headless Chromium with its
 * software WebGL2, the demo still life (a 1600 px wide live canvas).
 *
 * Each move sets a slider's value and fires its `input` event from inside the page (t0), then waits for the
 * preview's frame record (window.__grisaillePreview, look-canvas.tsx) and for the next animation frame after
 * it (t1: the frame that paints the drawing starts; common practice for "painted"). Moves: the light's
 * colour temperature on the demo's first look, then the edge of the cyan look's filter, each waiting for
 * the resting frame before the next move, so every move is a fresh start.
 * Figures: `preview_ms` (median slider → painted frame; target ≤ 50 ms), `preview_p90_ms`, `preview_moves`,
 * `preview_rest_ms` (median slider → the resting full-resolution frame, which waits for the slider to rest).
 * Without dist/ the bench builds it (`npx vite build`) first.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import type { Page } from 'playwright-core';
import { launchBrowser, signIn, startServer } from '../tests/helpers/browser';

type Record = (name: string, value: number, unit: string) => void;

/** Moves per slider. */
const MOVES = Number(process.env.BENCH_PREVIEW_MOVES ?? 12);

/** A frame's record from the page (src/features/photos/components/look-canvas.tsx PreviewTiming). */
interface Timing {
  total: number;
  table: number;
  draw: number;
  quality?: string;
}

interface Move {
  /** ms from the input event to the animation frame after the first frame drawn for it */
  painted: number;
  /** ms from the input event to the resting (full) frame's record */
  rest: number;
}

/** One slider move, timed inside the page. */
function move(page: Page, selector: string, value: number): Promise<Move> {
  return page.evaluate(
    ([sel, v]) =>
      new Promise<Move>((resolve, reject) => {
        const w = window as unknown as { __grisaillePreview?: { quality?: string }[] };
        const el = document.querySelector(sel) as HTMLInputElement;
        const n = w.__grisaillePreview?.length ?? 0;
        const setValue = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')!.set!;
        const t0 = performance.now();
        setValue.call(el, String(v));
        el.dispatchEvent(new Event('input', { bubbles: true }));
        let painted = 0;
        const deadline = t0 + 20_000;
        const tick = () => {
          const recs = (w.__grisaillePreview ?? []).slice(n);
          const now = performance.now();
          if (!painted && recs.length) painted = now - t0;
          // the resting frame: one drawn at full quality (records without a quality come from older clients)
          if (painted && recs.some((r) => r.quality !== 'drag')) return resolve({ painted, rest: now - t0 });
          if (now > deadline) return reject(new Error(`no preview frame within 20 s of moving ${sel}`));
          requestAnimationFrame(tick);
        };
        requestAnimationFrame(tick);
      }),
    [selector, value] as const,
  );
}

const lutReady = (page: Page) => page.waitForSelector('canvas[data-renderer="gl"]:not([data-lut-key=""])', { timeout: 60_000 });

function quantile(xs: number[], q: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))];
}

export default async function run(record: Record): Promise<void> {
  if (!fs.existsSync('dist/index.html')) {
    console.log('preview bench: dist/ is missing, building the client (npx vite build)…');
    const built = spawnSync('npx', ['vite', 'build', '--logLevel', 'error'], { stdio: 'inherit' });
    if (built.status !== 0) {
      console.log('preview bench: SKIPPED (the client did not build)');
      return;
    }
  }
  const app = await startServer();
  const browser = await launchBrowser();
  try {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    // tsx (esbuild's keepNames) wraps named functions passed to page.evaluate in __name(); the page has none
    await page.addInitScript('window.__name = (f) => f');
    await signIn(page, app.url, 'camera@demo.grisaille.test');
    const pid = await page.evaluate(() => fetch('/api/productions').then((r) => r.json()).then((b) => b.productions[0].id as number));
    const photos = await page.evaluate((p) => fetch(`/api/productions/${p}/photos`).then((r) => r.json()), pid);
    const still = (photos.photos as { id: number; name: string }[]).find((p) => p.name === 'Workshop still life');
    if (!still) throw new Error('preview bench: the demo still life is missing');
    await page.goto(`${app.url}/p/${pid}/photos?photo=${still.id}`);
    await lutReady(page);
    const width = await page.locator('canvas[data-renderer]').evaluate((c: HTMLCanvasElement) => c.width);
    const moves: Move[] = [];
    // warm-up moves (the first table pays for the worker's start), not counted
    await move(page, '#tune-kelvin', 3000);
    for (let i = 0; i < MOVES; i++) moves.push(await move(page, '#tune-kelvin', 2600 + ((i * 7) % 12) * 150));
    await page.getByLabel('Look', { exact: true }).selectOption({ label: 'Panchromatic + red-absorbing cyan' });
    await page.locator('#tune-filter-0').waitFor();
    await lutReady(page);
    await move(page, '#tune-filter-0', 560);
    for (let i = 0; i < MOVES; i++) moves.push(await move(page, '#tune-filter-0', 480 + ((i * 5) % 12) * 12));
    // the page's own records of every frame of the session (page load and look change included): where the time goes (table in the worker, draw on the GPU)
    const recs = await page.evaluate(() => ((window as unknown as { __grisaillePreview?: Timing[] }).__grisaillePreview ?? []));
    for (const q of ['drag', 'full']) {
      const r = recs.filter((x) => (x.quality ?? 'full') === q);
      if (!r.length) continue;
      const med = (k: 'total' | 'table' | 'draw') => quantile(r.map((x) => x[k]), 0.5).toFixed(0);
      console.log(`preview bench: ${q} frames (${r.length}): to the drawn frame ${med('total')} ms, table ${med('table')} ms, draw ${med('draw')} ms (medians)`);
    }
    const painted = moves.map((m) => m.painted);
    const rest = moves.map((m) => m.rest);
    console.log(`preview bench: load average ${os.loadavg().map((x) => x.toFixed(1)).join(', ')} on ${os.cpus().length} cores`);
    console.log(`preview bench: ${moves.length} moves at a ${width} px wide canvas; painted ${Math.min(...painted).toFixed(0)}–${Math.max(...painted).toFixed(0)} ms, rest ${Math.min(...rest).toFixed(0)}–${Math.max(...rest).toFixed(0)} ms`);
    record('preview_ms', quantile(painted, 0.5), 'ms');
    record('preview_p90_ms', quantile(painted, 0.9), 'ms');
    record('preview_moves', moves.length, 'moves');
    record('preview_rest_ms', quantile(rest, 0.5), 'ms');
  } finally {
    await browser.close();
    await app.stop();
  }
}
