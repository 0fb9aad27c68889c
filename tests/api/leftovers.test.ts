/**
 * Nothing left behind (issue 14, item 5): an upload refused for any reason (a field too long, a folder the
 * server cannot write, a client gone mid-transfer, a kill -9) leaves no file in uploads/.incoming, no
 * `.staging-*` folder in uploads/photos and no temporary file in cache/photo-renders; a periodic sweep
 * removes what a killed process left; per-production storage quotas with a clear message; the original's
 * download carries a safe Content-Disposition and `X-Content-Type-Options: nosniff`.
 */
import fs from 'node:fs';
import http from 'node:http';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startDemoAs, withTestApp, type Agent, type TestApp } from '../helpers/api';
import { Photo } from '../../server/db/entities/photo.entity';
import { photosService } from '../../server/modules/photos/photos.router';
import { PhotosService, SWEEP_EVERY_MS } from '../../server/modules/photos/photos.service';
import { ORPHAN_AGE_MS, PhotoStorage } from '../../server/modules/photos/photo-storage';
import { binary, photosUrl, sceneJpeg } from './photo-fixtures';

let t: TestApp;
let makeup: Agent;
let camera: Agent;
let pid: number;

beforeAll(async () => {
  ({ t, pid, as: { makeup, camera } } = await startDemoAs({ makeup: 'makeup', camera: 'camera' }));
});
afterAll(async () => t?.close());

/** What a refused upload must not leave: incoming files, staging folders, renders' temporary files. */
function leftovers(dataDir = t.dataDir): string[] {
  const list = (d: string) => (fs.existsSync(d) ? fs.readdirSync(d) : []);
  const up = path.join(dataDir, 'uploads');
  const renders = path.join(dataDir, 'cache', 'photo-renders');
  return [
    ...list(path.join(up, '.incoming')).map((f) => `.incoming/${f}`),
    ...list(path.join(up, 'photos')).filter((f) => f.startsWith('.staging-')),
    ...list(renders).flatMap((k) => list(path.join(renders, k)).filter((f) => f.endsWith('.tmp')).map((f) => `${k}/${f}`)),
  ];
}

/** Rows and photo folders, to show a refusal stored nothing. */
async function stored(dataDir = t.dataDir, app = t) {
  const photos = path.join(dataDir, 'uploads', 'photos');
  return { rows: await app.ctx.ds.getRepository(Photo).count(), dirs: fs.readdirSync(photos).filter((f) => !f.startsWith('.')).sort() };
}

/** Waits until `check` holds (polling), at most `ms`. */
async function eventually(check: () => boolean, ms = 5000): Promise<boolean> {
  for (const end = Date.now() + ms; Date.now() < end; await new Promise((r) => setTimeout(r, 25))) if (check()) return true;
  return check();
}

