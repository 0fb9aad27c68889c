/**
 * The production's activity log (issue 14 item 7): every write of a look, swatch, board, curve, photo,
 * member, invitation and the production itself leaves one entry with its actor and time; failed writes
 * leave none; only owners read it, one production at a time, page by page; refused role checks and every
 * entry reach the operator's log. Every state-changing production route has a decision in the registry.
 */
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoAs, type Agent, type TestApp } from '../helpers/api';
import { cgatsText } from '../helpers/cgats';
import { productionRoutes } from '../../server/modules/route-registry';
import { ACTIVITY_ROUTES, activityDecision } from '../../server/services/activity/activity-routes';
import { ActivityEntry } from '../../server/db/entities/activity.entity';
import { onLogEvent } from '../../server/services/log';
import type { ActivityEntryView, ActivityPage } from '../../shared/schemas/activity';

let t: TestApp;
let pid: number;
let base: string;
let owner: Agent;
let editor: Agent;
let makeup: Agent;
let costume: Agent;
let viewer: Agent;
/** user ids by agent key */
const ids: Record<string, number> = {};
const NAMES = { owner: 'Cinematographer', editor: 'Camera assistant', makeup: 'Makeup designer' };

const pan = { light: { source: { id: 'tungsten-3200' } }, filters: [], medium: { source: { id: 'panchromatic' } } };
const hexSwatch = (name: string, hex: string) => ({ name, origin: { type: 'colour', colour: { space: 'hex', hex } } });
const flatFilter = (name: string) => ({ kind: 'filter', name, origin: { type: 'parametric', filter: { neutralDensity: 0.3 } } });

beforeAll(async () => {
  ({ t, pid, base, as: { owner, editor, makeup, costume, viewer } } = await startDemoAs({ owner: 'camera', editor: 'assistant', makeup: 'makeup', costume: 'costume', viewer: 'producer' }));
  for (const [k, a] of Object.entries({ owner, editor, makeup, costume, viewer })) ids[k] = (await a.get('/api/auth/me')).body.user.id;
});
afterAll(async () => t?.close());

const page = async (q = '', as: Agent = owner): Promise<ActivityPage> => {
  const r = await as.get(`${base}/activity${q}`);
  expect(r.status).toBe(200);
  return r.body;
};
/** The newest entry of the demo production. */
const latest = async (): Promise<ActivityEntryView> => (await page('?limit=1')).entries[0];
const rowCount = () => t.ctx.ds.getRepository(ActivityEntry).count();

/** Runs a write, then checks the newest entry: who, what, when (between the call and now). */
async function expectEntry(write: () => Promise<{ status: number }>, status: number, want: Partial<Omit<ActivityEntryView, 'actor'>> & { actor: keyof typeof NAMES }) {
  const t0 = Date.now();
  const r = await write();
  expect(r.status).toBe(status);
  const e = await latest();
  const { actor, ...rest } = want;
  expect(e).toMatchObject({ ...rest, actor: { id: ids[actor], name: NAMES[actor] } });
  // the time of the write: second precision either side is plenty (no timing assertion)
  expect(new Date(e.at).getTime()).toBeGreaterThanOrEqual(t0 - 1000);
  expect(new Date(e.at).getTime()).toBeLessThanOrEqual(Date.now() + 1000);
  return e;
}

describe('every state-changing production route has a decision', () => {
  it('each POST, PUT, PATCH and DELETE under a production is in ACTIVITY_ROUTES, and each line names a real route', () => {
    const writes = productionRoutes.filter((r) => r.method !== 'get');
    expect(writes.length).toBeGreaterThanOrEqual(25);
    expect(writes.filter((r) => r.activity === undefined).map((r) => `${r.method} ${r.path}`)).toEqual([]);
    const registered = new Set(productionRoutes.map((r) => `${r.method} ${r.path.replace('/api/productions/:productionId', '')}`));
    expect(Object.keys(ACTIVITY_ROUTES).filter((k) => !registered.has(k))).toEqual([]);
  });

  it('reads record nothing; an unknown write is undecided', () => {
    expect(activityDecision('get', '/looks')).toBe(false);
    expect(activityDecision('post', '/looks/analyse')).toBe(false);
    expect(activityDecision('post', '/something-new')).toBeUndefined();
  });
});

