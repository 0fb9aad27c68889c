/**
 * The makeup department's everyday work in the real built app (headless Chromium), from issue 12: the
 * shade of a lip colour for zone IV through the red-absorbing cyan look, kept and seen on the board (timed);
 * a skin swatch from a preset with its flush slider, its zone through each look changing live; a swatch
 * duplicated and edited (with a plain-words validation message beside the field); the board's table
 * keeping its sort in the address and fitting a laptop's width.
 */
import { expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openSignedIn, shot as shotAt, useAppAndBrowser } from '../helpers/browser';

const env = useAppAndBrowser();
const CYAN = 'Panchromatic + red-absorbing cyan';
const LAPTOP = { width: 1366, height: 900 };

async function shot(p: Page, name: string) {
  await p.evaluate(() => window.scrollTo(0, 0));
  return shotAt(p, name);
}

/** The makeup member on the Swatches page at a laptop's size. */
async function swatchesAsMakeup() {
  const session = await openSignedIn(env, 'makeup@demo.grisaille.test', { viewport: LAPTOP });
  await session.page.goto(`${env.app.url}/p/${session.pid}/swatches`);
  return session;
}

it('the makeup artist finds the shade of a lip colour for zone IV through the cyan look, keeps it, and sees it on the board', async () => {
  const { page: p, errors } = await swatchesAsMakeup();
  await p.getByRole('heading', { name: 'Swatches', level: 1 }).waitFor();

  // the task, as a person does it: 6 clicks (swatch, look, zone, find, keep, board) and no typing
  const started = Date.now();
  await p.getByRole('list', { name: 'Swatches' }).getByRole('button', { name: 'Lip colour, deep rose', exact: true }).click(); // 1
  await p.getByRole('heading', { name: 'Lip colour, deep rose' }).waitFor();
  const finder = p.getByTestId('shade-finder');
  await finder.getByRole('combobox', { name: /^Through look/ }).selectOption({ label: CYAN }); // 2
  await finder.getByRole('combobox', { name: /^Zone/ }).selectOption({ label: 'IV' }); // 3
  await finder.getByRole('button', { name: 'Find the shade' }).click(); // 4
  const result = p.getByTestId('shade-result');
  // the answer, or the refusal the page shows (so a failure says why)
  await result.or(finder.getByRole('alert')).first().waitFor({ timeout: 60_000 });
  if (!(await result.isVisible())) throw new Error(`the shade finder answered: ${await finder.getByRole('alert').first().innerText()}`);
  expect(await result.getAttribute('data-zone')).toBe('IV');
  const resultText = await result.innerText();
  expect(resultText).toMatch(/#[0-9a-f]{6} reads zone IV/);
  await shot(p, 'shade-01-swatch-page-result');
  await finder.getByRole('button', { name: 'Keep as new swatch' }).click(); // 5
  await finder.getByRole('status').filter({ hasText: 'Kept as' }).waitFor();
  await finder.getByRole('link', { name: 'Principal makeup' }).click(); // 6
  await p.getByRole('heading', { name: 'Principal makeup' }).waitFor();
  const name = `Lip colour, deep rose, zone IV through ${CYAN}`;
  // its own chips (others may name it among their merges)
  const chips = p.locator(`[data-testid="split-chip"][aria-label^="${name}: zone"]`);
  await chips.first().waitFor({ timeout: 30_000 });
  // chips run row by row, one per look in the board's order; the looks' headings give that order
  const lookNames = await p.locator('[aria-label="Swatches through each look"]').evaluate((grid) =>
    [...(grid.previousElementSibling?.querySelectorAll('h2') ?? [])].map((h) => h.textContent ?? ''));
  const zones = await chips.evaluateAll((els) => els.map((e) => e.getAttribute('data-zone')));
  const elapsedMs = Date.now() - started;
  console.info(`zone-IV task: 6 clicks, no typing, ${(elapsedMs / 1000).toFixed(1)} s of browser time from opening the swatch to seeing it on the board`);
  expect(zones).toHaveLength(lookNames.length);
  expect(zones[lookNames.indexOf(CYAN)]).toBe('IV');
  // the time is reported, not asserted (no timed tests: this machine is shared); a person's minute is the 6 clicks
  await chips.first().scrollIntoViewIfNeeded();
  await shotAt(p, 'shade-02-board-kept-shade');

  // the table view: the chosen sort stays in the address and survives a reload; it fits 1366 px
  await p.getByRole('button', { name: 'Table' }).click();
  await p.getByRole('button', { name: `Zone · ${CYAN}` }).click();
  await p.waitForURL(/tsort=zone-\d+/);
  const order = async () => (await p.getByRole('table', { name: 'Board as a table' }).locator('tbody tr td:first-child').allInnerTexts()).map((t) => t.split('\n')[0]);
  await p.getByRole('table', { name: 'Board as a table' }).waitFor();
  const before = await order();
  await p.reload();
  await p.getByRole('table', { name: 'Board as a table' }).locator('tbody tr').first().waitFor();
  // the rows are listed before the tones arrive (computed in the compute threads); the sort by zone needs them
  await p.getByText(/computed in \d+ ms on the server/).waitFor();
  expect(await p.locator('th[aria-sort="descending"], th[aria-sort="ascending"]').innerText()).toContain(CYAN);
  expect(await order()).toEqual(before);
  const overflow = await p.evaluate(() => {
    const t = document.querySelector('table')!.parentElement!;
    return { page: document.documentElement.scrollWidth - window.innerWidth, table: t.scrollWidth - t.clientWidth };
  });
  expect(overflow.page).toBeLessThanOrEqual(0);
  expect(overflow.table).toBeLessThanOrEqual(0);
  await shot(p, 'shade-03-board-table-1366');
  expect(errors).toEqual([]);
});

it('a skin swatch from a preset: the flush slider moves its zone through each look live', async () => {
  const { page: p, errors } = await swatchesAsMakeup();
  const form = p.getByRole('form', { name: 'Add a swatch' });
  await form.getByLabel('Name').fill('Test skin, flushed cheek');
  await form.getByText('Skin', { exact: true }).click();
  await form.getByRole('button', { name: 'Light skin', exact: true }).click();
  const cyan = form.locator(`[data-testid="live-zone"][data-look="${CYAN}"]`);
  await cyan.waitFor({ timeout: 30_000 });
  await p.waitForFunction(() => !document.querySelector('[aria-label="Zone through each look, live"]')?.getAttribute('aria-busy')?.includes('true'));
  const calm = Number(await cyan.getAttribute('data-stops'));
  expect(await form.getByTestId('skin-value-blood').innerText()).toBe('blood 2.0 %');
  const flush = form.getByLabel('Flush', { exact: true });
  await flush.focus();
  for (let i = 0; i < 12; i++) await flush.press('ArrowRight'); // 2 % → 8 %: blood ×4
  expect(await form.getByTestId('skin-value-blood').innerText()).toBe('blood 8.0 %');
  await p.waitForFunction((before) => {
    const el = document.querySelector('[data-testid="live-zone"][data-look="Panchromatic + red-absorbing cyan"]');
    return el && Number(el.getAttribute('data-stops')) !== before;
  }, calm, { timeout: 30_000 });
  const flushed = Number(await cyan.getAttribute('data-stops'));
  console.info(`flush through the cyan look: ${calm.toFixed(2)} → ${flushed.toFixed(2)} stops`);
  expect(flushed).toBeLessThan(calm); // more blood reads darker through the red-absorbing cyan
  await form.scrollIntoViewIfNeeded();
  await shotAt(p, 'skin-01-form-live-zones');
  await form.getByRole('button', { name: 'Add swatch' }).click();
  await p.getByRole('heading', { name: 'Test skin, flushed cheek' }).waitFor();
  await p.getByTestId('swatch-params').filter({ hasText: 'blood 8.0 %' }).waitFor();
  await p.getByTestId('swatch-look-tone').first().waitFor();
  await shot(p, 'skin-02-swatch-page');
  expect(errors).toEqual([]);
});

it('duplicates a swatch and edits the copy (colour, light, notes), with the message of a bad value beside its field', async () => {
  const { page: p, errors } = await swatchesAsMakeup();
  const list = p.getByRole('list', { name: 'Swatches' });
  // another department's swatch: a contributor may not edit it
  await list.getByRole('button', { name: 'Burgundy silk', exact: true }).click();
  await p.getByRole('heading', { name: 'Burgundy silk' }).waitFor();
  expect(await p.getByRole('button', { name: 'Edit', exact: true }).count()).toBe(0);

  await list.getByRole('button', { name: 'Lip colour, plum', exact: true }).click();
  await p.getByRole('heading', { name: 'Lip colour, plum' }).waitFor();
  await p.getByRole('button', { name: 'Duplicate' }).click();
  const form = p.getByRole('form', { name: 'Edit the swatch' });
  await form.waitFor();
  await form.getByLabel('Name').fill('Lip colour, plum, lighter (test)');
  await form.getByLabel('sRGB hex').fill('#zz3050');
  await form.getByRole('button', { name: 'Save changes' }).click();
  await form.getByRole('alert').filter({ hasText: 'A colour like #a33b3b.' }).waitFor();
  await form.getByText('RGB 0–255', { exact: true }).click();
  await form.getByLabel('R', { exact: true }).fill('300');
  await form.getByRole('button', { name: 'Save changes' }).click();
  await form.getByRole('alert').filter({ hasText: 'RGB values go from 0 to 255.' }).waitFor();
  await shot(p, 'edit-01-plain-words');
  await form.getByText('Hex or picker', { exact: true }).click();
  await form.getByLabel('sRGB hex').fill('#8a4060');
  await form.getByLabel('Light on this surface').selectOption({ label: '+1 st' });
  await form.getByLabel('Notes').fill('A lighter plum for the wide shots.');
  await form.getByLabel('sRGB hex').focus();
  await form.locator('[data-testid="live-zone"]').first().waitFor({ timeout: 30_000 });
  await shot(p, 'edit-02-form');
  await form.getByRole('button', { name: 'Save changes' }).click();
  await p.getByRole('heading', { name: 'Lip colour, plum, lighter (test)' }).waitFor();
  await p.getByTestId('swatch-light').filter({ hasText: 'lit 1 stop over the key' }).waitFor();
  await p.getByText('#8a4060').first().waitFor();
  await p.getByText('A lighter plum for the wide shots.').waitFor();
  // the original is unchanged
  await list.getByRole('button', { name: 'Lip colour, plum', exact: true }).click();
  await p.getByRole('heading', { name: 'Lip colour, plum', exact: true }).waitFor();
  await shot(p, 'edit-03-original');
  expect(errors).toEqual([]);
});