describe('a refused upload leaves nothing', () => {
  it('a name field longer than a name may be (400), and a field over the 8 kB form limit (400)', async () => {
    const before = await stored();
    const jpg = await sceneJpeg(600, 400);
    const long = await makeup.post(photosUrl(pid)).field('name', 'n'.repeat(121)).attach('file', jpg, 'a.jpg');
    expect(long.status).toBe(400);
    expect(leftovers()).toEqual([]);
    expect(long.body.error).toMatchObject({ field: 'name', message: 'name: A name takes at most 120 characters.' });
    const huge = await makeup.post(photosUrl(pid)).attach('file', jpg, 'b.jpg').field('notes', 'x'.repeat(9000));
    expect(huge.status).toBe(400);
    expect(huge.body.error.field).toBe('notes');
    expect(leftovers()).toEqual([]);
    expect(await stored()).toEqual(before);
  });

  it('a photo folder the server cannot write (the staging step fails): 500 saying so, nothing kept', async () => {
    // tests run as root, where a 0500 folder still takes writes: the staging step is made to fail instead
    const svc = photosService(t.ctx);
    const spy = vi.spyOn(svc.storage, 'stagingDir').mockImplementation(() => {
      throw Object.assign(new Error("EACCES: permission denied, mkdir '.staging-x'"), { code: 'EACCES' });
    });
    try {
      const before = await stored();
      const r = await makeup.post(photosUrl(pid)).attach('file', await sceneJpeg(600, 400), 'c.jpg');
      expect(r.status).toBe(500);
      expect(r.body.error).toMatchObject({ code: 'storage', message: 'The server cannot write its photo folder; the photo was not stored. Tell the site operator.' });
      expect(leftovers()).toEqual([]);
      expect(await stored()).toEqual(before);
    } finally {
      spy.mockRestore();
    }
  });

  it('a full disk when the staged photo moves into place (507): the staging folder and the upload are removed', async () => {
    const svc = photosService(t.ctx);
    const spy = vi.spyOn(svc.storage, 'commit').mockImplementation(() => {
      throw Object.assign(new Error('ENOSPC: no space left on device'), { code: 'ENOSPC' });
    });
    try {
      const before = await stored();
      const r = await makeup.post(photosUrl(pid)).attach('file', await sceneJpeg(600, 400), 'd.jpg');
      expect(r.status).toBe(507);
      expect(r.body.error.message).toMatch(/disk is full; the photo was not stored/);
      expect(leftovers()).toEqual([]);
      expect(await stored()).toEqual(before);
    } finally {
      spy.mockRestore();
    }
  });

  it('a client that disconnects mid-upload leaves no incoming file', async () => {
    const server = http.createServer(t.app).listen(0);
    try {
      const port = (server.address() as net.AddressInfo).port;
      const jar = new Map<string, string>();
      const call = async (method: string, url: string, body?: object, token?: string) => {
        const r = await fetch(`http://127.0.0.1:${port}${url}`, {
          method,
          headers: { cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; '), ...(body ? { 'content-type': 'application/json' } : {}), ...(token ? { 'x-csrf-token': token } : {}) },
          body: body ? JSON.stringify(body) : undefined,
        });
        for (const c of r.headers.getSetCookie()) {
          const [kv] = c.split(';');
          const i = kv.indexOf('=');
          jar.set(kv.slice(0, i), kv.slice(i + 1));
        }
        return (await r.json()) as { csrfToken: string };
      };
      const { csrfToken } = await call('GET', '/api/auth/csrf');
      const signedIn = await call('POST', '/api/auth/sign-in', { email: 'makeup@demo.grisaille.test', password: 'grisaille-demo' }, csrfToken);
      const incoming = path.join(t.dataDir, 'uploads', '.incoming');
      const socket = net.connect(port, '127.0.0.1');
      await new Promise((r) => socket.once('connect', r));
      const head = '--gone\r\nContent-Disposition: form-data; name="file"; filename="gone.jpg"\r\nContent-Type: image/jpeg\r\n\r\n';
      socket.write(
        [
          `POST ${photosUrl(pid)} HTTP/1.1`,
          `Host: 127.0.0.1:${port}`,
          `Cookie: ${[...jar].map(([k, v]) => `${k}=${v}`).join('; ')}`,
          `X-CSRF-Token: ${signedIn.csrfToken}`,
          'Content-Type: multipart/form-data; boundary=gone',
          `Content-Length: ${head.length + 5_000_000}`,
          '',
          head,
        ].join('\r\n'),
      );
      socket.write(Buffer.alloc(1_000_000, 0xab));
      // the upload has begun: its incoming file exists
      expect(await eventually(() => fs.readdirSync(incoming).length > 0)).toBe(true);
      socket.destroy();
      expect(await eventually(() => fs.readdirSync(incoming).length === 0)).toBe(true);
      expect(leftovers()).toEqual([]);
    } finally {
      await new Promise((r) => server.close(r));
    }
  });
});

describe('the sweep removes what a killed process left', () => {
  /** An incoming file, a staging folder, a render's temporary file and the render cache of a deleted photo, all untouched for `ageMs`. */
  function orphans(dataDir: string, ageMs: number) {
    const s = new PhotoStorage(dataDir);
    const when = new Date(Date.now() - ageMs);
    const incoming = path.join(s.incomingDir, `${PhotoStorage.newKey()}.upload`);
    fs.writeFileSync(incoming, 'half an upload');
    const staging = path.join(s.photosRoot, `.staging-${PhotoStorage.newKey().slice(0, 16)}`);
    fs.mkdirSync(staging);
    fs.writeFileSync(path.join(staging, 'preview.jpg'), 'half a preview');
    const liveKey = fs.readdirSync(s.photosRoot).find((f) => /^[0-9a-f]{32}$/.test(f))!;
    fs.mkdirSync(s.renderDir(liveKey), { recursive: true });
    const tmp = path.join(s.renderDir(liveKey), `${PhotoStorage.newKey()}.png.999.0000.tmp`);
    fs.writeFileSync(tmp, 'half a render');
    const goneKey = PhotoStorage.newKey();
    const goneRenders = s.renderDir(goneKey);
    fs.mkdirSync(goneRenders, { recursive: true });
    fs.writeFileSync(path.join(goneRenders, `${'b'.repeat(32)}.png`), 'a render of a deleted photo');
    for (const p of [path.join(staging, 'preview.jpg'), path.join(goneRenders, `${'b'.repeat(32)}.png`), incoming, staging, tmp, goneRenders]) fs.utimesSync(p, when, when);
    return [incoming, staging, tmp, goneRenders];
  }

  it('files untouched for 15 minutes go; fresh ones (an upload in progress) stay', () => {
    const svc = photosService(t.ctx);
    const old = orphans(t.dataDir, ORPHAN_AGE_MS + 60_000);
    const fresh = orphans(t.dataDir, 1000);
    const removed = svc.sweepOrphans();
    expect(removed.sort()).toEqual(old.sort());
    for (const p of old) expect(fs.existsSync(p), p).toBe(false);
    for (const p of fresh) expect(fs.existsSync(p), p).toBe(true);
    for (const p of fresh) fs.rmSync(p, { recursive: true, force: true });
    expect(leftovers()).toEqual([]);
  });

  it('runs every 10 minutes while the app serves, and at start takes everything left', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-sweep-'));
    try {
      fs.cpSync(path.join(t.dataDir, 'uploads'), path.join(dir, 'uploads'), { recursive: true });
      const atStart = orphans(dir, 1000);
      vi.useFakeTimers({ toFake: ['setInterval', 'clearInterval'] });
      const svc = new PhotosService(t.ctx.ds, dir);
      try {
        // at start nothing can be in progress: even fresh leftovers go
        for (const p of atStart) expect(fs.existsSync(p), p).toBe(false);
        const later = orphans(dir, ORPHAN_AGE_MS + 60_000);
        vi.advanceTimersByTime(SWEEP_EVERY_MS - 1000);
        expect(later.every((p) => fs.existsSync(p))).toBe(true);
        vi.advanceTimersByTime(1000);
        for (const p of later) expect(fs.existsSync(p), p).toBe(false);
        // closing stops the sweep's timer
        await svc.close();
        expect(vi.getTimerCount()).toBe(0);
      } finally {
        await svc.close();
        vi.useRealTimers();
      }
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('storage quotas per production', () => {
  it('an upload that would take a production over PRODUCTION_QUOTA_MB is refused with 413, leaving nothing', async () => {
    const jpg = await sceneJpeg(1200, 800);
    await withTestApp({ env: { productionQuotaBytes: Math.round(jpg.length * 2.5) } }, async (app) => {
      const owner = await app.agent('camera@demo.grisaille.test');
      const prod = (await owner.post('/api/productions').send({ name: 'Small quota' })).body.production;
      const first = await owner.post(photosUrl(prod.id)).attach('file', jpg, 'first.jpg');
      expect(first.status).toBe(201);
      const before = await stored(app.dataDir, app);
      const second = await owner.post(photosUrl(prod.id)).attach('file', jpg, 'second.jpg');
      expect(second.status).toBe(413);
      expect(second.body.error).toMatchObject({ code: 'quota_exceeded', field: 'file' });
      expect(second.body.error.message).toMatch(
        /^This production's photos use \d+ kB of its \d+ kB; this file \(\d+ kB\) does not fit\. Delete photos or ask the site operator to raise PRODUCTION_QUOTA_MB\.$/,
      );
      expect(await stored(app.dataDir, app)).toEqual(before);
      expect(leftovers(app.dataDir)).toEqual([]);
      // the quota is the production's: the demo production is not held back by this one
      expect(photosService(app.ctx).limits.quotaBytes).toBe(Math.round(jpg.length * 2.5));
      // deleting a photo frees its room
      expect((await owner.delete(`${photosUrl(prod.id)}/${first.body.photo.id}`)).status).toBe(204);
      expect((await owner.post(photosUrl(prod.id)).attach('file', jpg, 'third.jpg')).status).toBe(201);
    });
  });

  it('the preview and thumbnail count too: a file that fits only without them is refused after the check, its staging folder removed', async () => {
    const svc = photosService(t.ctx);
    const keep = svc.limits.quotaBytes;
    const jpg = await sceneJpeg(1200, 800);
    try {
      svc.limits.quotaBytes = (await svc.usedBytes(pid)) + jpg.length + 100;
      const before = await stored();
      const r = await makeup.post(photosUrl(pid)).attach('file', jpg, 'almost.jpg');
      expect(r.status).toBe(413);
      expect(r.body.error.message).toMatch(/does not fit/);
      expect(await stored()).toEqual(before);
      expect(leftovers()).toEqual([]);
    } finally {
      svc.limits.quotaBytes = keep;
    }
  });

  it('sizes are said in kB, MB and GB as the message of the issue has them', async () => {
    const { sizeText } = await import('../../server/modules/photos/photos.service');
    expect(sizeText(150 * 1024 * 1024)).toBe('150 MB');
    expect(sizeText(1.9 * 1024 ** 3)).toBe('1.9 GB');
    expect(sizeText(2 * 1024 ** 3)).toBe('2 GB');
    expect(sizeText(64 * 1024)).toBe('64 kB');
  });
});

describe("the original's download", () => {
  it('a hostile stored name (quotes, CR/LF, a path, a bidi override) gives a safe Content-Disposition, with nosniff', async () => {
    const up = await camera.post(photosUrl(pid)).attach('file', await sceneJpeg(300, 200), 'plain.jpg');
    expect(up.status).toBe(201);
    await t.ctx.ds.getRepository(Photo).update({ id: up.body.photo.id }, { originalName: 'x"; filename=evil.html\r\nSet-Cookie: a=b\\..\\../\u202Egpj.html' });
    const d = await camera.get(up.body.photo.urls.original).buffer(true).parse(binary);
    expect(d.status).toBe(200);
    expect(d.headers['x-content-type-options']).toBe('nosniff');
    expect(d.headers['set-cookie'] ?? []).not.toContainEqual(expect.stringContaining('a=b'));
    const cd: string = d.headers['content-disposition'];
    // one quoted ASCII filename (RFC 6266 §4.1), and filename* (RFC 8187 attr-chars) only for a name that is not plain ASCII
    expect(cd).toMatch(/^attachment; filename="[^"\\/\r\n]*"(; filename\*=UTF-8''[A-Za-z0-9!#$&+\-.^_`|~%]+)?$/);
    expect(cd).not.toMatch(/[\r\n]/);
    // the last path segment, the override taken out, and the stored format's extension
    expect(cd).toBe('attachment; filename="gpj.html.jpg"');
    await t.ctx.ds.getRepository(Photo).update({ id: up.body.photo.id }, { originalName: 'Bühne\u0000"1"\u2029.JPEG' });
    const d2 = await camera.get(up.body.photo.urls.original).buffer(true).parse(binary);
    const cd2: string = d2.headers['content-disposition'];
    // control characters become spaces, quotes `_`; the name keeps its UTF-8 in filename*
    expect(cd2).toBe(`attachment; filename="Buhne _1_ .JPEG"; filename*=UTF-8''${encodeURIComponent('Bühne _1_ .JPEG')}`);
  });
});
