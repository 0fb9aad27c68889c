import { expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openSignedIn, previewPixels, shot, useAppAndBrowser } from '../helpers/browser';
import { DEMO_SCENES, demoSceneJpeg } from '../../server/db/seed-content/photos';

/** The preview must be at least this wide (issue 5). */
const MIN_PREVIEW_WIDTH = 1600;
/** Slider moves timed per control. */
const MOVES = 8;

const env = useAppAndBrowser();

interface Timing {
  total: number;
  table: number;
  draw: number;
  renderer: string;
  width: number;
  height: number;
}
const timings = (page: Page) => page.evaluate(() => (window.__grisaillePreview ?? []) as Timing[]);
const lutReady = (page: Page, renderer = 'gl') => page.waitForSelector(`canvas[data-renderer="${renderer}"]:not([data-lut-key=""])`, { timeout: 60_000 });

/** Moves a range input through `values`, waiting for each new frame; answers the frames' timings. */
async function sweep(page: Page, selector: string, values: number[]): Promise<Timing[]> {
  const out: Timing[] = [];
  for (const v of values) {
    const n = (await timings(page)).length;
    await page.locator(selector).fill(String(v));
    await page.waitForFunction((k) => (window.__grisaillePreview?.length ?? 0) > k, n, { timeout: 30_000 });
    out.push((await timings(page)).at(-1)!);
  }
  return out;
}

function summary(name: string, t: Timing[]) {
  const total = t.map((x) => x.total).sort((a, b) => a - b);
  const med = total[Math.floor(total.length / 2)];
  const line = `${name}: median ${med.toFixed(0)} ms, max ${total.at(-1)!.toFixed(0)} ms from the change to the frame (${t[0].renderer}, ${t[0].width} × ${t[0].height} px; table median ${[...t].sort((a, b) => a.table - b.table)[Math.floor(t.length / 2)].table.toFixed(0)} ms, draw median ${[...t].sort((a, b) => a.draw - b.draw)[Math.floor(t.length / 2)].draw.toFixed(0)} ms)`;
  console.log(`[preview latency] ${line}`);
  return med;
}

/** Colour of a canvas pixel at (fx, fy), fractions of its size. */
const pixelAt = async (page: Page, fx: number, fy: number) => (await previewPixels(page, [[fx, fy]])).rgb[0];

