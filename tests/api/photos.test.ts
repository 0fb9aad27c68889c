import fs from 'node:fs';
import { GRID_SIZE } from '../../shared/spectral/policy';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoAs, type Agent, type TestApp } from '../helpers/api';
import { Photo } from '../../server/db/entities/photo.entity';
import { photosService } from '../../server/modules/photos/photos.router';
import { mediumToneDefaults } from '../../shared/tone/media-tone';
import { DEMO_SCENES } from '../../server/db/seed-content/photos';
import { TEST_LOOK, binary, createTestLook, download, grey16, photosUrl, pngBomb, render as renderOf, sceneJpeg, upload as uploadOf } from './photo-fixtures';

/** Uploads, refusals (nothing stored), roles, renders and the cache. Accuracy: photo-accuracy.test.ts. */

let t: TestApp;
let makeup: Agent;
let camera: Agent;
let lab: Agent;
let costume: Agent;
let pid: number;
let lookId: number;

beforeAll(async () => {
  ({ t, pid, as: { makeup, camera, lab, costume } } = await startDemoAs({ makeup: 'makeup', camera: 'camera', lab: 'lab', costume: 'costume' }));
  lookId = await createTestLook(camera, pid);
});
afterAll(async () => t?.close());

const base = () => photosUrl(pid);
const upload = (a: Agent, buf: Buffer, name: string) => uploadOf(a, pid, buf, name);
const render = (a: Agent, photoId: number, body: object) => renderOf(a, pid, photoId, body);

/** What is stored: rows, photo directories, incoming files. */
function stored() {
  const dir = path.join(t.dataDir, 'uploads');
  const list = (d: string) => (fs.existsSync(d) ? fs.readdirSync(d).sort() : []);
  return async () => ({ rows: await t.ctx.ds.getRepository(Photo).count(), photos: list(path.join(dir, 'photos')), incoming: list(path.join(dir, '.incoming')) });
}

async function expectNothingStored(send: () => Promise<{ status: number; body: { error?: { message: string } } }>, status: number, message: RegExp) {
  const state = stored();
  const before = await state();
  const r = await send();
  expect(r.status).toBe(status);
  expect(r.body.error?.message).toMatch(message);
  expect(await state()).toEqual(before);
}

describe('uploads that are accepted', () => {
  it('a contributor uploads a JPEG: stored with an sRGB preview and thumbnail, listed, served', async () => {
    const jpg = await sceneJpeg(2400, 1600);
    const r = await upload(makeup, jpg, 'workshop_test.jpg');
    expect(r.status).toBe(201);
    const p = r.body.photo;
    expect(p).toMatchObject({ name: 'workshop test', format: 'jpeg', bitDepth: 8, width: 2400, height: 1600, department: 'makeup', iccProfile: null, isDemo: false });
    expect(p.previewWidth).toBeGreaterThanOrEqual(1600);
    const list = await lab.get(base());
    expect(list.body.photos.map((x: { id: number }) => x.id)).toContain(p.id);
    const prev = await lab.get(p.urls.preview).buffer(true).parse(binary);
    expect(prev.headers['content-type']).toMatch(/image\/jpeg/);
    const meta = await sharp(prev.body as Buffer).metadata();
    expect([meta.width, meta.height]).toEqual([p.previewWidth, p.previewHeight]);
    const orig = await lab.get(p.urls.original).buffer(true).parse(binary);
    expect(Buffer.compare(orig.body as Buffer, jpg)).toBe(0);
  });

  it('reads 16-bit PNG, TIFF and WebP by their content, whatever the name says', async () => {
    const raw = await sharp(await sceneJpeg(600, 400)).raw().toBuffer();
    const img = sharp(raw, { raw: { width: 600, height: 400, channels: 3 } });
    const png16 = await img.clone().toColourspace('rgb16').png().toBuffer();
    const tiff = await img.clone().tiff().toBuffer();
    const webp = await img.clone().webp({ quality: 90 }).toBuffer();
    for (const [buf, name, format, bits] of [[png16, 'a.png', 'png', 16], [tiff, 'b.jpg', 'tiff', 8], [webp, 'c.bin', 'webp', 8]] as const) {
      const r = await upload(makeup, buf, name);
      expect(r.status, name).toBe(201);
      expect(r.body.photo).toMatchObject({ format, bitDepth: bits, width: 600, height: 400 });
    }
  });

  it('applies the orientation tag: a 600 × 400 frame tagged "rotate 90°" becomes 400 × 600', async () => {
    const jpg = await sharp(await sceneJpeg(600, 400)).withMetadata({ orientation: 6 }).jpeg().toBuffer();
    const r = await upload(makeup, jpg, 'turned.jpg');
    expect(r.status).toBe(201);
    expect(r.body.photo).toMatchObject({ width: 400, height: 600, orientation: 6 });
    const { status } = await render(makeup, r.body.photo.id, { lookId, format: 'jpeg' });
    const meta = await sharp(await download(makeup, status.url)).metadata();
    expect([meta.width, meta.height, meta.channels]).toEqual([400, 600, 1]);
  });
});

