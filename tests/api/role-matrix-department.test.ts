/**
 * The role matrix's department axis: every production route that a contributor may call (the role bound to
 * a department) is tried by a contributor of the item's own department and by a contributor of another
 * department. The own department passes; the other is refused with the department rule's 403
 * (shared/policy/department.ts), except where the route can only act in the caller's own department
 * (a photo upload files the photo under the uploader's department). The routes come from the registry, so
 * a new contributor route without a case here fails the first test.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import sharp from 'sharp';
import { startTestApp, type Agent, type TestApp } from '../helpers/api';
import { productionRoutes } from '../../server/modules/route-registry';
import { Membership } from '../../server/db/entities/membership.entity';
import { Production } from '../../server/db/entities/production.entity';
import { User } from '../../server/db/entities/user.entity';
import { cgatsText } from '../helpers/cgats';

let t: TestApp;
let base: string;
let own: Agent; // contributor · makeup (the items' department)
let other: Agent; // contributor · costume
let editor: Agent; // makes the items the cases act on

const swatchBody = (name: string) => ({ name, department: 'makeup', origin: { type: 'colour', colour: { space: 'hex', hex: '#a04040' } } });
const nm = Array.from({ length: 31 }, (_, i) => 400 + 10 * i);
/** one invented flat sample (50 %) as CGATS.17 text */
const SAMPLE = cgatsText(['ORIGINATOR "Invented test"'], nm, [['S1', 'Flat half grey (invented)', nm.map(() => '50')]]);
let png: Buffer;

const created = async (r: Promise<{ status: number; body: Record<string, { id: number }> }>, key: string) => {
  const res = await r;
  if (res.status !== 201) throw new Error(`setup: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body[key].id;
};
const newSwatch = () => created(editor.post(`${base}/swatches`).send(swatchBody('Lip red (test)')), 'swatch');
const newBoard = () => created(editor.post(`${base}/boards`).send({ name: 'Makeup board (test)', department: 'makeup' }), 'board');
const newPhoto = () => created(own.post(`${base}/photos`).attach('file', png, 'makeup-test.png'), 'photo');
const importFile = (a: Agent, url: string) => a.post(url).field('department', 'makeup').attach('file', Buffer.from(SAMPLE), { filename: 's.cgats', contentType: 'text/plain' });

type Call = (a: Agent) => Promise<{ status: number; body: { error?: { message?: string }; photo?: { department: string } } }>;
/** Each contributor route: how to call it on a makeup item (a fresh item per call, so deletes can run twice). */
const CASES: Record<string, { call: Call; ownDepartmentOnly?: true }> = {
  'post /boards': { call: (a) => a.post(`${base}/boards`).send({ name: 'Board (test)', department: 'makeup' }) },
  'patch /boards/:boardId': { call: async (a) => a.patch(`${base}/boards/${await newBoard()}`).send({ name: 'Renamed (test)' }) },
  'delete /boards/:boardId': { call: async (a) => a.delete(`${base}/boards/${await newBoard()}`) },
  'post /swatches': { call: (a) => a.post(`${base}/swatches`).send(swatchBody('Blush (test)')) },
  'post /swatches/import/preview': { call: (a) => importFile(a, `${base}/swatches/import/preview`) },
  'post /swatches/import': { call: (a) => importFile(a, `${base}/swatches/import`) },
  'post /swatches/:swatchId/duplicate': { call: async (a) => a.post(`${base}/swatches/${await newSwatch()}/duplicate`) },
  'patch /swatches/:swatchId': { call: async (a) => a.patch(`${base}/swatches/${await newSwatch()}`).send({ name: 'Renamed (test)' }) },
  'delete /swatches/:swatchId': { call: async (a) => a.delete(`${base}/swatches/${await newSwatch()}`) },
  'post /photos': { call: (a) => a.post(`${base}/photos`).attach('file', png, 'upload-test.png'), ownDepartmentOnly: true },
  'patch /photos/:photoId': { call: async (a) => a.patch(`${base}/photos/${await newPhoto()}`).send({ name: 'Renamed (test)' }) },
  'delete /photos/:photoId': { call: async (a) => a.delete(`${base}/photos/${await newPhoto()}`) },
};

const contributorRoutes = () =>
  productionRoutes.filter((r) => r.role === 'contributor').map((r) => `${r.method} ${r.path.replace('/api/productions/:productionId', '')}`);

beforeAll(async () => {
  t = await startTestApp();
  const ds = t.ctx.ds;
  const p = await ds.getRepository(Production).save({ name: 'Department matrix scratch', description: '' });
  base = `/api/productions/${p.id}`;
  const members: [string, 'editor' | 'contributor', 'camera' | 'makeup' | 'costume'][] = [
    ['assistant@demo.grisaille.test', 'editor', 'camera'],
    ['makeup@demo.grisaille.test', 'contributor', 'makeup'],
    ['costume@demo.grisaille.test', 'contributor', 'costume'],
  ];
  for (const [email, role, department] of members) {
    const user = await ds.getRepository(User).findOneByOrFail({ email });
    await ds.getRepository(Membership).save({ user, production: p, role, department });
  }
  editor = await t.agent('assistant@demo.grisaille.test');
  own = await t.agent('makeup@demo.grisaille.test');
  other = await t.agent('costume@demo.grisaille.test');
  png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#b05050' } }).png().toBuffer();
});
afterAll(async () => t?.close());

it('has a case for every route a contributor may call', () => {
  const routes = contributorRoutes();
  expect(routes.length).toBeGreaterThanOrEqual(12);
  expect(routes.filter((r) => !CASES[r])).toEqual([]);
});

it("lets a contributor change their own department's items and refuses another department's contributor", async () => {
  const failures: string[] = [];
  for (const route of contributorRoutes()) {
    const c = CASES[route];
    if (!c) continue;
    const mine = await c.call(own);
    if (mine.status >= 300) failures.push(`${route}: own department → ${mine.status} ${JSON.stringify(mine.body)}`);
    const theirs = await c.call(other);
    if (c.ownDepartmentOnly) {
      if (theirs.status >= 300 || theirs.body.photo?.department !== 'costume') failures.push(`${route}: another department's contributor → ${theirs.status}, expected it filed under their own department`);
    } else if (theirs.status !== 403 || !/^Contributors change .* of their own department \(costume\) only; this belongs to makeup\.$/.test(theirs.body.error?.message ?? '')) {
      failures.push(`${route}: another department's contributor → ${theirs.status} ${JSON.stringify(theirs.body)}, expected the department rule's 403`);
    }
  }
  expect(failures).toEqual([]);
});