describe('what is recorded', () => {
  it('a look created, changed, duplicated and deleted', async () => {
    const made = await expectEntry(() => owner.post(`${base}/looks`).send({ name: 'Night exterior', ...pan }), 201, { actor: 'owner', action: 'created', kind: 'look', itemName: 'Night exterior' });
    const id = made.itemId!;
    await expectEntry(() => editor.patch(`${base}/looks/${id}`).send({ name: 'Night exterior, rain', filters: [{ filter: { source: { id: 'red-590' } }, on: 'lens' }] }), 200, {
      actor: 'editor', action: 'changed', kind: 'look', itemId: id, itemName: 'Night exterior, rain', detail: "renamed from 'Night exterior', filters",
    });
    const dup = await expectEntry(() => editor.post(`${base}/looks/${id}/duplicate`).send({}), 201, { actor: 'editor', action: 'duplicated', kind: 'look', detail: "from 'Night exterior, rain'" });
    expect(dup.itemId).not.toBe(id);
    await expectEntry(() => owner.delete(`${base}/looks/${id}`), 204, { actor: 'owner', action: 'deleted', kind: 'look', itemId: id, itemName: 'Night exterior, rain' });
  });

  it('a swatch created, changed, duplicated, imported and deleted', async () => {
    const made = await expectEntry(() => makeup.post(`${base}/swatches`).send(hexSwatch('Lip colour, deep red', '#7a1f2b')), 201, { actor: 'makeup', action: 'created', kind: 'swatch', itemName: 'Lip colour, deep red' });
    const id = made.itemId!;
    await expectEntry(() => makeup.patch(`${base}/swatches/${id}`).send({ notes: 'for the night scenes' }), 200, { actor: 'makeup', action: 'changed', kind: 'swatch', itemId: id, itemName: 'Lip colour, deep red', detail: 'notes' });
    await expectEntry(() => makeup.post(`${base}/swatches/${id}/duplicate`), 201, { actor: 'makeup', action: 'duplicated', kind: 'swatch', detail: "from 'Lip colour, deep red'" });
    const nm = Array.from({ length: 31 }, (_, i) => 400 + 10 * i);
    const file = cgatsText(['ORIGINATOR "Invented makeup room"'], nm, [['S1', 'Greasepaint, pale', nm.map(() => '60')], ['S2', 'Greasepaint, dark', nm.map(() => '20')]]);
    await expectEntry(() => makeup.post(`${base}/swatches/import`).attach('file', Buffer.from(file), { filename: 'paints.cgats', contentType: 'text/plain' }), 201, {
      actor: 'makeup', action: 'imported', kind: 'swatch', itemId: null, itemName: '2 swatches', detail: 'Greasepaint, pale, Greasepaint, dark',
    });
    await expectEntry(() => makeup.delete(`${base}/swatches/${id}`), 204, { actor: 'makeup', action: 'deleted', kind: 'swatch', itemId: id, itemName: 'Lip colour, deep red' });
  });

  it('a board created, changed and deleted', async () => {
    const made = await expectEntry(() => makeup.post(`${base}/boards`).send({ name: 'Blood tests' }), 201, { actor: 'makeup', action: 'created', kind: 'board', itemName: 'Blood tests' });
    const id = made.itemId!;
    await expectEntry(() => makeup.patch(`${base}/boards/${id}`).send({ name: 'Blood tests, day 2', mergeStops: 0.5 }), 200, { actor: 'makeup', action: 'changed', kind: 'board', detail: "renamed from 'Blood tests', mergeStops" });
    await expectEntry(() => makeup.delete(`${base}/boards/${id}`), 204, { actor: 'makeup', action: 'deleted', kind: 'board', itemId: id, itemName: 'Blood tests, day 2' });
  });

  it('a curve of the library created, changed and deleted', async () => {
    const made = await expectEntry(() => editor.post(`${base}/curves`).send(flatFilter('Test ND 0.3')), 201, { actor: 'editor', action: 'created', kind: 'curve', itemName: 'Test ND 0.3' });
    const id = made.itemId!;
    await expectEntry(() => editor.patch(`${base}/curves/${id}`).send({ name: 'Test ND 0.3 (one stop)' }), 200, { actor: 'editor', action: 'changed', kind: 'curve', itemName: 'Test ND 0.3 (one stop)', detail: "renamed from 'Test ND 0.3'" });
    await expectEntry(() => owner.delete(`${base}/curves/${id}`), 204, { actor: 'owner', action: 'deleted', kind: 'curve', itemId: id, itemName: 'Test ND 0.3 (one stop)' });
  });

  it('a photo uploaded, renamed and deleted', async () => {
    const png = await sharp({ create: { width: 16, height: 12, channels: 3, background: { r: 150, g: 90, b: 60 } } }).png().toBuffer();
    const made = await expectEntry(() => makeup.post(`${base}/photos`).field('name', 'Skin test, window light').attach('file', png, 'skin.png'), 201, { actor: 'makeup', action: 'created', kind: 'photo', itemName: 'Skin test, window light' });
    const id = made.itemId!;
    await expectEntry(() => makeup.patch(`${base}/photos/${id}`).send({ name: 'Skin test, north window' }), 200, { actor: 'makeup', action: 'changed', kind: 'photo', detail: "renamed from 'Skin test, window light'" });
    await expectEntry(() => makeup.delete(`${base}/photos/${id}`), 204, { actor: 'makeup', action: 'deleted', kind: 'photo', itemId: id, itemName: 'Skin test, north window' });
  });

  it("a member's role changed, and a member removed", async () => {
    const members: { id: number; user: { name: string } }[] = (await owner.get(`${base}/members`)).body.members;
    const producer = members.find((m) => m.user.name === 'Producer')!;
    await expectEntry(() => owner.patch(`${base}/members/${producer.id}`).send({ role: 'contributor' }), 200, { actor: 'owner', action: 'changed', kind: 'member', itemId: producer.id, itemName: 'Producer', detail: 'role: contributor' });
    await owner.patch(`${base}/members/${producer.id}`).send({ role: 'viewer' });
    const lab = members.find((m) => m.user.name === 'Lab contact')!;
    await expectEntry(() => owner.delete(`${base}/members/${lab.id}`), 204, { actor: 'owner', action: 'deleted', kind: 'member', itemId: lab.id, itemName: 'Lab contact' });
  });

  it('an invitation sent and revoked', async () => {
    const made = await expectEntry(() => owner.post(`${base}/invitations`).send({ email: 'new.dresser@example.test', role: 'contributor', department: 'costume' }), 201, {
      actor: 'owner', action: 'created', kind: 'invitation', itemName: 'new.dresser@example.test', detail: 'as contributor in costume',
    });
    await expectEntry(() => owner.delete(`${base}/invitations/${made.itemId}`), 204, { actor: 'owner', action: 'deleted', kind: 'invitation', itemId: made.itemId, itemName: 'new.dresser@example.test' });
  });

  it('an invitation accepted: the new member joined, by their own hand', async () => {
    expect((await owner.post(`${base}/invitations`).send({ email: 'new.grip@example.test', role: 'viewer', department: 'lighting' })).status).toBe(201);
    const mail = (await t.outbox()).find((m) => m.to.includes('new.grip@example.test'))!;
    const token = t.linkIn(mail.text, '/invitation/');
    const guest = await t.agent();
    const r = await guest.post(`/api/invitations/${token}/accept`).send({ name: 'New grip (invented)', password: 'a-long-enough-password' });
    expect(r.status).toBe(200);
    const e = await latest();
    expect(e).toMatchObject({ action: 'created', kind: 'member', itemName: 'New grip (invented)', detail: 'accepted an invitation', actor: { id: r.body.user.id, name: 'New grip (invented)' } });
  });

  it("the production's own change names the fields it changed", async () => {
    await expectEntry(() => owner.patch(base).send({ description: 'Shot on black-and-white negative.' }), 200, { actor: 'owner', action: 'changed', kind: 'production', itemId: pid, detail: 'description' });
  });

  it('computations record nothing: an analysis, a light budget, an import preview', async () => {
    const before = await rowCount();
    expect((await owner.post(`${base}/looks/analyse`).send({ look: pan })).status).toBe(200);
    const file = cgatsText([], [400, 500, 600, 700], [['S1', 'Flat', ['50', '50', '50', '50']]]);
    expect((await makeup.post(`${base}/swatches/import/preview`).attach('file', Buffer.from(file), { filename: 'x.cgats', contentType: 'text/plain' })).status).toBe(200);
    expect(await rowCount()).toBe(before);
  });

  it('a failed write records nothing: 400 (bad input), 403 (role or department) and 404', async () => {
    const swatch = (await costume.post(`${base}/swatches`).send(hexSwatch('Coat, bottle green', '#1f4d2b'))).body.swatch;
    const before = await rowCount();
    const newest = (await latest()).id;
    expect((await owner.post(`${base}/looks`).send({ name: '', ...pan })).status).toBe(400);
    const look = (await owner.get(`${base}/looks`)).body.looks[0];
    expect((await editor.patch(`${base}/looks/${look.id}`).send({ tone: { tStop: 'wide open' } })).status).toBe(400);
    expect((await makeup.post(`${base}/boards`).send({ name: 'x', mergeStops: 99 })).status).toBe(400);
    expect((await viewer.post(`${base}/looks`).send({ name: 'Not mine to make', ...pan })).status).toBe(403);
    expect((await makeup.patch(`${base}/swatches/${swatch.id}`).send({ name: 'Not my department' })).status).toBe(403);
    expect((await owner.delete(`${base}/looks/999999`)).status).toBe(404);
    expect(await rowCount()).toBe(before);
    expect((await latest()).id).toBe(newest);
  });
});

