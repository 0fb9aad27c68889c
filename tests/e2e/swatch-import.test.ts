/**
 * A spectrophotometer file in the real built app (headless Chromium): the costume member imports a CGATS.17
 * file of fabrics from the Swatches page onto the costume board, sees the preview (names, colour chips, point
 * counts, the percent note), adds them, and finds them on the board. The fabrics and their spectra are invented.
 */
import { expect, it } from 'vitest';
import { openSignedIn, shot, useAppAndBrowser } from '../helpers/browser';
import { cgatsText, inventedFabric } from '../helpers/cgats';

const env = useAppAndBrowser();

const nm = Array.from({ length: 36 }, (_, i) => 380 + 10 * i); // 380–730 nm at 10 nm
/** Invented fabrics (not real products), percent with SPECTRAL_NORM 100, as an instrument might export them. */
const FABRICS = cgatsText(
  ['ORIGINATOR "Invented costume workroom"', 'DESCRIPTOR "Invented fabrics for the browser test"', 'KEYWORD "SPECTRAL_NORM"', 'SPECTRAL_NORM 100'],
  nm,
  [
    ['T1', 'Test serge, rust', inventedFabric(nm, 5, 40, 640, 55)],
    ['T2', 'Test tweed, moss', inventedFabric(nm, 6, 14, 540, 55)],
    ['T3', 'Test cotton, cornflower', inventedFabric(nm, 10, 35, 460, 55)],
    ['T4', 'Test muslin, oat', inventedFabric(nm, 45, 20, 620, 55)],
  ],
);
const NAMES = ['Test serge, rust', 'Test tweed, moss', 'Test cotton, cornflower', 'Test muslin, oat'];

it('the costume member imports a CGATS file of fabrics onto the costume board', async () => {
  const { page: p, errors, pid } = await openSignedIn(env, 'costume@demo.grisaille.test', { viewport: { width: 1366, height: 900 } });
  await p.goto(`${env.app.url}/p/${pid}/swatches`);
  await p.getByRole('heading', { name: 'Swatches', level: 1 }).waitFor();
  await p.getByRole('button', { name: 'Import measured file' }).click();
  await p.getByLabel('Put them on a board').selectOption({ label: 'Workshop wardrobe (costume)' });
  // a bad value: the error names the line and field, and nothing is offered to add
  const bad = FABRICS.replace(/("Test tweed, moss" )\S+/, '$1 x.5');
  await p.locator('#swatch-import-file').setInputFiles({ name: 'fabrics-bad.cgats', mimeType: 'text/plain', buffer: Buffer.from(bad) });
  await p.getByRole('alert').filter({ hasText: 'fabrics-bad.cgats, line 13, field SPECTRAL_NM380: "x.5" is not a number' }).waitFor();
  await shot(p, 'swatch-import-00-bad-line');
  expect(await p.getByRole('button', { name: /^Add \d+ swatch/ }).count()).toBe(0);

  await p.locator('#swatch-import-file').setInputFiles({ name: 'fabrics-test.cgats', mimeType: 'text/plain', buffer: Buffer.from(FABRICS) });

  const table = p.getByRole('table', { name: 'Samples in the file' });
  await table.waitFor();
  for (const n of NAMES) await table.getByRole('cell', { name: n, exact: true }).waitFor();
  expect(await table.getByRole('cell', { name: '36', exact: true }).count()).toBe(4);
  await p.getByText(/percent.*SPECTRAL_NORM 100/).waitFor();
  await p.getByRole('button', { name: 'Add 4 swatches to Workshop wardrobe' }).scrollIntoViewIfNeeded();
  await shot(p, 'swatch-import-01-preview');

  await p.getByRole('button', { name: 'Add 4 swatches to Workshop wardrobe' }).click();
  await p.getByText('Added 4 measured swatches to Workshop wardrobe.').waitFor();
  const list = p.getByRole('list', { name: 'Swatches' });
  for (const n of NAMES) await list.getByRole('button', { name: n, exact: true }).waitFor();
  await p.evaluate(() => window.scrollTo(0, 0));
  await shot(p, 'swatch-import-02-added');

  // on the board
  await p.goto(`${env.app.url}/p/${pid}/boards`);
  await p.getByRole('link', { name: 'Workshop wardrobe' }).first().click();
  await p.getByRole('heading', { name: 'Workshop wardrobe' }).waitFor();
  for (const n of NAMES) await p.getByTestId('split-chip').filter({ hasText: n }).first().waitFor();
  await shot(p, 'swatch-import-03-board');
  expect(errors).toEqual([]);
});
