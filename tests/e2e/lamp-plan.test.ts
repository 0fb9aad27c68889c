import { expect, it } from 'vitest';
import { openSignedIn, shot, useAppAndBrowser } from '../helpers/browser';
import { lampPlan } from '../../shared/tone/lamp-plan';
import { formatFootcandles } from '../../shared/tone/exposure-format';

/**
 * The gaffer's lamp plan at a laptop's 1280 × 800: a look's EI fills in, two lamps give their share, the
 * total against the need and the key-to-fill ratio against the medium's threshold; moving the fill back
 * past the threshold says it must come closer. Expected figures are the engine's own (shared/tone/lamp-plan,
 * checked against the published formulas in tests/unit/tone/lamp-plan.test.ts).
 */

/** Fact of the trade (common practice): the demo panchromatic negative's box speed 250, no filter → EI 250. */
const PLAIN_EI = 250;
/** The page's example lamps (invented figures): key 12,000 cd at 3 m, 30°; fill 5,000 lm over 90° at 5 m, 0°. */
const KEY = { name: 'Key', intensityCd: 12_000, distanceM: 3, angleDeg: 30, role: 'key' as const };
const FILL = { name: 'Fill', lumens: 5000, beamAngleDeg: 90, distanceM: 5, angleDeg: 0, role: 'fill' as const };
/** A modern negative holds about 5 stops under the key (common practice). */
const MODERN_STOPS = 5;
const CAMERA = { ei: PLAIN_EI, tStop: 2.8, fps: 24, shutterAngle: 180 };

const env = useAppAndBrowser();

it('plans two lamps against a look’s need and reads the key-to-fill ratio', async () => {
  const { page, errors, pid } = await openSignedIn(env, 'gaffer@demo.grisaille.test', { viewport: { width: 1280, height: 800 } });
  const looks: { id: number; name: string }[] = (await page.evaluate((p) => fetch(`/api/productions/${p}/looks`).then((r) => r.json()), pid)).looks;
  const plain = looks.find((l) => l.name === 'Panchromatic, no filter')!;

  await page.goto(`${env.app.url}/p/${pid}`);
  await page.getByRole('link', { name: 'Lamp plan' }).click();
  await page.getByRole('heading', { name: 'Lamp plan' }).waitFor();
  await page.getByRole('combobox', { name: 'Look', exact: true }).selectOption(String(plain.id));
  await page.getByTestId('plan-ei-source').waitFor();
  expect(await page.getByLabel('Exposure index').inputValue()).toBe(String(PLAIN_EI));

  // two lamps, each with its share, the total and the ratio
  expect(await page.getByTestId('lamp-table').locator('tbody tr[data-testid^="lamp-row-"]').count()).toBe(2);
  const expected = lampPlan({ ...CAMERA, lamps: [KEY, FILL], shadowDetailStops: MODERN_STOPS });
  const totalText = formatFootcandles(expected.totalFc);
  await page.getByTestId('plan-total').getByText(totalText).waitFor();
  expect(await page.getByTestId('plan-needed').textContent()).toBe(formatFootcandles(expected.needed.footcandles));
  expect(await page.getByTestId('plan-ratio-stops').textContent()).toBe(`${expected.keyToFill!.stops.toFixed(1)} stops`);
  expect(await page.getByTestId('plan-key-fill').textContent()).toMatch(/Within it/);
  expect(await page.getByTestId('plan-total-vs').textContent()).toMatch(/stops more than needed/);
  // the fill's 1.2 m face at 5 m is too close for a point source
  await page.getByTestId('lamp-near-1').waitFor();
  await page.getByTestId('plan-cautions').getByText(/licensed electricians and local codes/).waitFor();
  await shot(page, 'lamp-plan-01-two-lamps');

  // the fill back to 12 m: past the threshold, so the page says to bring it closer
  await page.getByLabel('Distance of Fill').fill('12');
  const far = lampPlan({ ...CAMERA, lamps: [KEY, { ...FILL, distanceM: 12 }], shadowDetailStops: MODERN_STOPS });
  expect(far.keyToFill!.exceeds).toBe(true);
  await page.getByTestId('plan-ratio-stops').getByText(`${far.keyToFill!.stops.toFixed(1)} stops`).waitFor();
  await page.getByTestId('plan-key-fill').getByText(/Past the threshold: bring Fill to [\d.]+ m or closer/).waitFor();
  await shot(page, 'lamp-plan-02-fill-too-far');

  // add a lamp and remove it again; a bad distance is named on its row
  await page.getByRole('button', { name: 'Add a lamp' }).click();
  await page.getByLabel('Candela of Lamp 3').fill('0');
  await page.getByTestId('lamp-table').getByRole('alert').first().waitFor();
  await page.getByRole('button', { name: 'Remove Lamp 3' }).click();
  expect(await page.getByTestId('lamp-table').locator('tbody tr[data-testid^="lamp-row-"]').count()).toBe(2);
  expect(errors).toEqual([]);
});