describe('who reads it', () => {
  it('owners read it (200); editors, contributors and viewers get 403', async () => {
    expect((await owner.get(`${base}/activity`)).status).toBe(200);
    for (const a of [editor, makeup, viewer]) {
      const r = await a.get(`${base}/activity`);
      expect(r.status).toBe(403);
      expect(r.body.error.message).toMatch(/needs the owner role/);
    }
  });

  it("another production's entries never show, and it has its own log", async () => {
    const other = (await owner.post('/api/productions').send({ name: 'Second unit' })).body.production;
    const look = (await owner.post(`/api/productions/${other.id}/looks`).send({ name: 'Second unit look', ...pan })).body.look;
    const mine = (await page('?limit=200')).entries;
    expect(mine.some((e) => e.itemName === 'Second unit look' || e.itemId === look.id && e.kind === 'look')).toBe(false);
    const theirs = (await owner.get(`/api/productions/${other.id}/activity`)).body as ActivityPage;
    expect(theirs.entries.map((e) => [e.action, e.kind, e.itemName])).toEqual([['created', 'look', 'Second unit look'], ['created', 'production', 'Second unit']]);
  });

  it("a deleted production's log goes with it; its deletion is an operator line", async () => {
    const lines: Record<string, unknown>[] = [];
    const off = onLogEvent((l) => lines.push(l));
    try {
      const p = (await owner.post('/api/productions').send({ name: 'Short-lived' })).body.production;
      await owner.post(`/api/productions/${p.id}/looks`).send({ name: 'Gone soon', ...pan });
      await page(); // waits for the entries in flight
      expect(await t.ctx.ds.getRepository(ActivityEntry).countBy({ production: { id: p.id } })).toBe(2); // created, and its look
      expect((await owner.delete(`/api/productions/${p.id}`)).status).toBe(204);
      await page();
      expect(await t.ctx.ds.getRepository(ActivityEntry).countBy({ production: { id: p.id } })).toBe(0);
      expect(lines).toContainEqual(expect.objectContaining({ event: 'activity', productionId: p.id, kind: 'production', action: 'deleted', itemName: 'Short-lived' }));
      expect(lines.filter((l) => l.event === 'activity-lost')).toEqual([]);
    } finally {
      off();
    }
  });
});

