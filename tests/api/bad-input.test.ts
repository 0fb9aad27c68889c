/**
 * Bad input (issue 14, item 4): bodies the server cannot read are answered 4xx with a clear message, never
 * 500; upload file names keep their UTF-8; names refuse control, bidi-formatting and zero-width characters;
 * a PATCH changes only the fields it names; a photo origin names a photo of the same production and a
 * region inside it; a medium curve whose values all overflow is refused.
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startDemoAs, type Agent, type TestApp } from '../helpers/api';
import { Production } from '../../server/db/entities/production.entity';
import { Curve } from '../../server/db/entities/curve.entity';
import { binary, photosUrl, sceneJpeg, TEST_LOOK } from './photo-fixtures';
import { clientErrorAnswer } from '../../server/middleware/error-handler';
import * as authSchemas from '../../shared/schemas/auth';
import * as boardSchemas from '../../shared/schemas/board';
import * as curveSchemas from '../../shared/schemas/curve';
import * as lookSchemas from '../../shared/schemas/look';
import * as photoSchemas from '../../shared/schemas/photo';
import * as swatchSchemas from '../../shared/schemas/swatch';

/** Every schema module with an update schema. */
const schemas = { ...authSchemas, ...boardSchemas, ...curveSchemas, ...lookSchemas, ...photoSchemas, ...swatchSchemas };

let t: TestApp;
let camera: Agent;
let makeup: Agent;
let pid: number;
let base: string;

beforeAll(async () => {
  ({ t, pid, base, as: { camera, makeup } } = await startDemoAs({ camera: 'camera', makeup: 'makeup' }));
});
afterAll(async () => t?.close());

/** Files in uploads/.incoming and `.staging-*` folders in uploads/photos: none may stay after a refused upload. */
function leftovers(): string[] {
  const up = path.join(t.dataDir, 'uploads');
  const list = (d: string) => (fs.existsSync(d) ? fs.readdirSync(d) : []);
  return [...list(path.join(up, '.incoming')).map((f) => `.incoming/${f}`), ...list(path.join(up, 'photos')).filter((f) => f.startsWith('.staging-'))];
}

/** The file name a browser takes from Content-Disposition: `filename*` (RFC 6266 §4.3: preferred; RFC 8187 UTF-8), else `filename`. */
function dispositionName(header: string): string {
  const star = /filename\*=UTF-8''([^;\s]+)/i.exec(header);
  if (star) return decodeURIComponent(star[1]);
  return /filename="((?:[^"\\]|\\.)*)"/.exec(header)?.[1] ?? '';
}