describe('uploads that are refused, with nothing stored', () => {
  it('a truncated JPEG', async () => {
    const jpg = await sceneJpeg(1200, 800);
    await expectNothingStored(() => upload(makeup, jpg.subarray(0, Math.floor(jpg.length * 0.6)), 'cut.jpg'), 400, /truncated or damaged/);
  });

  it('a text file named .png', async () => {
    await expectNothingStored(() => upload(makeup, Buffer.from('not a picture at all\n'.repeat(50)), 'notes.png'), 400, /not a JPEG, PNG, TIFF or WebP image \(checked by its content/);
  });

  it('an image in a format Grisaille does not take (GIF)', async () => {
    const gif = await sharp(await sceneJpeg(300, 200)).gif().toBuffer();
    await expectNothingStored(() => upload(makeup, gif, 'anim.gif'), 400, /not a JPEG, PNG, TIFF or WebP/);
  });

  it('a decompression bomb: a 40 kB PNG of 400 megapixels', async () => {
    const bomb = pngBomb(20_000);
    expect(bomb.length).toBeLessThan(200_000);
    await expectNothingStored(() => upload(makeup, bomb, 'bomb.png'), 413, /20000 × 20000 pixels \(400\.0 megapixels\); the limit is 100 megapixels/);
  });

  it('a file over the size limit', async () => {
    const svc = photosService(t.ctx);
    const keep = svc.limits.maxBytes;
    svc.limits.maxBytes = 64 * 1024;
    try {
      const big = await sceneJpeg(2400, 1600);
      expect(big.length).toBeGreaterThan(64 * 1024);
      await expectNothingStored(() => upload(makeup, big, 'big.jpg'), 413, /larger than the 64 kB limit/);
    } finally {
      svc.limits.maxBytes = keep;
    }
  });

  it('no file, or the file in another part', async () => {
    await expectNothingStored(() => makeup.post(base()).field('name', 'x'), 400, /Choose an image file/);
    await expectNothingStored(() => makeup.post(base()).attach('picture', Buffer.from('x'), 'x.jpg'), 400, /part named "file"/);
  });
});

describe('roles', () => {
  it('viewers read and render but do not upload; contributors change only their own department’s photos', async () => {
    const jpg = await sceneJpeg(600, 400);
    const denied = await upload(lab, jpg, 'x.jpg');
    expect(denied.status).toBe(403);
    const mine = (await upload(makeup, jpg, 'mine.jpg')).body.photo;
    expect((await costume.patch(`${base()}/${mine.id}`).send({ name: 'not yours' })).status).toBe(403);
    expect((await costume.delete(`${base()}/${mine.id}`)).status).toBe(403);
    expect((await lab.delete(`${base()}/${mine.id}`)).status).toBe(403);
    expect((await makeup.patch(`${base()}/${mine.id}`).send({ name: 'Lip test, take 2' })).body.photo.name).toBe('Lip test, take 2');
    const { status } = await render(lab, mine.id, { lookId, format: 'jpeg' });
    expect(status.status).toBe('done');
    const dir = path.join(t.dataDir, 'uploads', 'photos');
    const before = fs.readdirSync(dir).length;
    expect((await camera.delete(`${base()}/${mine.id}`)).status).toBe(204);
    expect(fs.readdirSync(dir).length).toBe(before - 1);
    expect((await lab.get(`${base()}/${mine.id}`)).status).toBe(404);
  });

  it('signed-out requests get 401', async () => {
    const anon = await t.agent();
    expect((await anon.get(base())).status).toBe(401);
  });
});

describe('full-resolution renders', () => {
  it('renders with progress, caches by the look’s content, and serves a 16-bit PNG and a JPEG', async () => {
    const p = (await upload(makeup, await sceneJpeg(1600, 1000), 'cache.jpg')).body.photo;
    const a = await render(makeup, p.id, { lookId, format: 'png16' });
    expect(a.status).toMatchObject({ status: 'done', progress: 1, cached: false });
    expect(a.first.status).toBe(202);
    const png = await grey16(await download(makeup, a.status.url));
    expect([png.width, png.height]).toEqual([1600, 1000]);
    // the same look again: from the cache at once
    const again = await makeup.post(`${base()}/${p.id}/renders`).send({ lookId, format: 'png16' });
    expect(again.status).toBe(200);
    expect(again.body.render).toMatchObject({ key: a.status.key, status: 'done', cached: true });
    // the same content given inline (not saved) shares the render; another filter does not
    const inline = await makeup.post(`${base()}/${p.id}/renders`).send({ look: TEST_LOOK, format: 'png16' });
    expect(inline.body.render.key).toBe(a.status.key);
    const other = await render(makeup, p.id, { look: { ...TEST_LOOK, filters: [{ filter: { source: { longPass: { cutOnNm: 620 } } }, on: 'lens' }] }, format: 'png16' });
    expect(other.status.key).not.toBe(a.status.key);
    const jpeg = await render(makeup, p.id, { lookId, format: 'jpeg' });
    const jm = await sharp(await download(makeup, jpeg.status.url)).metadata();
    expect([jm.format, jm.channels, jm.width]).toEqual(['jpeg', 1, 1600]);
  });

  it('names the downloaded render after the photo and the look: UTF-8 kept (RFC 6266 filename*), no path characters, "retuned" for live changes', async () => {
    const p = (await upload(makeup, await sceneJpeg(300, 200), 'x.jpg')).body.photo;
    expect((await makeup.patch(`${base()}/${p.id}`).send({ name: 'Crème brûlée ../../etc/"passwd"' })).status).toBe(200);
    await render(makeup, p.id, { lookId, format: 'jpeg' });
    // the status polled by key does not know the look; the answer to a request by lookId names it in the url
    const done = { status: (await makeup.post(`${base()}/${p.id}/renders`).send({ lookId, format: 'jpeg' })).body.render };
    expect(done.status.url).toMatch(new RegExp(`/renders/${done.status.key}/file\\?look=${lookId}$`));
    const disposition = (url: string) => makeup.get(url).buffer(true).parse(binary).then((r) => ({ status: r.status, cd: String(r.headers['content-disposition']) }));
    const named = await disposition(done.status.url);
    expect(named.status).toBe(200);
    const utf8 = decodeURIComponent(/filename\*=UTF-8''([^;]+)/.exec(named.cd)![1]);
    expect(utf8).toBe(`Crème-brûlée-etc-passwd_Photo-test-red-long-pass_${done.status.key.slice(0, 8)}.jpg`);
    expect(named.cd).toMatch(/^attachment; filename="[^"/\\]+\.jpg"/);
    // the live changes of that look, rendered unsaved: named after the look, retuned
    const retuned = await render(makeup, p.id, { look: { ...TEST_LOOK, tone: { printGrade: 4 } }, format: 'jpeg' });
    expect(retuned.status.url).not.toContain('?look=');
    const r2 = await disposition(`${retuned.status.url}?look=${lookId}`);
    expect(decodeURIComponent(/filename\*=UTF-8''([^;]+)/.exec(r2.cd)![1])).toBe(`Crème-brûlée-etc-passwd_Photo-test-red-long-pass-retuned_${retuned.status.key.slice(0, 8)}.jpg`);
    // no look: the photo's name and "grey"; a malformed look id: 400 naming the field
    expect((await disposition(retuned.status.url.split('?')[0])).cd).toContain(`_grey_${retuned.status.key.slice(0, 8)}.jpg`);
    const bad = await makeup.get(`${retuned.status.url}?look=1;rm`);
    expect([bad.status, bad.body.error?.field]).toEqual([400, 'look']);
  });

  it('refuses a look from elsewhere and bad input with a message naming the field', async () => {
    const p = (await upload(makeup, await sceneJpeg(300, 200), 'bad.jpg')).body.photo;
    expect((await makeup.post(`${base()}/${p.id}/renders`).send({ lookId: 99999 })).status).toBe(404);
    const both = await makeup.post(`${base()}/${p.id}/renders`).send({ lookId, look: TEST_LOOK });
    expect(both.status).toBe(400);
    expect(both.body.error.field).toBe('lookId');
    const fmt = await makeup.post(`${base()}/${p.id}/renders`).send({ lookId, format: 'gif' });
    expect(fmt.body.error.field).toBe('format');
  });
});

describe('the live preview’s look', () => {
  it('answers a look as spectra on the grid, with what the preview may retune', async () => {
    const r = await lab.post(`/api/productions/${pid}/photo-looks`).send({ lookId });
    expect(r.status).toBe(200);
    const l = r.body.look;
    expect(l.nm).toHaveLength(GRID_SIZE);
    expect(l.light.values).toHaveLength(GRID_SIZE);
    expect(l.light.edit).toMatchObject({ kind: 'blackbody', kelvin: 3200 });
    expect(l.filters[0]).toMatchObject({ on: 'lens', edit: { form: 'longPass', param: 'cutOnNm', nm: 590 } });
    expect(mediumToneDefaults(l.mediumToneId).known).toBe(true);
    expect(l.contentHash).toMatch(/^[0-9a-f]{64}$/);
  });

  it('the demo production carries demo photos made by the project', async () => {
    const r = await lab.get(base());
    const demo = r.body.photos.filter((p: { isDemo: boolean }) => p.isDemo);
    expect(demo.length).toBe(DEMO_SCENES.length);
    for (const p of demo) expect(p.previewWidth).toBeGreaterThanOrEqual(1600);
  });
});

describe('deleting a production', () => {
  it('removes its photos’ files (originals, previews, cached renders) once the rows are gone, and no one else’s', async () => {
    const created = await camera.post('/api/productions').send({ name: 'Photo deletion test' });
    expect(created.status).toBe(201);
    const other = created.body.production.id as number;
    const p = (await uploadOf(camera, other, await sceneJpeg(300, 200), 'to-delete.jpg')).body.photo;
    const done = await renderOf(camera, other, p.id, { look: TEST_LOOK, format: 'png16' });
    expect(done.status.status).toBe('done');
    const row = await t.ctx.ds.getRepository(Photo).findOneByOrFail({ id: p.id });
    const photoDir = path.join(t.dataDir, 'uploads', 'photos', row.storageKey);
    const renderDir = path.join(t.dataDir, 'cache', 'photo-renders', row.storageKey);
    expect(fs.readdirSync(photoDir).sort()).toEqual(['original.jpg', 'preview.jpg', 'thumb.jpg']);
    expect(fs.readdirSync(renderDir).length).toBeGreaterThan(0);
    const kept = await t.ctx.ds.getRepository(Photo).find({ where: { production: { id: pid } } });
    expect(kept.length).toBeGreaterThan(0);

    expect((await camera.delete(`/api/productions/${other}`)).status).toBe(204);
    expect(await t.ctx.ds.getRepository(Photo).countBy({ id: p.id })).toBe(0);
    expect(fs.existsSync(photoDir)).toBe(false);
    expect(fs.existsSync(renderDir)).toBe(false);
    for (const k of kept) expect(fs.existsSync(path.join(t.dataDir, 'uploads', 'photos', k.storageKey))).toBe(true);
  });
});
