/**
 * The per-request caches of issue 15 item 3 (server/services/cache.ts): the role check's membership, the
 * session's user and each look's composed pipeline are read once and kept, and every change is seen by the
 * very next request (a stale role or a removed member is never answered from a cache).
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startDemoAs, type DemoSession } from '../helpers/api';
import { Membership } from '../../server/db/entities/membership.entity';
import { User } from '../../server/db/entities/user.entity';
import { Curve } from '../../server/db/entities/curve.entity';
import { Look } from '../../server/db/entities/look.entity';
import { Board } from '../../server/db/entities/board.entity';
import { LruCache, setCachesEnabled } from '../../server/services/cache';
import { findMembership } from '../../server/middleware/require-role';
import { lookDefinition, prepareToneLooks, ToneService } from '../../server/modules/tones/tone.service';
import { getUpsampleTable } from '../../server/services/upsample-table';

let s: DemoSession<'owner' | 'editor' | 'viewer' | 'lab'>;
beforeAll(async () => {
  s = await startDemoAs({ owner: 'camera', editor: 'gaffer', viewer: 'producer', lab: 'lab' });
});
afterAll(async () => {
  setCachesEnabled(true);
  await s?.t.close();
});

const pan = { light: { source: { id: 'tungsten-3200' } }, filters: [], medium: { source: { id: 'panchromatic' } } };

async function memberId(email: string): Promise<number> {
  const m = await s.t.ctx.ds.getRepository(Membership).findOneOrFail({ where: { production: { id: s.pid }, user: { email } } });
  return m.id;
}

describe('LruCache', () => {
  it('keeps at most max entries, forgetting the least recently used first', () => {
    const c = new LruCache<string, number>(2);
    c.set('a', 1);
    c.set('b', 2);
    expect(c.get('a')).toBe(1); // a is now the most recent
    c.set('c', 3);
    expect(c.get('b')).toBeUndefined();
    expect(c.get('a')).toBe(1);
    expect(c.get('c')).toBe(3);
    expect(c.size).toBe(2);
  });

  it('keeps nothing while the caches are off', () => {
    const c = new LruCache<string, number>(2);
    c.set('a', 1);
    setCachesEnabled(false);
    try {
      expect(c.get('a')).toBeUndefined();
      c.set('b', 2);
      expect(c.size).toBe(0);
    } finally {
      setCachesEnabled(true);
    }
  });
});

describe('membership and user, read once', () => {
  it('answers repeated requests without reading the membership or the user again', async () => {
    const ds = s.t.ctx.ds;
    await s.as.viewer.get(`${s.base}/looks`).expect(200); // fills the caches
    const memberships = vi.spyOn(ds.getRepository(Membership), 'findOne');
    const users = vi.spyOn(ds.getRepository(User), 'findOneBy');
    try {
      for (let i = 0; i < 5; i++) await s.as.viewer.get(`${s.base}/looks`).expect(200);
      expect(memberships).not.toHaveBeenCalled();
      expect(users).not.toHaveBeenCalled();
    } finally {
      memberships.mockRestore();
      users.mockRestore();
    }
  });

  it('a changed role is used by the very next request', async () => {
    const id = await memberId('producer@demo.grisaille.test');
    expect((await s.as.viewer.post(`${s.base}/looks`).send({ name: 'Not yet', ...pan })).status).toBe(403);
    expect((await s.as.owner.patch(`${s.base}/members/${id}`).send({ role: 'editor' })).status).toBe(200);
    expect((await s.as.viewer.post(`${s.base}/looks`).send({ name: 'Now an editor', ...pan })).status).toBe(201);
    expect((await s.as.owner.patch(`${s.base}/members/${id}`).send({ role: 'viewer' })).status).toBe(200);
    expect((await s.as.viewer.post(`${s.base}/looks`).send({ name: 'A viewer again', ...pan })).status).toBe(403);
  });

  it('a role written outside the team service (a query builder update) is seen at once too', async () => {
    const id = await memberId('gaffer@demo.grisaille.test');
    await s.as.editor.get(`${s.base}/looks`).expect(200);
    await s.t.ctx.ds.getRepository(Membership).update(id, { role: 'viewer' });
    try {
      expect((await s.as.editor.post(`${s.base}/looks`).send({ name: 'x', ...pan })).status).toBe(403);
    } finally {
      await s.t.ctx.ds.getRepository(Membership).update(id, { role: 'editor' });
    }
    expect((await s.as.editor.post(`${s.base}/looks`).send({ name: 'Back to editor', ...pan })).status).toBe(201);
  });

  it('a renamed production shows its new name on the next request', async () => {
    const before = (await s.as.viewer.get(s.base).expect(200)).body;
    const name = `Renamed ${Date.now()}`;
    expect((await s.as.owner.patch(s.base).send({ name })).status).toBe(200);
    const after = (await s.as.viewer.get(s.base).expect(200)).body;
    expect(JSON.stringify(after)).toContain(name);
    expect(JSON.stringify(before)).not.toContain(name);
  });

  it('a user changed in the database is seen by the next request (the session user is not kept stale)', async () => {
    const ds = s.t.ctx.ds;
    const me = (await s.as.lab.get('/api/auth/me').expect(200)).body.user as { id: number; name: string };
    await ds.getRepository(User).update(me.id, { name: 'Lab contact, renamed' });
    expect((await s.as.lab.get('/api/auth/me').expect(200)).body.user.name).toBe('Lab contact, renamed');
    await ds.getRepository(User).update(me.id, { name: me.name });
    expect((await s.as.lab.get('/api/auth/me').expect(200)).body.user.name).toBe(me.name);
  });

  it('a removed member gets a 404 on the very next request', async () => {
    await s.as.lab.get(`${s.base}/looks`).expect(200);
    const id = await memberId('lab@demo.grisaille.test');
    expect((await s.as.owner.delete(`${s.base}/members/${id}`)).status).toBe(204);
    expect((await s.as.lab.get(`${s.base}/looks`)).status).toBe(404);
  });

  it('a deleted production is a 404 for its members on the very next request', async () => {
    const created = await s.as.owner.post('/api/productions').send({ name: 'Short-lived production' });
    expect(created.status).toBe(201);
    const base = `/api/productions/${created.body.production.id}`;
    await s.as.owner.get(`${base}/looks`).expect(200);
    expect((await s.as.owner.delete(base)).status).toBe(204);
    expect((await s.as.owner.get(`${base}/looks`)).status).toBe(404);
  });

  it('does not keep a request from changing the kept membership (each request gets its own copy)', async () => {
    const ds = s.t.ctx.ds;
    const owner = await ds.getRepository(User).findOneByOrFail({ email: 'camera@demo.grisaille.test' });
    const a = await findMembership(ds, s.pid, owner.id);
    a!.role = 'viewer';
    a!.production.name = 'changed by a request';
    const b = await findMembership(ds, s.pid, owner.id);
    expect(b!.role).toBe('owner');
    expect(b!.production.name).not.toBe('changed by a request');
  });
});

describe("each look's pipeline, composed once", () => {
  const strip = (t: { ms?: number }) => ({ ...t, ms: 0 });

  async function boardTones(boardId: number) {
    return (await s.as.owner.get(`${s.base}/boards/${boardId}/tones`).expect(200)).body.tones as { ms: number; looks: unknown[] };
  }

  it('gives the same tones as composing every look again (deep equal)', async () => {
    const boards = await s.t.ctx.ds.getRepository(Board).find({ where: { production: { id: s.pid } } });
    for (const b of boards) {
      setCachesEnabled(false);
      const fresh = await boardTones(b.id);
      setCachesEnabled(true);
      const first = await boardTones(b.id);
      const kept = await boardTones(b.id);
      expect(strip(first)).toEqual(strip(fresh));
      expect(strip(kept)).toEqual(strip(fresh));
    }
  });

  it('composes an unchanged look once: the next request gets the kept composition', async () => {
    const ds = s.t.ctx.ds;
    const table = await getUpsampleTable(s.t.dataDir);
    const looks = (await ds.getRepository(Look).find({ where: { production: { id: s.pid } }, order: { id: 'ASC' } })).map(lookDefinition);
    const a = await prepareToneLooks(ds.manager, s.pid, looks, table);
    const b = await prepareToneLooks(ds.manager, s.pid, looks, table);
    expect(b.map((l) => l.composed)).toEqual(a.map((l) => l.composed));
    b.forEach((l, i) => expect(l.composed).toBe(a[i].composed));
  });

  it('a look edited within the same second is composed again', async () => {
    const created = await s.as.owner.post(`${s.base}/looks`).send({ name: 'Quick edits', ...pan });
    expect(created.status).toBe(201);
    const lookId = created.body.look.id as number;
    const board = await s.as.owner.post(`${s.base}/boards`).send({ name: 'Quick edits board', lookIds: [lookId], swatchIds: (await s.as.owner.get(`${s.base}/swatches`)).body.swatches.slice(0, 6).map((x: { id: number }) => x.id) });
    expect(board.status).toBe(201);
    const boardId = board.body.board.id as number;
    const t1 = await boardTones(boardId);
    expect((await s.as.owner.patch(`${s.base}/looks/${lookId}`).send({ filters: [{ filter: { source: { id: 'red-590' } }, on: 'lens' }] })).status).toBe(200);
    const t2 = await boardTones(boardId);
    setCachesEnabled(false);
    const fresh = await boardTones(boardId);
    setCachesEnabled(true);
    expect(strip(t2)).toEqual(strip(fresh));
    expect(strip(t2)).not.toEqual(strip(t1));
  });

  it("a production curve's edit is seen by the next request", async () => {
    const ds = s.t.ctx.ds;
    const svc = new ToneService(ds, s.t.dataDir);
    const flat = [[380, 40], [580, 40], [780, 40]];
    const curve = await s.as.owner.post(`${s.base}/curves`).send({ kind: 'light', name: 'Flat lamp', origin: { type: 'table', basis: 'power', table: { samples: flat } } });
    expect(curve.status).toBe(201);
    const curveId = curve.body.curve.id as number;
    const look = await s.as.owner.post(`${s.base}/looks`).send({ name: 'On the flat lamp', light: { curveId }, filters: [{ filter: { source: { id: 'red-590' } }, on: 'lens' }], medium: { source: { id: 'panchromatic' } } });
    expect(look.status).toBe(201);
    const swatchIds = (await s.as.owner.get(`${s.base}/swatches`)).body.swatches.slice(0, 8).map((x: { id: number }) => x.id);
    const board = await s.as.owner.post(`${s.base}/boards`).send({ name: 'Flat lamp board', lookIds: [look.body.look.id], swatchIds });
    expect(board.status).toBe(201);
    const boardId = board.body.board.id as number;
    const table = await getUpsampleTable(s.t.dataDir);
    const def = lookDefinition(await ds.getRepository(Look).findOneByOrFail({ id: look.body.look.id }));
    const t1 = await boardTones(boardId);

    // a rename (the API's only curve edit) changes the label the composition carries
    expect((await s.as.owner.patch(`${s.base}/curves/${curveId}`).send({ name: 'Flat lamp, renamed' })).status).toBe(200);
    const [renamed] = await prepareToneLooks(ds.manager, s.pid, [def], table);
    expect(renamed.resolved.bareLight.label).toBe('Flat lamp, renamed');

    // the samples changed underneath (a blue-heavy lamp): the tones change with them, at once
    const stored = await ds.getRepository(Curve).findOneByOrFail({ id: curveId });
    await ds.getRepository(Curve).update(curveId, { samples: stored.samples.map(([nm]) => [nm, nm < 500 ? 1 : 0.05] as [number, number]) });
    const t2 = await boardTones(boardId);
    setCachesEnabled(false);
    const fresh = strip(await svc.boardTones(s.pid, boardId, {}));
    setCachesEnabled(true);
    expect(strip(t2)).toEqual(JSON.parse(JSON.stringify(fresh)));
    expect(strip(t2)).not.toEqual(strip(t1));
  });
});
