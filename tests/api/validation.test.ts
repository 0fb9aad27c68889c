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

describe('validation messages are plain words naming the field (shared/schemas/messages.ts)', () => {
  const skin = { melanin: 0.03, blood: 0.02, oxygenation: 0.75 };
  const colour = (c: object) => ({ name: 'x', origin: { type: 'colour', colour: c } });
  const cases: [string, object, string, string][] = [
    ['RGB above 255', colour({ space: 'rgb', rgb: [300, 0, 0] }), 'origin.colour.rgb.0', 'origin.colour.rgb.0: RGB values go from 0 to 255.'],
    ['no name', { origin: { type: 'colour', colour: { space: 'hex', hex: '#808080' } } }, 'name', 'name: Give a name.'],
    ['a blank name', { name: '   ', origin: { type: 'colour', colour: { space: 'hex', hex: '#808080' } } }, 'name', 'name: Give a name.'],
    ['coverage above 1', { name: 'x', origin: { type: 'makeup', makeup: { over: { skin }, colour: '#a33b4a', coverage: 1.5 } } }, 'origin.makeup.coverage', 'origin.makeup.coverage: Coverage goes from 0 to 1.'],
    ['a light beyond 4 stops', { ...colour({ space: 'hex', hex: '#808080' }), lightStops: -6 }, 'lightStops', 'lightStops: The light on the surface goes from −4 to +4 stops.'],
    ['a light that is not a number', { ...colour({ space: 'hex', hex: '#808080' }), lightStops: 'hot' }, 'lightStops', 'lightStops: The light on the surface should be a number.'],
    ['an unknown origin type', { name: 'x', origin: { type: 'paint' } }, 'origin.type', 'origin.type: Choose the type: colour, measured, photo, skin or makeup.'],
    ['an unknown skin parameter', { name: 'x', origin: { type: 'skin', skin: { ...skin, hue: 3 } } }, 'origin.skin.hue', 'origin.skin.hue: There is no field "hue" here.'],
    ['a missing skin parameter', { name: 'x', origin: { type: 'skin', skin: { melanin: 0.03, blood: 0.02 } } }, 'origin.skin.oxygenation', 'origin.skin.oxygenation: Oxygenation (haemoglobin oxygen saturation) goes from 0 to 1.'],
  ];
  it.each(cases)('%s', async (_label, body, field, message) => {
    const a = await t.agent('makeup@demo.grisaille.test');
    const r = await a.post(`/api/productions/${t.demoProductionId}/swatches`).send(body);
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe(field);
    expect(r.body.error.message).toBe(message);
  });

  it('board thresholds and unknown departments too', async () => {
    const a = await t.agent('makeup@demo.grisaille.test');
    const r = await a.post(`/api/productions/${t.demoProductionId}/boards`).send({ name: 'b', mergeStops: 5 });
    expect(r.body.error.message).toBe('mergeStops: At most 3 stops.');
    const d = await a.post(`/api/productions/${t.demoProductionId}/boards`).send({ name: 'b', department: 'sound' });
    expect(d.body.error.message).toMatch(/^department: Choose the department: .+ or .+\.$/);
  });
});