describe('bodies the server cannot read: 4xx with a clear message, never 500', () => {
  /** POST /api/productions with these bytes as they are (superagent would otherwise JSON-encode a Buffer). */
  const json = (coding: string | null, body: Buffer, type = 'application/json') => {
    const r = camera.post('/api/productions').set('Content-Type', type).serialize(((b: Buffer) => b) as unknown as (o: unknown) => string);
    if (coding) r.set('Content-Encoding', coding);
    return r.send(body);
  };

  it('a Content-Encoding the server does not decode is 415, naming it', async () => {
    const r = await json('x-foo', Buffer.from('{"name":"Encoded"}'));
    expect(r.status).toBe(415);
    expect(r.body.error).toMatchObject({ code: 'unsupported_encoding' });
    expect(r.body.error.message).toMatch(/Content-Encoding "x-foo" is not accepted; send it uncompressed, or compressed with gzip, deflate or br/);
  });

  it('gzip that is not gzip is 400, not 500', async () => {
    const r = await json('gzip', Buffer.from('this is not gzip at all, only text pretending to be'));
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/not valid compressed data/);
  });

  it('valid gzip, deflate and br JSON are read (body-parser 2 decodes them, within the same 2 MB limit)', async () => {
    const body = (name: string) => Buffer.from(JSON.stringify({ name }));
    for (const [coding, pack] of [['gzip', zlib.gzipSync], ['deflate', zlib.deflateSync], ['br', zlib.brotliCompressSync]] as const) {
      const r = await json(coding, pack(body(`Compressed ${coding}`)));
      expect(r.status, `${coding}: ${JSON.stringify(r.body)}`).toBe(201);
      expect(r.body.production.name).toBe(`Compressed ${coding}`);
    }
  });

  it('a charset other than UTF-8 is 415, naming it', async () => {
    const r = await json(null, Buffer.from('{"name":"Charset"}'), 'application/json; charset=ebcdic');
    expect(r.status).toBe(415);
    expect(r.body.error).toMatchObject({ code: 'unsupported_charset' });
    expect(r.body.error.message).toMatch(/charset "ebcdic" is not accepted; send JSON in UTF-8/);
  });

  it('multipart without a boundary is 400, and nothing is left behind', async () => {
    const r = await makeup.post(photosUrl(pid)).set('Content-Type', 'multipart/form-data').send(Buffer.from('--x\r\n\r\n'));
    expect(r.status).toBe(400);
    expect(r.body.error).toMatchObject({ code: 'invalid', field: 'file' });
    expect(r.body.error.message).toMatch(/without a boundary/);
    expect(leftovers()).toEqual([]);
  });

  it('a truncated multipart upload is 400, and its partial file is removed', async () => {
    const jpg = await sceneJpeg(600, 400);
    const head = Buffer.from('--cut-here\r\nContent-Disposition: form-data; name="file"; filename="cut.jpg"\r\nContent-Type: image/jpeg\r\n\r\n');
    // the part never closes: no final boundary
    const r = await makeup.post(photosUrl(pid)).set('Content-Type', 'multipart/form-data; boundary=cut-here').send(Buffer.concat([head, jpg.subarray(0, 20_000)]));
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/ended before it was complete/);
    expect(leftovers()).toEqual([]);
  });

  it('a compressed multipart upload is 415 (uploads are read as sent)', async () => {
    const r = await makeup.post(photosUrl(pid)).set('Content-Encoding', 'gzip').attach('file', await sceneJpeg(300, 200), 'x.jpg');
    expect(r.status).toBe(415);
    expect(r.body.error.message).toMatch(/An upload is sent uncompressed/);
    expect(leftovers()).toEqual([]);
  });
});

describe('the one error handler maps the parsers\' errors by kind', () => {
  it('an exposed 4xx from http-errors keeps its status with our words; busboy\'s plain errors are 400; anything else stays a 500', () => {
    expect(clientErrorAnswer(Object.assign(new Error('range not satisfiable'), { status: 416, expose: true }))).toMatchObject({ status: 416, message: expect.stringMatching(/^The request could not be read/) });
    expect(clientErrorAnswer(Object.assign(new Error('request size did not match content length'), { status: 400, expose: true, type: 'request.size.invalid' }))).toMatchObject({ status: 400, message: 'The request body is not as long as its Content-Length says.' });
    expect(clientErrorAnswer(new Error('Malformed part header'))).toMatchObject({ status: 400, field: 'file' });
    // not exposed, or a server status: not the client's to see
    expect(clientErrorAnswer(Object.assign(new Error('x'), { status: 400, expose: false }))).toBeNull();
    expect(clientErrorAnswer(Object.assign(new Error('x'), { status: 503, expose: true }))).toBeNull();
    expect(clientErrorAnswer(new Error('SQLITE_BUSY'))).toBeNull();
  });
});