describe('pages and filters', () => {
  it('pages newest first with before/next, without gaps or repeats', async () => {
    const all = (await page('?limit=200')).entries;
    expect(all.length).toBeGreaterThan(10);
    expect(all.map((e) => e.id)).toEqual([...all.map((e) => e.id)].sort((a, b) => b - a));
    const seen: number[] = [];
    let q = '?limit=3';
    for (let i = 0; i < 100; i++) {
      const p = await page(q);
      expect(p.entries.length).toBeLessThanOrEqual(3);
      seen.push(...p.entries.map((e) => e.id));
      if (p.next === null) break;
      expect(p.next).toBe(p.entries.at(-1)!.id);
      q = `?limit=3&before=${p.next}`;
    }
    expect(seen).toEqual(all.map((e) => e.id));
    expect((await page()).entries.length).toBe(Math.min(50, all.length)); // the default page
  });

  it('filters by kind and by actor', async () => {
    const looks = (await page('?kind=look&limit=200')).entries;
    expect(looks.length).toBeGreaterThan(0);
    expect(new Set(looks.map((e) => e.kind))).toEqual(new Set(['look']));
    const byMakeup = (await page(`?actor=${ids.makeup}&limit=200`)).entries;
    expect(byMakeup.length).toBeGreaterThan(0);
    expect(new Set(byMakeup.map((e) => e.actor.name))).toEqual(new Set([NAMES.makeup]));
    const both = (await page(`?actor=${ids.makeup}&kind=board`)).entries;
    expect(both.map((e) => e.action)).toEqual(['deleted', 'changed', 'created']);
  });

  it('a bad query value is a 400 naming the field', async () => {
    for (const [q, field] of [['limit=0', 'limit'], ['limit=201', 'limit'], ['limit=ten', 'limit'], ['before=-3', 'before'], ['before=x', 'before'], ['kind=lamp', 'kind'], ['actor=me', 'actor'], ['colour=red', 'colour']]) {
      const r = await owner.get(`${base}/activity?${q}`);
      expect(r.status, q).toBe(400);
      expect(r.body.error.field, q).toBe(field);
    }
  });
});

