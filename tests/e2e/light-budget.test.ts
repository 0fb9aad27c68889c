import { expect, it } from 'vitest';
import { openSignedIn, shot, useAppAndBrowser } from '../helpers/browser';

/**
 * The producer's light budget at 1280 × 800: on Looks (every look against the first), on Compare (the looks
 * compared, each column saying what it needs against the first) and on the exposure sheet (this look's bar
 * in the accent colour). Figures are the API's (tests/api/light-budget.test.ts checks them against
 * ISO 2720 and the EI chain); here the check is that they are shown and read the same everywhere.
 */
const env = useAppAndBrowser();

it('shows the light budget on Looks, Compare and the exposure sheet', async () => {
  const { page, errors, pid } = await openSignedIn(env, 'producer@demo.grisaille.test', { viewport: { width: 1280, height: 800 } });
  const looks: { id: number; name: string }[] = (await page.evaluate((p) => fetch(`/api/productions/${p}/looks`).then((r) => r.json()), pid)).looks;
  const plain = looks.find((l) => l.name === 'Panchromatic, no filter')!;
  const ortho = looks.find((l) => l.name === 'Orthochromatic')!;
  const budget = await page.evaluate(async ([p, ids]) => {
    const { csrfToken } = await fetch('/api/auth/csrf').then((r) => r.json());
    const r = await fetch(`/api/productions/${p}/looks/light-budget`, { method: 'POST', headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': csrfToken }, body: JSON.stringify({ lookIds: ids }) });
    return r.json();
  }, [pid, [plain.id, ortho.id]] as const);
  const orthoTimes = `${Number(budget.looks?.[1]?.relative?.toPrecision(2))}×`;

  // Looks: one bar per look, the first (the reference) at 1×
  await page.goto(`${env.app.url}/p/${pid}/looks`);
  const chart = page.getByTestId('light-budget-chart');
  await chart.waitFor();
  expect(await chart.locator('li').count()).toBe(looks.length);
  expect(await chart.locator('li').first().textContent()).toContain('1×');
  await chart.locator(`li[data-look="${ortho.id}"]`).getByText(orthoTimes).waitFor();
  await page.getByText(/the light of Panchromatic, no filter/).first().waitFor();
  await shot(page, 'light-budget-01-looks');

  // Compare: the chart of the two and, in the second column, the sentence
  await page.goto(`${env.app.url}/p/${pid}/looks/compare?ids=${plain.id},${ortho.id}`);
  await page.getByTestId('light-budget-chart').waitFor();
  const lines = page.getByTestId('relative-light');
  await lines.nth(1).getByText(`Needs ${orthoTimes} the light of`).waitFor();
  expect(await lines.nth(1).locator('em').textContent()).toBe('Panchromatic, no filter');
  await shot(page, 'light-budget-02-compare');

  // the sheet: the block with this look's sentence
  await page.goto(`${env.app.url}/p/${pid}/looks/${ortho.id}/sheet`);
  const block = page.getByTestId('sheet-light-budget');
  await block.waitFor();
  await block.getByText(`This look needs ${orthoTimes} the light of`).waitFor();
  await block.scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-output/screenshots/light-budget-03-sheet.png' });
  expect(errors).toEqual([]);
});