describe('upload file names keep their UTF-8', () => {
  it('`Gâteau — costume.jpg` is stored as sent and downloads under the same name', async () => {
    const fileName = 'Gâteau — costume.jpg';
    const r = await makeup.post(photosUrl(pid)).attach('file', await sceneJpeg(600, 400), fileName);
    expect(r.status).toBe(201);
    expect(r.body.photo.originalName).toBe(fileName);
    expect(r.body.photo.name).toBe('Gâteau — costume');
    const d = await makeup.get(r.body.photo.urls.original).buffer(true).parse(binary);
    expect(d.status).toBe(200);
    const cd = d.headers['content-disposition'];
    // RFC 6266 §4.1: attachment, an ASCII filename, the exact name as filename* (RFC 8187, UTF-8)
    expect(cd).toMatch(/^attachment; filename="[\x20-\x7e]*"; filename\*=UTF-8''/);
    expect(dispositionName(cd)).toBe(fileName);
    expect(/^[\x20-\x7e]*$/.test(cd)).toBe(true);
    expect(d.headers['x-content-type-options']).toBe('nosniff');
  });
});

describe('names refuse control, bidi-formatting and zero-width characters', () => {
  const rlo = 'Costume \u202Egpj.exe';
  it('a production, a look, a swatch, a board, a curve and a photo: 400 naming the field and the code point', async () => {
    const swatch = await camera.post(`${base}/swatches`).send({ name: 'Plain', origin: { type: 'colour', colour: { space: 'hex', hex: '#808080' } } });
    const photoId = (await camera.get(photosUrl(pid))).body.photos[0].id;
    const tries = [
      ['production', camera.post('/api/productions').send({ name: rlo })],
      ['look', camera.post(`${base}/looks`).send({ name: 'Look\u200B one', ...TEST_LOOK })],
      ['swatch', camera.patch(`${base}/swatches/${swatch.body.swatch.id}`).send({ name: 'Red\u0007' })],
      ['board', camera.post(`${base}/boards`).send({ name: '\u2066Board\u2069' })],
      ['curve', camera.post(`${base}/curves`).send({ kind: 'light', name: 'Lamp\uFEFFx', origin: { type: 'table', basis: 'power', table: { samples: [[380, 1], [580, 1], [780, 1]] } } })],
      ['photo', camera.patch(`${photosUrl(pid)}/${photoId}`).send({ name: 'Photo\u200Fx' })],
    ] as const;
    const codes = { production: 'U+202E', look: 'U+200B', swatch: 'U+0007', board: 'U+2066', curve: 'U+FEFF', photo: 'U+200F' };
    for (const [what, req] of tries) {
      const r = await req;
      expect(r.status, what).toBe(400);
      expect(r.body.error.field, what).toBe('name');
      const kind = what === 'swatch' ? 'control characters' : 'invisible or direction-changing characters';
      expect(r.body.error.message, what).toBe(`name: Names cannot contain ${kind}${what === 'swatch' ? ' such as line breaks or tabs' : ''} (${codes[what]}).`);
    }
    expect(await t.ctx.ds.getRepository(Production).countBy({ name: rlo })).toBe(0);
  });

  it("a member's display name on accepting an invitation", async () => {
    await camera.post(`${base}/invitations`).send({ email: 'names@example.test', role: 'viewer', department: 'lab' });
    const token = t.linkIn((await t.outbox())[0].text, '/invitation/');
    const guest = await t.agent();
    const r = await guest.post(`/api/invitations/${token}/accept`).send({ name: 'Admin\u202E', password: 'a-long-password' });
    expect(r.status).toBe(400);
    expect(r.body.error).toMatchObject({ field: 'name', message: 'name: Names cannot contain invisible or direction-changing characters (U+202E).' });
  });

  it('joiners stay where writing needs them (Persian ZWNJ, an emoji sequence) but not between Latin letters', async () => {
    const persian = 'می\u200Cخواهم';
    const family = '\u{1F468}\u200D\u{1F469}\u200D\u{1F467} crew';
    for (const name of [persian, family]) {
      const r = await camera.post('/api/productions').send({ name });
      expect(r.status, name).toBe(201);
      expect(r.body.production.name).toBe(name);
    }
    const latin = await camera.post('/api/productions').send({ name: 'Ad\u200Cmin' });
    expect(latin.status).toBe(400);
    expect(latin.body.error.message).toMatch(/\(U\+200C\)/);
  });
});

