import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../helpers/api';
import { Production } from '../../server/db/entities/production.entity';
import { Invitation } from '../../server/db/entities/invitation.entity';

let t: TestApp;
beforeAll(async () => void (t = await startTestApp()));
afterAll(async () => t.close());

describe('bad input is answered 400 naming the field, with nothing written', () => {
  const cases: [string, unknown, string][] = [
    ['missing name', { description: 'x' }, 'name'],
    ['empty name', { name: '   ' }, 'name'],
    ['overlong name', { name: 'x'.repeat(121) }, 'name'],
    ['name of the wrong type', { name: 42 }, 'name'],
    ['description of the wrong type', { name: 'Ok', description: ['a'] }, 'description'],
    ['overlong description', { name: 'Ok', description: 'y'.repeat(2001) }, 'description'],
  ];
  it.each(cases)('production: %s', async (_label, body, field) => {
    const a = await t.agent('camera@demo.grisaille.test');
    const before = await t.ctx.ds.getRepository(Production).count();
    const r = await a.post('/api/productions').send(body as object);
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid');
    expect(r.body.error.field).toBe(field);
    expect(r.body.error.message).toContain(field);
    expect(await t.ctx.ds.getRepository(Production).count()).toBe(before);
  });

  const inv: [string, unknown, string][] = [
    ['missing e-mail', { role: 'viewer', department: 'lab' }, 'email'],
    ['malformed e-mail', { email: 'not-mail', role: 'viewer', department: 'lab' }, 'email'],
    ['overlong e-mail', { email: `${'a'.repeat(250)}@x.test`, role: 'viewer', department: 'lab' }, 'email'],
    ['unknown role', { email: 'a@b.test', role: 'director', department: 'lab' }, 'role'],
    ['unknown department', { email: 'a@b.test', role: 'viewer', department: 'sound' }, 'department'],
  ];
  it.each(inv)('invitation: %s', async (_label, body, field) => {
    const a = await t.agent('camera@demo.grisaille.test');
    const before = (await t.outbox()).length;
    const r = await a.post(`/api/productions/${t.demoProductionId}/invitations`).send(body as object);
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe(field);
    expect(await t.ctx.ds.getRepository(Invitation).count()).toBe(0);
    expect((await t.outbox()).length).toBe(before);
  });
});
