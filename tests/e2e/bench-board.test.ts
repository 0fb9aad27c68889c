/**
 * The bench and the boards in the real built app (headless Chromium): build a look from scratch (medium,
 * filter, light) and watch the filter factor follow; add a lip colour by hex as the makeup member and see
 * its zone through each look and on the board; the costume member finds two fabrics that merge.
 */
import { expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { SHOTS_DIR, openSignedIn, shot as shotAt, useAppAndBrowser } from '../helpers/browser';

const env = useAppAndBrowser();
let pid = 0;

async function page(email: string): Promise<{ p: Page; errors: string[] }> {
  const signedIn = await openSignedIn(env, email, { viewport: { width: 1366, height: 900 } });
  pid = signedIn.pid;
  return { p: signedIn.page, errors: signedIn.errors };
}

/** Full-page screenshot from the top (the sticky header would otherwise sit mid-page). */
async function shot(p: Page, name: string) {
  await p.evaluate(() => window.scrollTo(0, 0));
  return shotAt(p, name);
}

const mainFactor = (p: Page) => p.getByTestId('factor-main').innerText();

it('builds a look from scratch on the bench and the filter factor follows the filter and the light', async () => {
  const { p, errors } = await page('camera@demo.grisaille.test');
  await p.goto(`${env.app.url}/p/${pid}/bench/new`);
  await p.getByLabel('Look name').fill('Test: built from scratch');
  await p.getByLabel('Medium', { exact: true }).selectOption({ label: 'Orthochromatic emulsion' });
  await p.getByLabel('Medium', { exact: true }).selectOption({ label: 'Panchromatic negative' });
  await p.getByTestId('factor-main').getByText('0.00 st').waitFor();
  const before = await mainFactor(p);
  await p.getByRole('button', { name: '+ Add a filter' }).click();
  await p.getByLabel('Filter 1', { exact: true }).selectOption({ label: 'Cyan short-pass 530 nm (red-absorbing)' });
  await p.waitForFunction(() => !document.querySelector('[data-testid="factor-main"]')?.textContent?.includes('0.00 st'));
  await p.waitForFunction(() => !document.querySelector('[aria-label="Filter factor"]')?.getAttribute('aria-busy')?.includes('true'));
  const withCyanTungsten = await mainFactor(p);
  expect(withCyanTungsten).not.toBe(before);
  await p.getByLabel('Light', { exact: true }).selectOption({ label: 'Daylight D65' });
  await p.getByTestId('factor-main').getByText('Daylight D65').waitFor();
  await p.waitForFunction(() => document.querySelector('[aria-label="Filter factor"]')?.getAttribute('aria-busy') === 'false');
  const withCyanDaylight = await mainFactor(p);
  expect(withCyanDaylight).not.toBe(withCyanTungsten);
  // the cyan costs more under tungsten than in daylight (tungsten is mostly red): read the stops
  const stops = (s: string) => Number(/(\d+\.\d+) st/.exec(s)![1]);
  expect(stops(withCyanTungsten)).toBeGreaterThan(stops(withCyanDaylight));
  await shot(p, 'bench-01-look-from-scratch');
  await p.getByRole('button', { name: 'Save as a look' }).click();
  await p.waitForURL(/\/bench\/\d+$/);
  await p.getByText('Test: built from scratch').first().waitFor();
  await shot(p, 'bench-02-saved-look');
  await p.goto(`${env.app.url}/p/${pid}/looks`);
  await p.getByRole('heading', { name: 'Test: built from scratch' }).waitFor();
  await p.getByRole('checkbox', { name: 'Compare' }).nth(0).check();
  await p.getByRole('checkbox', { name: 'Compare' }).nth(1).check();
  await p.getByRole('button', { name: /Compare \(2\)/ }).click();
  await p.getByRole('heading', { name: 'Compare looks' }).waitFor();
  await p.getByTestId('split-chip').first().waitFor();
  await shot(p, 'bench-03-compare');
  expect(errors).toEqual([]);
});

it('at a laptop’s 1280 × 800 the bench shows the light path and, beside it, the board’s tones without scrolling', async () => {
  const signedIn = await openSignedIn(env, 'camera@demo.grisaille.test', { viewport: { width: 1280, height: 800 } });
  const p = signedIn.page;
  await p.goto(`${env.app.url}/p/${signedIn.pid}/bench`);
  await p.waitForURL(/\/bench\/\d+$/);
  const chip = p.getByTestId('split-chip').first();
  await chip.waitFor();
  const chipBox = (await chip.boundingBox())!;
  const light = (await p.getByLabel('Light', { exact: true }).boundingBox())!;
  // the board's first row of chips is on the first screen, to the right of the light path
  expect(chipBox.y + chipBox.height).toBeLessThan(800);
  expect(chipBox.x).toBeGreaterThan(light.x + light.width);
  await p.screenshot({ path: `${SHOTS_DIR}/bench-00-laptop-first-screen.png` });
  expect(signedIn.errors).toEqual([]);
});

it('the makeup member adds a lip colour by hex, sees its zone through each look, and finds it on the board', async () => {
  const { p, errors } = await page('makeup@demo.grisaille.test');
  await p.goto(`${env.app.url}/p/${pid}/swatches`);
  const form = p.getByRole('form', { name: 'Add a swatch' });
  await form.getByLabel('Name').fill('Lip colour, test red');
  await form.getByLabel('sRGB hex').fill('#9e2b35');
  await form.getByRole('button', { name: 'Add swatch' }).click();
  await p.getByRole('heading', { name: 'Lip colour, test red' }).waitFor();
  await p.getByTestId('swatch-look-tone').first().waitFor();
  const zones = await p.getByTestId('swatch-look-tone').allInnerTexts();
  expect(zones.length).toBeGreaterThanOrEqual(3);
  const byLook = Object.fromEntries(zones.map((z) => [z.split('\n')[0], /zone ([0IVX]+)/.exec(z)?.[1]]));
  expect(byLook['Panchromatic + red-absorbing cyan']).toBeDefined();
  expect(byLook['Panchromatic + red-absorbing cyan']).not.toBe(byLook['Panchromatic, no filter']);
  expect(await p.getByText('estimated spectrum').count()).toBeGreaterThan(0);
  await shot(p, 'board-01-lip-colour-zones');
  await p.getByLabel('Put on board').selectOption({ label: 'Principal makeup' });
  await p.getByRole('button', { name: 'Add', exact: true }).click();
  await p.getByRole('link', { name: 'Open the board' }).click();
  await p.getByRole('heading', { name: 'Principal makeup' }).waitFor();
  const chip = p.getByTestId('split-chip').filter({ hasText: 'Lip colour, test red' }).first();
  await chip.waitFor();
  expect(await chip.getAttribute('data-zone')).toMatch(/^(0|I|II|III|IV|V|VI|VII|VIII|IX|X)$/);
  await shot(p, 'board-02-makeup-board');
  await p.getByRole('button', { name: 'Table' }).click();
  await p.getByRole('button', { name: /^Zone · Panchromatic, no filter/ }).click();
  await p.getByRole('cell', { name: /^Lip colour, test red\b/ }).first().waitFor();
  await shot(p, 'board-03-makeup-table');
  const download = p.waitForEvent('download');
  await p.getByRole('button', { name: 'Export CSV' }).click();
  expect((await download).suggestedFilename()).toBe('principal-makeup.csv');
  expect(errors).toEqual([]);
});

it('the costume member spots two fabrics that merge', async () => {
  const { p, errors } = await page('costume@demo.grisaille.test');
  await p.goto(`${env.app.url}/p/${pid}/boards`);
  await p.getByRole('link', { name: 'Workshop wardrobe' }).click();
  await p.getByRole('heading', { name: 'Workshop wardrobe' }).waitFor();
  await p.getByTestId('merge').first().waitFor();
  expect(await p.getByTestId('merge').count()).toBeGreaterThan(0);
  // how sure: each merge says whether it is certain ("merges") or only possible ("may merge"), certain first
  const certainty = await p.getByTestId('merge').evaluateAll((els) => els.map((e) => e.getAttribute('data-certainty')));
  expect(certainty.every((c) => c === 'certain' || c === 'possible')).toBe(true);
  expect(certainty.indexOf('possible') === -1 || certainty.lastIndexOf('certain') < certainty.indexOf('possible')).toBe(true);
  const words = await p.getByTestId('merge').allInnerTexts();
  expect(words.every((w) => /^(MERGES|MAY MERGE)/i.test(w.trim()))).toBe(true);
  expect(words.some((w) => /may merge/i.test(w))).toBe(true);
  // range bars on the chips and on the ruler, the words of a possible merge on a chip, and what to measure first
  expect(await p.getByTestId('split-chip').first().getByTestId('range-bar').count()).toBe(1);
  expect(await p.getByTestId('ruler-range').count()).toBeGreaterThan(0);
  expect(await p.locator('[data-testid="split-chip"][data-merge="possible"]').count()).toBeGreaterThan(0);
  const first = p.getByTestId('measure-first');
  await first.getByRole('heading', { name: 'Measure these first' }).waitFor();
  expect(await first.getByRole('listitem').count()).toBeGreaterThan(0);
  expect(await first.getByRole('listitem').first().innerText()).toMatch(/\d\.\d st/);
  // keyboard: the ruler's pins take focus and name their swatch and zone
  await p.getByTestId('ruler-pin').first().focus();
  expect(await p.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toMatch(/zone .*could read zone|measured spectrum/);
  await shot(p, 'board-04-costume-merges');
  await p.getByRole('button', { name: 'Table' }).click();
  await p.getByTestId('row-range').first().waitFor();
  expect(await p.getByTestId('row-range').count()).toBeGreaterThan(0);
  await shot(p, 'board-05-costume-table-ranges');
  // the swatch page says it in words
  await p.goto(`${env.app.url}/p/${pid}/swatches`);
  await p.getByRole('button', { name: 'Burgundy silk', exact: true }).click();
  await p.getByRole('heading', { name: 'Burgundy silk' }).waitFor();
  await p.getByTestId('tone-sureness').first().waitFor();
  expect((await p.getByTestId('tone-sureness').allInnerTexts()).join(' ')).toMatch(/(Could read anywhere from zone [0IVX]+ to [0IVX]+ through .+measure it to be sure|Reads zone [0IVX]+ through)/);
  await shot(p, 'board-06-swatch-how-sure');
  await p.getByRole('button', { name: 'Apron canvas (measured)', exact: true }).click();
  await p.getByText('The spectrum is measured, so each tone is as computed', { exact: false }).waitFor();
  expect(errors).toEqual([]);
});

it('the gaffer uploads a filter table to the library: a bad line is named, a good file is previewed and saved', async () => {
  const { p, errors } = await page('gaffer@demo.grisaille.test');
  await p.goto(`${env.app.url}/p/${pid}/library`);
  await p.getByRole('button', { name: /Cyan short-pass 530 nm/ }).click();
  await p.getByText(/generic model of a typical shape/).first().waitFor();
  const form = p.getByRole('form', { name: 'Upload a curve' });
  await form.getByLabel('Values are').selectOption({ label: 'transmittance in %' });
  const bad = 'Invented pale gel\nnm;T (%)\n400;80,0\n550;;\n700;85,5\n';
  await form.locator('input[type=file]').setInputFiles({ name: 'pale-gel.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
  await form.getByText('line 4: there is no value after 550 nm').waitFor();
  await shot(p, 'library-01-bad-line');
  const good = 'Invented pale gel\nnm;T (%)\n' + Array.from({ length: 41 }, (_, i) => `${380 + 10 * i};${(60 + 30 * Math.sin(i / 6)).toFixed(1).replace('.', ',')}`).join('\n');
  await form.locator('input[type=file]').setInputFiles({ name: 'pale-gel.csv', mimeType: 'text/csv', buffer: Buffer.from(good) });
  await form.getByText(/Preview: 41 points, 2 header lines, decimal commas/).waitFor();
  await form.getByLabel('Name').fill('Pale gel (test)');
  await form.getByRole('button', { name: 'Save to the library' }).click();
  await p.getByText('Saved “Pale gel (test)” to the library.').waitFor();
  await p.getByText(/uploaded file pale-gel\.csv: 41 points over 380–780 nm, transmittance in %, decimal commas/).waitFor();
  await shot(p, 'library-02-saved-curve');
  expect(errors).toEqual([]);
});