it('a makeup artist uploads a photo, retunes the look live, wipes, compares, renders it and keeps a region read from it as a swatch', async () => {
  const { page, errors, pid } = await openSignedIn(env, 'makeup@demo.grisaille.test', { viewport: { width: 1280, height: 800 } });
  await page.goto(`${env.app.url}/p/${pid}`);
  await page.getByRole('navigation', { name: 'Production' }).getByRole('link', { name: 'Photos' }).click();
  await page.getByRole('heading', { name: 'Photos', level: 1 }).waitFor();

  // upload
  const jpg = await demoSceneJpeg(DEMO_SCENES[1], 2400, 1600);
  await page.locator('#photo-file').setInputFiles({ name: 'lacquer box test.jpg', mimeType: 'image/jpeg', buffer: jpg });
  await page.getByRole('button', { name: /lacquer box test/ }).waitFor();
  await lutReady(page);
  const canvasWidth = await page.locator('canvas[data-renderer]').evaluate((c: HTMLCanvasElement) => c.width);
  expect(canvasWidth).toBeGreaterThanOrEqual(MIN_PREVIEW_WIDTH);
  // the size line gives the preview's size and the photo's own
  await page.getByTestId('preview-timing').getByText(/^Preview \d+ × \d+ px of a 2400 × 1600 px photo, WebGL2/).waitFor();
  await shot(page, 'photos-01-uploaded-look');

  // live: the light's colour temperature, then a filter's cut-off on the cyan look
  const cct = await sweep(page, '#tune-kelvin', Array.from({ length: MOVES }, (_, i) => 2600 + i * 150));
  summary('light CCT, WebGL2', cct);
  await page.getByLabel('Look', { exact: true }).selectOption({ label: 'Panchromatic + red-absorbing cyan' });
  await page.locator('#tune-filter-0').waitFor();
  await lutReady(page);
  const cut = await sweep(page, '#tune-filter-0', Array.from({ length: MOVES }, (_, i) => 500 + i * 10));
  summary('filter cut-off, WebGL2', cut);
  await shot(page, 'photos-02-retuned');

  // zone map
  await page.getByRole('button', { name: 'Zones' }).click();
  await page.getByText(/accent lines/).waitFor();
  await shot(page, 'photos-03-zones');
  await page.getByRole('button', { name: 'Grey' }).click();

  // wipe: colour on the left, grey on the right
  await page.getByRole('button', { name: 'Wipe' }).click();
  await page.locator('#wipe-pos').fill('50');
  await page.waitForTimeout(200);
  const left = await pixelAt(page, 0.1, 0.3);
  const right = await pixelAt(page, 0.9, 0.3);
  expect(new Set(right).size).toBe(1);
  expect(Math.max(...left) - Math.min(...left)).toBeGreaterThan(5);
  await shot(page, 'photos-04-wipe');

  // compare three looks side by side: the cells keep the looks' list order, whatever order they are ticked in
  await page.getByRole('button', { name: 'Compare' }).click();
  await page.waitForFunction(() => document.querySelectorAll('canvas[data-renderer]:not([data-lut-key=""])').length >= 3, undefined, { timeout: 60_000 });
  const choice = page.locator('fieldset', { has: page.locator('legend', { hasText: 'Looks to compare' }) });
  const boxes = choice.locator('input[type=checkbox]');
  await boxes.nth(0).uncheck();
  await boxes.nth(0).check();
  const listed = await choice.locator('label').allInnerTexts();
  const ticked = await boxes.evaluateAll((els) => els.map((e) => (e as HTMLInputElement).checked));
  const cells = await page.locator('canvas[data-renderer]').evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
  expect(cells.map((c) => c.replace(/^.*? through /, ''))).toEqual(listed.filter((_, i) => ticked[i]).map((t) => t.trim()));
  await shot(page, 'photos-05-compare');

  // full-resolution render with progress, then the download, named after the photo and the look
  const renderMisses: string[] = [];
  page.on('response', (r) => {
    if (/\/renders\//.test(r.url()) && r.status() >= 400) renderMisses.push(`${r.status()} ${r.url()}`);
  });
  await page.getByRole('button', { name: 'Look', exact: true }).click();
  const cyan = 'Panchromatic + red-absorbing cyan';
  // (away and back: the live changes made above start afresh, so the saved look is rendered)
  await page.getByLabel('Look', { exact: true }).selectOption({ label: 'Panchromatic, no filter' });
  await page.getByLabel('Look', { exact: true }).selectOption({ label: cyan });
  await lutReady(page);
  expect(await page.getByText('with the live changes, unsaved').count()).toBe(0);
  await page.getByRole('button', { name: 'Render full resolution' }).click();
  await page.getByRole('progressbar', { name: 'Render progress' }).waitFor();
  const link = page.getByRole('link', { name: /Download 16-bit PNG/ });
  await link.waitFor({ timeout: 60_000 });
  expect(await page.getByTestId('render-status').getAttribute('data-look')).toBe(cyan);
  expect(await link.innerText()).toContain(`of “${cyan}”`);
  const href = await link.getAttribute('href');
  const dl = await page.evaluate((u) => fetch(u!).then((r) => ({ status: r.status, type: r.headers.get('content-type'), name: r.headers.get('content-disposition') })), href);
  expect(dl).toMatchObject({ status: 200, type: 'image/png' });
  expect(dl.name).toMatch(/filename="?lacquer-box-test_Panchromatic-red-absorbing-cyan_[0-9a-f]{8}\.png"?$/);
  await shot(page, 'photos-06-rendered');
  // another look: the panel shows no render until one of that look is made (not the previous look's)
  await page.getByLabel('Look', { exact: true }).selectOption({ label: 'Panchromatic, no filter' });
  await page.getByRole('button', { name: 'Render full resolution' }).waitFor();
  expect(await page.getByTestId('render-status').count()).toBe(0);
  expect(await page.getByRole('link', { name: /Download/ }).count()).toBe(0);
  // back to the cyan look: its render is shown again; the JPEG format is another render, so none
  await page.getByLabel('Look', { exact: true }).selectOption({ label: cyan });
  await link.waitFor();
  await page.locator('#render-format').selectOption('jpeg');
  expect(await page.getByTestId('render-status').count()).toBe(0);
  await page.locator('#render-format').selectOption('png16');
  await link.waitFor();
  // another photo: no render shown, and no request for this photo's render key under it
  await page.getByRole('button', { name: new RegExp(DEMO_SCENES[1].name.slice(0, 12)) }).first().click();
  await page.waitForURL(/photo=\d+/);
  await lutReady(page);
  expect(await page.getByTestId('render-status').count()).toBe(0);
  await shot(page, 'photos-06b-other-photo-no-render');
  await page.getByRole('button', { name: /lacquer box test/ }).click();
  await lutReady(page);
  await link.waitFor();
  expect(renderMisses).toEqual([]);

  // read the lacquer box (around 68 % across, 68 % down in this scene) and keep it as a swatch
  await page.getByRole('heading', { name: 'Read a region' }).waitFor();
  const box = (await page.getByTestId('region-reader').boundingBox())!;
  await page.mouse.move(box.x + box.width * 0.64, box.y + box.height * 0.66);
  await page.mouse.down();
  await page.mouse.move(box.x + box.width * 0.7, box.y + box.height * 0.7, { steps: 5 });
  await page.mouse.up();
  await page.getByTestId('region-reading').waitFor();
  const zone = await page.getByTestId('region-zone').textContent();
  expect(zone).toMatch(/^(0|I|II|III|IV|V|VI|VII|VIII|IX|X)$/);
  await page.getByLabel('Swatch name').fill('Lacquer box, sampled');
  await page.getByRole('button', { name: 'Keep as swatch' }).click();
  await page.getByText(/Kept as swatch “Lacquer box, sampled”/).waitFor();
  await shot(page, 'photos-07-sampled');
  const swatches = await page.evaluate((p) => fetch(`/api/productions/${p}/swatches`).then((r) => r.json()), pid);
  const kept = swatches.swatches.find((s: { name: string }) => s.name === 'Lacquer box, sampled');
  expect(kept).toMatchObject({ department: 'makeup', spectrum: 'estimated', origin: { type: 'photo' } });
  expect(errors).toEqual([]);
});

it('without WebGL2 the worker renders the preview', async () => {
  const { page, pid } = await openSignedIn(env, 'lab@demo.grisaille.test', { viewport: { width: 1440, height: 900 } });
  const photos = await page.evaluate((p) => fetch(`/api/productions/${p}/photos`).then((r) => r.json()), pid);
  const still = photos.photos.find((p: { name: string }) => p.name === DEMO_SCENES[1].name);
  await page.goto(`${env.app.url}/p/${pid}/photos?renderer=cpu&photo=${still.id}`);
  await lutReady(page, 'cpu');
  expect(await page.getByRole('button', { name: 'Upload a photo' }).count()).toBe(0);
  const cct = await sweep(page, '#tune-kelvin', Array.from({ length: 4 }, (_, i) => 2700 + i * 200));
  summary('light CCT, worker fallback', cct);
  await shot(page, 'photos-08-worker-fallback');
});

/** Waits for the uncertainty overlay to be built and drawn over the preview; answers the fraction shaded. */
async function uncertaintyDrawn(page: Page): Promise<number> {
  await page.getByRole('button', { name: 'Uncertainty' }).click();
  await page.locator('[data-testid="uncertainty-layer"][data-drawn="true"]').waitFor({ timeout: 90_000 });
  return Number(await page.getByTestId('uncertainty-layer').getAttribute('data-shaded'));
}

it('the uncertainty overlay builds its table with progress and shades the preview, on WebGL2 and on the worker', async () => {
  const { page, errors, pid } = await openSignedIn(env, 'camera@demo.grisaille.test', { viewport: { width: 1440, height: 900 } });
  const photos = await page.evaluate((p) => fetch(`/api/productions/${p}/photos`).then((r) => r.json()), pid);
  const still = photos.photos.find((p: { name: string }) => p.name === DEMO_SCENES[1].name);
  for (const renderer of ['gl', 'cpu'] as const) {
    await page.goto(`${env.app.url}/p/${pid}/photos?photo=${still.id}${renderer === 'cpu' ? '&renderer=cpu' : ''}`);
    await lutReady(page, renderer);
    await page.getByLabel('Look', { exact: true }).selectOption({ label: 'Orthochromatic' });
    await lutReady(page, renderer);
    const shaded = await uncertaintyDrawn(page);
    expect(shaded).toBeGreaterThan(0);
    expect(shaded).toBeLessThan(1);
    const legend = page.getByTestId('uncertainty-legend');
    expect(await legend.innerText()).toMatch(/2 st/);
    // some pixel of the layer carries the warning colour
    const warm = await page.getByTestId('uncertainty-layer').evaluate((c: HTMLCanvasElement) => {
      const d = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
      let n = 0;
      for (let i = 3; i < d.length; i += 4) if (d[i] > 40) n++;
      return n;
    });
    expect(warm).toBeGreaterThan(0);
    await page.locator('canvas[data-renderer]').scrollIntoViewIfNeeded();
    await shot(page, `photos-09-uncertainty-${renderer}`);
  }
  expect(errors).toEqual([]);
});