describe('a PATCH changes only the fields it names', () => {
  /** Every field of a view but the name and the update time. */
  const rest = (v: Record<string, unknown>) => Object.fromEntries(Object.entries(v).filter(([k]) => k !== 'name' && k !== 'updatedAt'));

  it('the update schemas add nothing that was not sent (no defaults filled in)', () => {
    const updates = Object.entries(schemas).filter(([k]) => /UpdateSchema$/.test(k)) as [string, { safeParse(v: unknown): { success: boolean; data?: unknown } }][];
    expect(updates.map(([k]) => k).sort()).toEqual(expect.arrayContaining(['boardUpdateSchema', 'curveUpdateSchema', 'lookUpdateSchema', 'photoUpdateSchema', 'productionUpdateSchema', 'swatchUpdateSchema']));
    for (const [k, s] of updates) {
      const r = s.safeParse({ name: 'Only the name' });
      // nothing but what was sent (a schema without a name field drops it)
      if (r.success) expect(Object.keys(r.data as object).filter((f) => f !== 'name'), k).toEqual([]);
    }
  });

  it('productions, looks, swatches, boards, curves and photos keep every other field', async () => {
    const made = {
      production: (await camera.post('/api/productions').send({ name: 'Patch me', description: 'A description to keep.' })).body.production,
      look: (await camera.post(`${base}/looks`).send({ name: 'Patch look', notes: 'Look notes to keep.', ...TEST_LOOK, tone: { printGrade: 4, keyZone: 6 } })).body.look,
      swatch: (await camera.post(`${base}/swatches`).send({ name: 'Patch swatch', notes: 'Swatch notes.', department: 'camera', lightStops: 1.5, origin: { type: 'colour', colour: { space: 'hex', hex: '#a33b3b' } } })).body.swatch,
      board: null as null | { id: number },
      curve: (await camera.post(`${base}/curves`).send({ kind: 'light', name: 'Patch curve', notes: 'Curve notes.', origin: { type: 'table', basis: 'power', table: { samples: [[380, 1], [580, 2], [780, 1]] } } })).body.curve,
      photo: (await camera.patch(`${photosUrl(pid)}/${(await camera.get(photosUrl(pid))).body.photos[0].id}`).send({ notes: 'Photo notes to keep.' })).body.photo,
    };
    made.board = (await camera.post(`${base}/boards`).send({ name: 'Patch board', notes: 'Board notes.', department: 'camera', lookIds: [made.look.id], swatchIds: [made.swatch.id], mergeStops: 0.5, mergeDeltaE: 20 })).body.board;
    const urls: Record<keyof typeof made, string> = {
      production: `/api/productions/${made.production.id}`,
      look: `${base}/looks/${made.look.id}`,
      swatch: `${base}/swatches/${made.swatch.id}`,
      board: `${base}/boards/${made.board!.id}`,
      curve: `${base}/curves/${made.curve.id}`,
      photo: `${photosUrl(pid)}/${made.photo.id}`,
    };
    for (const [what, url] of Object.entries(urls) as [keyof typeof made, string][]) {
      const before = (await camera.get(url)).body[what];
      expect(before, what).toBeTruthy();
      const r = await camera.patch(url).send({ name: `Renamed ${what}` });
      expect(r.status, what).toBe(200);
      const after = (await camera.get(url)).body[what];
      expect(after.name, what).toBe(`Renamed ${what}`);
      expect(rest(after), what).toEqual(rest(before));
    }
    // the fields that a default once wiped are still there
    expect((await camera.get(urls.production)).body.production.description).toBe('A description to keep.');
  });
});

