import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openSignedIn, shot, SHOTS_DIR, useAppAndBrowser } from '../helpers/browser';

/**
 * The camera department's path through exposure: the bench's EI chain and light level follow a filter
 * swap, a change of light and of the T-stop; the exposure sheet prints; its PDF downloads and reads.
 * Expected values are the engine's own (the API and reference tests check the numbers against sources);
 * here the check is that they change, and in the right direction.
 */

/** Fact of the trade (common practice): a box speed of 250 for the demo panchromatic negative; no filter, no rating → EI 250. */
const BOX_SPEED_EI = '250';

const env = useAppAndBrowser();

const num = (s: string | null) => Number((s ?? '').replace(/[^\d.]/g, ''));
async function readout(page: Page) {
  return {
    ei: num(await page.getByTestId('effective-ei').textContent()),
    fc: num(await page.getByTestId('light-fc').textContent()),
    cost: (await page.getByTestId('light-cost').textContent()) ?? '',
  };
}
/** Waits until the effective EI differs from `before` (the analysis is debounced and computed on the server). */
async function eiChangesFrom(page: Page, before: number) {
  await page.waitForFunction((b) => Number(document.querySelector('[data-testid="effective-ei"]')?.textContent) !== b, before, { timeout: 15_000 });
  return readout(page);
}

it('the bench shows the EI chain and light level, and both follow the filter, the light and the T-stop', async () => {
  const { page, errors, pid } = await openSignedIn(env, 'camera@demo.grisaille.test', { viewport: { width: 1366, height: 900 } });
  const looks: { id: number; name: string; filters: unknown[] }[] = (await page.evaluate((p) => fetch(`/api/productions/${p}/looks`).then((r) => r.json()), pid)).looks;
  const plain = looks.find((l) => l.name === 'Panchromatic, no filter')!;
  const cyan = looks.find((l) => l.name === 'Panchromatic + red-absorbing cyan')!;

  // a look without a filter: the effective EI is the box speed and the look costs no light
  await page.goto(`${env.app.url}/p/${pid}/bench/${plain.id}`);
  await page.getByTestId('exposure-panel').waitFor();
  expect(await page.getByTestId('effective-ei').textContent()).toBe(BOX_SPEED_EI);
  expect((await readout(page)).cost).toContain('needs the same light as the unfiltered one');

  // the look with the cyan filter under tungsten
  await page.goto(`${env.app.url}/p/${pid}/bench/${cyan.id}`);
  await page.getByTestId('exposure-panel').waitFor();
  await page.getByTestId('ei-step-filter').getByText(/Cyan short-pass/).waitFor();
  const cyanTungsten = await readout(page);
  expect(cyanTungsten.ei).toBeLessThan(250);
  expect(cyanTungsten.cost).toMatch(/needs [\d.]+× the light of the unfiltered one/);
  await page.getByTestId('light-caution').getByText(/safety officer, licensed electricians and local codes/).waitFor();
  await shot(page, 'exposure-01-bench-cyan-tungsten');

  // swap the filter for the deep red long-pass: it costs more light, so the EI drops and the light rises
  await page.getByRole('combobox', { name: 'Filter 1' }).selectOption('lib:deep-red-630');
  const red = await eiChangesFrom(page, cyanTungsten.ei);
  expect(red.ei).toBeLessThan(cyanTungsten.ei);
  expect(red.fc).toBeGreaterThan(cyanTungsten.fc);
  await page.getByTestId('ei-step-filter').getByText(/Deep red long-pass 630 nm/).waitFor();

  // change the light to daylight: the chain follows the light (the factor belongs to light, filter and medium
  // together). Physics: tungsten is richer in red than daylight, so a red filter costs more under daylight.
  await page.getByRole('combobox', { name: 'Light', exact: true }).selectOption('lib:d65');
  const redDaylight = await eiChangesFrom(page, red.ei);
  expect(redDaylight.ei).toBeLessThan(red.ei);
  await page.getByTestId('ei-step-filter').getByText(/under Daylight D65/).waitFor();

  // the light chooser in the panel: tungsten again, computed in the browser at once
  await page.getByTestId('exposure-panel').getByRole('button', { name: 'Tungsten' }).click();
  expect((await readout(page)).ei).toBe(red.ei);
  await page.getByTestId('exposure-panel').getByRole('button', { name: 'This light' }).click();
  expect((await readout(page)).ei).toBe(redDaylight.ei);

  // one stop more on the lens (T2.8 → T4) needs twice the light, at once
  const before = await readout(page);
  await page.getByLabel('T-stop').fill('4');
  await page.waitForFunction((fc) => Number(document.querySelector('[data-testid="light-fc"]')?.textContent?.replace(/[^\d.]/g, '')) !== fc, before.fc);
  const t4 = await readout(page);
  expect(t4.fc / before.fc).toBeGreaterThan(1.9); // (4 / 2.8)² = 2.04 (the inverse-square law of apertures, common practice)
  expect(t4.fc / before.fc).toBeLessThan(2.2);
  await shot(page, 'exposure-02-bench-red-daylight-t4');
  const panel = page.getByTestId('exposure-panel');
  fs.mkdirSync(SHOTS_DIR, { recursive: true });
  await panel.screenshot({ path: path.join(SHOTS_DIR, 'exposure-03-bench-panel.png') });
  await page.getByTestId('curve-chart').screenshot({ path: path.join(SHOTS_DIR, 'exposure-04-bench-curve.png') });
  expect(errors).toEqual([]);
});

