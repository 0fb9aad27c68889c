import { expect, it } from 'vitest';
import { openSignedIn, pageErrors, shot, signIn, useAppAndBrowser } from '../helpers/browser';

const env = useAppAndBrowser();

it('the cinematographer signs in, opens the demo production and its team, and signs out', async () => {
  const page = await env.browser.newPage({ viewport: { width: 1366, height: 850 } });
  const errors = pageErrors(page);
  await page.goto(`${env.app.url}/`);
  await page.waitForURL(/\/sign-in/);
  await shot(page, 'foundation-01-sign-in');
  await signIn(page, env.app.url, 'camera@demo.grisaille.test');
  await page.getByRole('heading', { name: 'Productions' }).waitFor();
  await shot(page, 'foundation-02-productions');
  await page.getByRole('link', { name: /The Clockmaker's Winter/ }).click();
  await page.getByRole('heading', { name: "The Clockmaker's Winter" }).waitFor();
  await page.getByText(/You are owner in camera/).waitFor();
  await shot(page, 'foundation-03-overview');
  await page.getByRole('navigation', { name: 'Production' }).getByRole('link', { name: 'Team' }).click();
  await page.getByRole('cell', { name: 'makeup@demo.grisaille.test' }).waitFor();
  expect(await page.getByRole('button', { name: 'Send invitation' }).count()).toBe(1);
  await shot(page, 'foundation-04-team');
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(/\/sign-in/);
  const me = await page.evaluate(() => fetch('/api/auth/me').then((r) => r.json()));
  expect(me.user).toBeNull();
  expect(errors).toEqual([]);
});

it('a viewer sees the team but not the invitation form', async () => {
  const { page, pid } = await openSignedIn(env, 'producer@demo.grisaille.test', { viewport: { width: 1366, height: 850 } });
  await page.goto(`${env.app.url}/p/${pid}/team`);
  await page.getByRole('cell', { name: 'camera@demo.grisaille.test' }).waitFor();
  expect(await page.getByRole('button', { name: 'Send invitation' }).count()).toBe(0);
  await shot(page, 'foundation-05-team-as-viewer');
});