describe("the operator's log", () => {
  it("a refused role check is a 'role-refused' line: who, where, the role needed and held, how, from where", async () => {
    const lines: Record<string, unknown>[] = [];
    const off = onLogEvent((l) => lines.push(l));
    try {
      expect((await viewer.get(`${base}/activity?limit=5`)).status).toBe(403);
      expect((await editor.delete(base)).status).toBe(403);
      const coat = (await costume.post(`${base}/swatches`).send(hexSwatch('Coat lining', '#40304a'))).body.swatch;
      expect((await makeup.delete(`${base}/swatches/${coat.id}`)).status).toBe(403);
      const outsider = await t.agent('admin@demo.grisaille.test');
      expect((await outsider.get(`${base}/looks`)).status).toBe(404);
    } finally {
      off();
    }
    const refused = lines.filter((l) => l.event === 'role-refused');
    expect(refused).toContainEqual({ event: 'role-refused', userId: ids.viewer, productionId: pid, need: 'owner', role: 'viewer', reason: 'role', method: 'GET', path: `${base}/activity`, ip: expect.any(String) });
    expect(refused).toContainEqual(expect.objectContaining({ userId: ids.editor, need: 'owner', role: 'editor', method: 'DELETE', path: base }));
    expect(refused).toContainEqual(expect.objectContaining({ userId: ids.makeup, productionId: pid, role: 'contributor', department: 'makeup', reason: 'department', method: 'DELETE' }));
    expect(refused).toContainEqual(expect.objectContaining({ productionId: pid, role: null, reason: 'not-a-member', method: 'GET' }));
  });

  it("every entry is also an 'activity' line, without people's names or addresses", async () => {
    const lines: Record<string, unknown>[] = [];
    const off = onLogEvent((l) => lines.push(l));
    try {
      await owner.post(`${base}/looks`).send({ name: 'Logged look', ...pan });
      await owner.post(`${base}/invitations`).send({ email: 'second.ac@example.test', role: 'viewer', department: 'camera' });
      await page();
    } finally {
      off();
    }
    const acts = lines.filter((l) => l.event === 'activity');
    expect(acts).toContainEqual(expect.objectContaining({ productionId: pid, userId: ids.owner, action: 'created', kind: 'look', itemName: 'Logged look', entryId: expect.any(Number) }));
    const inv = acts.find((l) => l.kind === 'invitation')!;
    expect(inv).toMatchObject({ action: 'created', userId: ids.owner });
    expect(JSON.stringify(inv)).not.toContain('second.ac@example.test');
  });
});
