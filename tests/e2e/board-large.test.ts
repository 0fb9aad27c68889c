/**
 * A long board in the real built app (headless Chromium): 150 swatches through two looks. The chips and the
 * table draw only the rows near the view (issue 15: a board page stays responsive with thousands of chips),
 * scrolling brings the others, the chips name a few partners and say how many more, and the table keeps its
 * sort in the address and exports every row, not only those drawn.
 */
import fs from 'node:fs';
import { expect, it } from 'vitest';
import { openSignedIn, useAppAndBrowser } from '../helpers/browser';

const env = useAppAndBrowser();
const N = 150;

it('draws a long board a screenful at a time, as chips and as a table, and exports all of it', async () => {
  const { page: p, pid, errors } = await openSignedIn(env, 'costume@demo.grisaille.test', { viewport: { width: 1366, height: 900 } });
  const boardId = await p.evaluate(async ({ pid, n }) => {
    const { csrfToken } = await fetch('/api/auth/csrf').then((r) => r.json());
    const post = (url: string, body: unknown) =>
      fetch(url, { method: 'POST', headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': csrfToken }, body: JSON.stringify(body) }).then((r) => r.json());
    const ids: number[] = [];
    for (let i = 0; i < n; i++) {
      const hex = '#' + [i * 37, i * 91, i * 53].map((v) => (v % 256).toString(16).padStart(2, '0')).join('');
      ids.push((await post(`/api/productions/${pid}/swatches`, { name: `Long board swatch ${i + 1}`, department: 'costume', origin: { type: 'colour', colour: { space: 'hex', hex } } })).swatch.id);
    }
    const looks = (await fetch(`/api/productions/${pid}/looks`).then((r) => r.json())).looks.slice(0, 2).map((l: { id: number }) => l.id);
    return (await post(`/api/productions/${pid}/boards`, { name: 'A long board', lookIds: looks, swatchIds: ids, mergeStops: 1, mergeDeltaE: 5 })).board.id as number;
  }, { pid, n: N });

  await p.goto(`${env.app.url}/p/${pid}/boards/${boardId}`);
  await p.getByRole('heading', { name: 'A long board' }).waitFor();
  const grid = p.locator('[aria-label="Swatches through each look"]');
  await grid.getByTestId('split-chip').first().waitFor({ timeout: 60_000 });
  expect(await grid.getAttribute('aria-rowcount')).toBe(String(N));
  const drawn = await grid.getByTestId('split-chip').count();
  expect(drawn).toBeGreaterThan(0);
  expect(drawn).toBeLessThan(N); // of 300 chips, only a screenful or so
  // a chip names a few partners and says how many more (most of these merge with many others)
  expect(await grid.getByTestId('split-chip').filter({ hasText: / and \d+ more/ }).count()).toBeGreaterThan(0);
  const firstLabel = await grid.getByTestId('split-chip').first().getAttribute('aria-label');
  await p.evaluate(() => window.scrollTo(0, document.body.scrollHeight));
  await p.waitForFunction((first) => {
    const chips = document.querySelectorAll('[aria-label="Swatches through each look"] [data-testid="split-chip"]');
    return chips.length > 0 && chips[0].getAttribute('aria-label') !== first;
  }, firstLabel);
  expect(await grid.getByTestId('split-chip').count()).toBeLessThan(N);

  // the table: rows drawn near the view, the sort in the address, every row in the CSV
  await p.evaluate(() => window.scrollTo(0, 0));
  await p.getByRole('radio', { name: 'Table' }).or(p.getByRole('button', { name: 'Table' })).first().click();
  const table = p.getByRole('table', { name: 'Board as a table' });
  await table.waitFor();
  const rows = () => table.locator('tbody tr:not([aria-hidden])').count();
  expect(await rows()).toBeGreaterThan(0);
  expect(await rows()).toBeLessThan(N);
  await table.getByRole('button', { name: /^Swatch/ }).click();
  await p.waitForURL(/tsort=name%3A(asc|desc)|tsort=name:(asc|desc)/);
  const download = p.waitForEvent('download');
  await p.getByRole('button', { name: 'Export CSV' }).click();
  const file = await (await download).path();
  const lines = fs.readFileSync(file!, 'utf8').trim().split(/\r?\n/);
  expect(lines.length).toBe(N + 1);
  expect(errors).toEqual([]);
});
