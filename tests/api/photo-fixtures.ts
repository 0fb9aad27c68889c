/**
 * Helpers of the photo API tests (not a test file): uploads, renders polled to the end, downloads,
 * 16-bit grey readback, synthetic PNGs (a decompression bomb, an embedded ICC profile) and the ICC
 * matrix/TRC model used to make wide-gamut test photos.
 */
import fs from 'node:fs';
import zlib from 'node:zlib';
import sharp from 'sharp';
import { expect } from 'vitest';
import type { Agent } from '../helpers/api';
import { DEMO_SCENES, demoSceneJpeg } from '../../server/db/seed-content/photos';

/** The look the accuracy checks use, in the looks API's form: tungsten, red long-pass on the lens, panchromatic, grade 3. */
export const TEST_LOOK = {
  light: { source: { id: 'tungsten-3200' } },
  filters: [{ filter: { source: { id: 'red-590' } }, on: 'lens' }],
  medium: { source: { id: 'panchromatic' } },
  tone: { printGrade: 3 },
};

/** Saves TEST_LOOK in the production as `agent` (an editor or above); answers its id. */
export async function createTestLook(agent: Agent, pid: number): Promise<number> {
  const r = await agent.post(`/api/productions/${pid}/looks`).send({ name: 'Photo test: red long-pass', ...TEST_LOOK });
  expect(r.status).toBe(201);
  return r.body.look.id;
}

export const photosUrl = (pid: number) => `/api/productions/${pid}/photos`;

/** supertest parser that keeps a binary body as a Buffer. */
export const binary = (res: unknown, cb: (e: Error | null, b: Buffer) => void) => {
  const chunks: Buffer[] = [];
  const stream = res as NodeJS.ReadableStream;
  stream.on('data', (d: Buffer) => chunks.push(d));
  stream.on('end', () => cb(null, Buffer.concat(chunks)));
};

export const upload = (a: Agent, pid: number, buf: Buffer, name: string) => a.post(photosUrl(pid)).attach('file', buf, name);

/** Starts a render and polls it to the end; answers the final status, every stage seen and the first answer. */
export async function render(a: Agent, pid: number, photoId: number, body: object) {
  const r = await a.post(`${photosUrl(pid)}/${photoId}/renders`).send(body);
  expect([200, 202]).toContain(r.status);
  let s = r.body.render;
  const stages = new Set<string>([s.stage]);
  for (let i = 0; i < 2000 && (s.status === 'queued' || s.status === 'running'); i++) {
    await new Promise((x) => setTimeout(x, 20));
    s = (await a.get(`${photosUrl(pid)}/${photoId}/renders/${s.key}`)).body.render;
    stages.add(s.stage);
  }
  return { status: s, stages, first: r };
}

export async function download(a: Agent, url: string): Promise<Buffer> {
  const r = await a.get(url).buffer(true).parse(binary);
  expect(r.status).toBe(200);
  return r.body as Buffer;
}

/** 16-bit grey samples of a rendered PNG (which must be one channel). */
export async function grey16(png: Buffer): Promise<{ data: Uint16Array; width: number; height: number }> {
  expect((await sharp(png).metadata()).channels).toBe(1);
  const { data, info } = await sharp(png).toColourspace('grey16').raw({ depth: 'ushort' }).toBuffer({ resolveWithObject: true });
  return { data: new Uint16Array(data.buffer, data.byteOffset, data.length / 2), width: info.width, height: info.height };
}

/** A demo scene (the workshop still life) as a JPEG. */
export const sceneJpeg = (width = 1200, height = 800) => demoSceneJpeg(DEMO_SCENES[1], width, height);

/** A PNG chunk with its CRC (ISO/IEC 15948 §5.3). */
export function pngChunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const td = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(zlib.crc32(td));
  return Buffer.concat([len, td, crc]);
}

/** A decompression bomb: a valid 1-bit PNG of side × side pixels, all black, a few tens of kB on disk. */
export function pngBomb(side: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(side, 0);
  ihdr.writeUInt32BE(side, 4);
  ihdr[8] = 1; // bit depth
  ihdr[9] = 0; // greyscale
  const row = Buffer.alloc(1 + Math.ceil(side / 8));
  const deflate = zlib.deflateSync(Buffer.concat(Array.from({ length: side }, () => row)), { level: 9 });
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), pngChunk('IHDR', ihdr), pngChunk('IDAT', deflate), pngChunk('IEND', Buffer.alloc(0))]);
}

/** IEC 61966-2-1 decoding of an sRGB value 0..1 to linear. */
export const iecDecode = (v: number) => (v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4);

/** The offset of a profile's tag (tag table, ICC.1:2010 §7.3). */
function iccTag(icc: Buffer, sig: string): number {
  const n = icc.readUInt32BE(128);
  for (let i = 0; i < n; i++) if (icc.toString('latin1', 132 + i * 12, 136 + i * 12) === sig) return icc.readUInt32BE(136 + i * 12);
  throw new Error(`no ${sig} tag`);
}
/** The colorant matrix (columns rXYZ, gXYZ, bXYZ, PCS D50) of a matrix/TRC profile, as rows. */
export function colorants(file: string): number[][] {
  const icc = fs.readFileSync(file);
  const col = (sig: string) => [0, 1, 2].map((k) => icc.readInt32BE(iccTag(icc, sig) + 8 + 4 * k) / 65536);
  const [r, g, b] = [col('rXYZ'), col('gXYZ'), col('bXYZ')];
  return [0, 1, 2].map((row) => [r[row], g[row], b[row]]);
}
/** The gamma of a profile's red TRC given as a parametric curve of type 0 (Y = X^g). */
export function paraGamma(file: string): number {
  const icc = fs.readFileSync(file);
  const at = iccTag(icc, 'rTRC');
  expect(icc.toString('latin1', at, at + 4)).toBe('para');
  expect(icc.readUInt16BE(at + 8)).toBe(0);
  return icc.readInt32BE(at + 12) / 65536;
}
export const mul3 = (m: number[][], v: number[]) => m.map((row) => row[0] * v[0] + row[1] * v[1] + row[2] * v[2]);
export function invert3(m: number[][]): number[][] {
  const [[a, b, c], [d, e, f], [g, h, i]] = m;
  const det = a * (e * i - f * h) - b * (d * i - f * g) + c * (d * h - e * g);
  return [
    [(e * i - f * h) / det, (c * h - b * i) / det, (b * f - c * e) / det],
    [(f * g - d * i) / det, (a * i - c * g) / det, (c * d - a * f) / det],
    [(d * h - e * g) / det, (b * g - a * h) / det, (a * e - b * d) / det],
  ];
}
/** A PNG with an iCCP chunk (ISO/IEC 15948 §11.3.3.3) carrying `icc`, inserted after IHDR. */
export function withIccp(png: Buffer, icc: Buffer): Buffer {
  const chunk = pngChunk('iCCP', Buffer.concat([Buffer.from('profile\0', 'latin1'), Buffer.from([0]), zlib.deflateSync(icc)]));
  return Buffer.concat([png.subarray(0, 33), chunk, png.subarray(33)]);
}