it('the exposure sheet opens from the bench, prints, and downloads as a PDF that reads', async () => {
  const { page, errors, pid } = await openSignedIn(env, 'lab@demo.grisaille.test', { viewport: { width: 1280, height: 900 }, acceptDownloads: true });
  const looks: { id: number; name: string }[] = (await page.evaluate((p) => fetch(`/api/productions/${p}/looks`).then((r) => r.json()), pid)).looks;
  const cyan = looks.find((l) => l.name === 'Panchromatic + red-absorbing cyan')!;
  await page.goto(`${env.app.url}/p/${pid}/bench/${cyan.id}`);
  await page.getByRole('link', { name: 'Exposure sheet' }).click();
  await page.waitForURL(new RegExp(`/p/${pid}/looks/${cyan.id}/sheet$`));
  await page.getByRole('heading', { name: cyan.name }).waitFor();
  await page.getByTestId('sheet-ei-chain').getByText('Effective EI (this look’s light)').waitFor();
  await page.getByTestId('sheet-light-levels').getByText(/T2\.8 \(this look\)/).waitFor();
  await page.getByTestId('sheet-cautions').getByText(/licensed electricians and local codes/).waitFor();
  // how sure each grey is: a "Could read" zone span per swatch and range bars on the zone ruler
  await page.getByTestId('sheet-zone-ruler').waitFor();
  const couldRead = await page.getByTestId('sheet-could-read').allInnerTexts();
  expect(couldRead.length).toBeGreaterThan(0);
  for (const c of couldRead) expect(c.trim()).toMatch(/^(measured|(0|I|II|III|IV|V|VI|VII|VIII|IX|X)(–(0|I|II|III|IV|V|VI|VII|VIII|IX|X))?)$/);
  expect(couldRead.some((c) => c.includes('–'))).toBe(true);
  // every swatch of the boards that show the look is a row: none left off
  const sheetJson = await page.evaluate(([p, l]) => fetch(`/api/productions/${p}/looks/${l}/sheet`).then((r) => r.json()), [pid, cyan.id]);
  expect(await page.getByTestId('sheet-swatch-row').count()).toBe(sheetJson.sheet.swatches.length);
  await page.getByTestId('sheet-swatch-count').getByText(new RegExp(`^${sheetJson.sheet.swatches.length} swatches, every one on the boards`)).waitFor();
  await shot(page, 'exposure-05-sheet');
  await page.emulateMedia({ media: 'print' });
  expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
  await shot(page, 'exposure-06-sheet-print');
  await page.emulateMedia({ media: 'screen' });

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download PDF' }).click()]);
  expect(download.suggestedFilename()).toBe('exposure-sheet-panchromatic-red-absorbing-cyan.pdf');
  const file = path.join(SHOTS_DIR, 'exposure-07-sheet.pdf');
  await download.saveAs(file);
  expect(fs.readFileSync(file).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
  expect(text).toContain(cyan.name);
  expect(text).toMatch(/Effective EI \(this look’s light\)\s+\d+/);
  expect(text).toContain('CAUTIONS');
  // pages as images, to look at (poppler's pdftoppm)
  execFileSync('pdftoppm', ['-png', '-r', '80', file, path.join(SHOTS_DIR, 'exposure-08-sheet-pdf')]);
  expect(fs.existsSync(path.join(SHOTS_DIR, 'exposure-08-sheet-pdf-1.png'))).toBe(true);
  expect(errors).toEqual([]);
});

it('a new look is offered the production’s boards on its sheet, and the day’s looks download as one PDF', async () => {
  const { page, errors, pid } = await openSignedIn(env, 'camera@demo.grisaille.test', { viewport: { width: 1280, height: 900 }, acceptDownloads: true });
  // a look made now (through the API, as the Looks page does), which no board shows
  const made = await page.evaluate(async (p) => {
    const { csrfToken } = await fetch('/api/auth/csrf').then((r) => r.json());
    const r = await fetch(`/api/productions/${p}/looks`, {
      method: 'POST', headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': csrfToken },
      body: JSON.stringify({ name: 'Sheet pick, made today', light: { source: { id: 'tungsten-3200' } }, medium: { source: { id: 'panchromatic' } } }),
    });
    return (await r.json()).look as { id: number; name: string };
  }, pid);
  const boards: { id: number; name: string; swatchIds: number[] }[] = (await page.evaluate((p) => fetch(`/api/productions/${p}/boards`).then((r) => r.json()), pid)).boards;
  const board = boards.find((b) => b.swatchIds.length > 0)!;

  await page.goto(`${env.app.url}/p/${pid}/looks/${made.id}/sheet`);
  await page.getByRole('heading', { name: made.name }).waitFor();
  await page.getByTestId('sheet-no-board').waitFor();
  expect(await page.getByTestId('sheet-swatch-row').count()).toBe(0);
  await shot(page, 'exposure-09-sheet-new-look-no-board');

  // pick a board: every one of its swatches is listed, the pick is in the address and in the PDF link
  // (a click, not check(): the pick goes through the address, so the box turns on once the router has moved)
  const box = page.getByTestId('sheet-board-picker').getByRole('checkbox', { name: new RegExp(board.name) });
  await box.click();
  await page.waitForURL(new RegExp(`boards=${board.id}$`));
  await page.waitForFunction((name) => [...document.querySelectorAll<HTMLInputElement>('[data-testid="sheet-board-picker"] label')].some((l) => l.textContent?.includes(name) && l.querySelector('input')?.checked), board.name);
  await page.getByTestId('sheet-swatch-row').first().waitFor();
  await page.waitForFunction((n) => document.querySelectorAll('[data-testid="sheet-swatch-row"]').length === n, board.swatchIds.length);
  expect(await page.getByRole('link', { name: 'Download PDF' }).getAttribute('href')).toContain(`sheet.pdf?boards=${board.id}`);
  await shot(page, 'exposure-10-sheet-board-picked');

  // the day's looks in one PDF: this one and the cyan look, each starting on a page of its own
  const looks: { id: number; name: string }[] = (await page.evaluate((p) => fetch(`/api/productions/${p}/looks`).then((r) => r.json()), pid)).looks;
  const cyan = looks.find((l) => l.name === 'Panchromatic + red-absorbing cyan')!;
  const day = page.getByTestId('day-sheets');
  await day.getByText('PDF of the day’s looks…').click();
  await day.getByRole('checkbox', { name: cyan.name }).check();
  const link = day.getByRole('link', { name: 'Download 2 sheets (PDF)' });
  expect(await link.getAttribute('href')).toBe(`/api/productions/${pid}/sheets.pdf?looks=${cyan.id},${made.id}`);
  await shot(page, 'exposure-11-sheet-day-looks');
  const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
  expect(download.suggestedFilename()).toMatch(/^exposure-sheets-.+-2-looks\.pdf$/);
  const file = path.join(SHOTS_DIR, 'exposure-12-day-sheets.pdf');
  await download.saveAs(file);
  const pages = Number(/^Pages:\s+(\d+)/m.exec(execFileSync('pdfinfo', [file], { encoding: 'utf8' }))![1]);
  expect(pages).toBeGreaterThanOrEqual(2);
  const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
  expect(text).toContain(cyan.name);
  expect(text).toContain(made.name);
  execFileSync('pdftoppm', ['-png', '-r', '60', file, path.join(SHOTS_DIR, 'exposure-13-day-sheets-pdf')]);
  expect(errors).toEqual([]);
});
