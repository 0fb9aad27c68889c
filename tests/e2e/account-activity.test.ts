import { expect, it } from 'vitest';
import { openSignedIn, shot, useAppAndBrowser } from '../helpers/browser';

/**
 * The owner's audit trail and a member's own account, in the browser at 1366 × 860 (issue 14): the
 * cinematographer renames a look and sees it on the Activity page, which a viewer's menu does not offer;
 * on the Account page a second session of the same person is listed by browser in words and ended.
 */
const env = useAppAndBrowser();

it('shows who changed what on Activity (owners only), and lists and ends a session on Account', async () => {
  const owner = await openSignedIn(env, 'camera@demo.grisaille.test', { viewport: { width: 1366, height: 860 } });
  const { page, pid } = owner;
  const renamed = await page.evaluate(async (p) => {
    const { csrfToken } = await fetch('/api/auth/csrf').then((r) => r.json());
    const look = (await fetch(`/api/productions/${p}/looks`).then((r) => r.json())).looks[0];
    const name = `${look.name} (second test)`;
    await fetch(`/api/productions/${p}/looks/${look.id}`, { method: 'PATCH', headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': csrfToken }, body: JSON.stringify({ name }) });
    return { from: look.name as string, to: name };
  }, pid);

  await page.goto(`${env.app.url}/p/${pid}`);
  await page.getByRole('navigation', { name: 'Production' }).getByRole('link', { name: 'Activity' }).click();
  await page.getByText(`changed look '${renamed.to}' — renamed from '${renamed.from}'`).waitFor();
  expect(await page.getByRole('row').filter({ hasText: renamed.to }).getByText('Cinematographer').count()).toBe(1);
  await shot(page, 'activity-01-owner');

  // a viewer's menu has no Activity entry
  const viewer = await openSignedIn(env, 'producer@demo.grisaille.test', { viewport: { width: 1366, height: 860 } });
  await viewer.page.goto(`${env.app.url}/p/${pid}`);
  await viewer.page.getByRole('navigation', { name: 'Production' }).getByRole('link', { name: 'Looks' }).waitFor();
  expect(await viewer.page.getByRole('navigation', { name: 'Production' }).getByRole('link', { name: 'Activity' }).count()).toBe(0);

  // a second browser of the cinematographer, then the account page from the name in the header
  const second = await openSignedIn(env, 'camera@demo.grisaille.test', { viewport: { width: 1024, height: 700 }, userAgent: 'Mozilla/5.0 (X11; Linux x86_64; rv:140.0) Gecko/20100101 Firefox/140.0' });
  await page.getByRole('link', { name: 'Cinematographer' }).click();
  await page.getByRole('heading', { name: 'Your sessions' }).waitFor();
  await page.getByText('Firefox on Linux').waitFor();
  await shot(page, 'activity-02-account');
  const before = await page.getByRole('listitem').filter({ hasText: 'Firefox on Linux' }).count();
  expect(before).toBe(1);
  await page.getByRole('listitem').filter({ hasText: 'Firefox on Linux' }).getByRole('button', { name: 'End' }).click();
  await page.getByText('Firefox on Linux').waitFor({ state: 'detached' });
  // the ended browser is signed out: its next call answers 401
  const status = await second.page.evaluate(() => fetch('/api/productions').then((r) => r.status));
  expect(status).toBe(401);
  expect(owner.errors).toEqual([]);
});