describe('a photo origin names a photo of the same production and a region inside it', () => {
  const origin = (photoId: number, rect: number[]) => ({ type: 'photo', photoId, rect, colour: { space: 'hex', hex: '#806040' } });

  it('a photo of another production is refused, naming origin.photoId', async () => {
    const other = (await camera.post('/api/productions').send({ name: 'Other production' })).body.production;
    const up = await camera.post(photosUrl(other.id)).attach('file', await sceneJpeg(300, 200), 'elsewhere.jpg');
    expect(up.status).toBe(201);
    const r = await camera.post(`${base}/swatches`).send({ name: 'Borrowed', origin: origin(up.body.photo.id, [0, 0, 10, 10]) });
    expect(r.status).toBe(400);
    expect(r.body.error).toMatchObject({ field: 'origin.photoId', message: `origin.photoId: there is no photo ${up.body.photo.id} in this production.` });
  });

  it('a region outside the photo is refused, naming origin.rect; one inside is kept', async () => {
    const photo = (await camera.get(photosUrl(pid))).body.photos[0];
    const { width: w, height: h } = photo;
    for (const rect of [[w, 0, 1, 1], [0, h - 5, 10, 10], [w - 10, 0, 20, 5]]) {
      const r = await camera.post(`${base}/swatches`).send({ name: 'Outside', origin: origin(photo.id, rect) });
      expect(r.status, rect.join()).toBe(400);
      expect(r.body.error.field).toBe('origin.rect');
      expect(r.body.error.message).toContain(`reaches outside the photo, which is ${w} × ${h} px`);
    }
    const ok = await camera.post(`${base}/swatches`).send({ name: 'Inside', origin: origin(photo.id, [w - 10, h - 10, 10, 10]) });
    expect(ok.status).toBe(201);
    const moved = await camera.patch(`${base}/swatches/${ok.body.swatch.id}`).send({ origin: origin(photo.id, [0, 0, w + 1, 1]) });
    expect(moved.status).toBe(400);
    expect(moved.body.error.field).toBe('origin.rect');
  });
});

describe('a medium curve whose values all overflow is refused', () => {
  it('log10 sensitivities of 400 (10^400) give no number: 400 naming the field, nothing stored', async () => {
    const before = await t.ctx.ds.getRepository(Curve).count();
    const samples = [[400, 400], [500, 400], [600, 400], [700, 400]];
    const r = await camera.post(`${base}/curves`).send({ kind: 'medium', name: 'Overflow', origin: { type: 'table', basis: 'log10', table: { samples } } });
    expect(r.status).toBe(400);
    expect(r.body.error.field).toBe('origin.table.samples');
    // refused by the engine's own check (shared/spectral/spectrum.ts normalisePeak), with the hint on log10 values
    expect(r.body.error.message).toMatch(/values too large to compute with .*log10 sensitivities lie around −3 to 3/);
    const text = samples.map(([nm, v]) => `${nm},${v}`).join('\n');
    const f = await camera.post(`${base}/curves`).send({ kind: 'medium', name: 'Overflow file', origin: { type: 'table', basis: 'log10', table: { text } } });
    expect(f.status).toBe(400);
    expect(f.body.error.field).toBe('origin.table.text');
    const q = await camera.post(`${base}/curves`).send({ kind: 'medium', name: 'Overflow QE', origin: { type: 'table', basis: 'quantum', table: { samples: samples.map(([nm]) => [nm, 1e308]) } } });
    expect(q.status).toBe(400);
    expect(await t.ctx.ds.getRepository(Curve).count()).toBe(before);
  });
});

describe("a look's own medium curve that would overflow is refused too", () => {
  it('POST /api/simulate with log10 sensitivities of 400 answers 400 naming the medium, not a body of nulls', async () => {
    const r = await camera.post('/api/simulate').send({
      light: { cie: 'D65' },
      filters: [],
      medium: { samples: [[400, 400], [500, 400], [600, 400], [700, 400]], basis: 'log10' },
      swatches: [{ name: 'grey', srgb: '#777777' }],
    });
    expect(r.status).toBe(400);
    expect(r.body.error.field).toMatch(/^medium/);
    expect(r.body.error.message).toMatch(/too large to compute with/);
  });
});
