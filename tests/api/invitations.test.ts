import { afterAll, beforeAll, expect, it } from 'vitest';
import { startTestApp, type Agent, type TestApp } from '../helpers/api';
import { Invitation } from '../../server/db/entities/invitation.entity';
import { Membership } from '../../server/db/entities/membership.entity';
import { User } from '../../server/db/entities/user.entity';

let t: TestApp;
beforeAll(async () => void (t = await startTestApp()));
afterAll(async () => t.close());

/** The demo production's owner (the cinematographer), signed in. */
const signInOwner = () => t.agent('camera@demo.grisaille.test');
const invite = (owner: Agent, pid: number, email: string, role: string, department: string) =>
  owner.post(`/api/productions/${pid}/invitations`).send({ email, role, department });
/** The token of the invitation mailed last. */
const lastInvitationToken = async () => t.linkIn((await t.outbox())[0].text, '/invitation/');

it('invites a new person end to end through the fake SMTP server', async () => {
  const pid = t.demoProductionId;
  const r = await invite(await signInOwner(), pid, 'Colourist@Example.test', 'viewer', 'lab');
  expect(r.status).toBe(201);
  expect(r.body.invitation.email).toBe('colourist@example.test');
  const expires = new Date(r.body.invitation.expiresAt).getTime();
  expect(Math.abs(expires - Date.now() - 7 * 24 * 3600e3)).toBeLessThan(60e3); // 7 days

  const [mail] = await t.outbox();
  expect(mail.to).toContain('colourist@example.test');
  expect(mail.subject).toContain("The Clockmaker's Winter");
  expect(mail.html).toContain('<a href="http://localhost:5178/invitation/');
  const token = t.linkIn(mail.text, '/invitation/');

  const guest = await t.agent();
  const info = await guest.get(`/api/invitations/${token}`);
  expect(info.status).toBe(200);
  expect(info.body.invitation).toMatchObject({ email: 'colourist@example.test', role: 'viewer', department: 'lab', hasAccount: false });

  const noName = await guest.post(`/api/invitations/${token}/accept`).send({ password: 'colourist-password' });
  expect(noName.status).toBe(400);
  expect(noName.body.error.field).toBe('name');

  const ok = await guest.post(`/api/invitations/${token}/accept`).send({ name: 'Colourist', password: 'colourist-password' });
  expect(ok.status).toBe(200);
  guest.set('X-CSRF-Token', ok.body.csrfToken);
  expect((await guest.get('/api/auth/me')).body.user.email).toBe('colourist@example.test');
  const list = await guest.get('/api/productions');
  expect(list.body.productions).toEqual([expect.objectContaining({ id: pid, myRole: 'viewer', myDepartment: 'lab' })]);

  // single use
  const again = await (await t.agent()).post(`/api/invitations/${token}/accept`).send({ name: 'X', password: 'another-password' });
  expect(again.status).toBe(404);
});

it('an existing account accepts with its own password', async () => {
  const owner = await signInOwner();
  const p = await owner.post('/api/productions').send({ name: 'Second unit' });
  const pid = p.body.production.id;
  await invite(owner, pid, 'lab@demo.grisaille.test', 'editor', 'lab');
  const token = await lastInvitationToken();
  const guest = await t.agent();
  expect((await guest.get(`/api/invitations/${token}`)).body.invitation.hasAccount).toBe(true);
  const wrong = await guest.post(`/api/invitations/${token}/accept`).send({ password: 'not-the-password' });
  expect(wrong.status).toBe(403);
  const ok = await guest.post(`/api/invitations/${token}/accept`).send({ password: 'grisaille-demo' });
  expect(ok.status).toBe(200);
  expect(ok.body.productionId).toBe(pid);
});

it('refuses an expired invitation, and a second invitation to a member', async () => {
  const owner = await signInOwner();
  const pid = t.demoProductionId;
  const dup = await invite(owner, pid, 'makeup@demo.grisaille.test', 'viewer', 'makeup');
  expect(dup.status).toBe(409);
  expect(dup.body.error.field).toBe('email');
  await invite(owner, pid, 'late@example.test', 'viewer', 'art');
  const token = await lastInvitationToken();
  await t.ctx.ds.getRepository(Invitation).update({ email: 'late@example.test' }, { expiresAt: new Date(Date.now() - 1000) });
  const guest = await t.agent();
  expect((await guest.get(`/api/invitations/${token}`)).status).toBe(404);
  expect((await guest.post(`/api/invitations/${token}/accept`).send({ name: 'Late', password: 'late-password-1' })).status).toBe(404);
  expect(await t.ctx.ds.getRepository(User).countBy({ email: 'late@example.test' })).toBe(0);
});

it('owners change roles, but the last owner stays', async () => {
  const owner = await signInOwner();
  const pid = t.demoProductionId;
  const members = (await owner.get(`/api/productions/${pid}/members`)).body.members as { id: number; role: string; user: { email: string } }[];
  const me = members.find((m) => m.user.email === 'camera@demo.grisaille.test')!;
  const demote = await owner.patch(`/api/productions/${pid}/members/${me.id}`).send({ role: 'editor' });
  expect(demote.status).toBe(409);
  const lab = members.find((m) => m.user.email === 'lab@demo.grisaille.test')!;
  const up = await owner.patch(`/api/productions/${pid}/members/${lab.id}`).send({ role: 'contributor', department: 'art' });
  expect(up.status).toBe(200);
  const row = await t.ctx.ds.getRepository(Membership).findOneByOrFail({ id: lab.id });
  expect([row.role, row.department]).toEqual(['contributor', 'art']);
  const bad = await owner.patch(`/api/productions/${pid}/members/${lab.id}`).send({ role: 'boss' });
  expect(bad.status).toBe(400);
  expect(bad.body.error.field).toBe('role');
});
