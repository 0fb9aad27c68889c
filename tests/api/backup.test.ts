/**
 * Backup and restore (scripts/backup.ts, scripts/restore.ts, README "Backup and restore"): a backup taken
 * while the app takes writes restores every write acknowledged before it began, each photo with its files;
 * the manifest's sizes and sha256 hold for the backup and for the restored data; a photo deleted while the
 * backup copies files is left out whole; restore refuses while a server runs on DATA_DIR, refuses a
 * tampered file and a folder that is not a backup, and keeps the previous data aside; backup refuses a
 * folder that is not empty. The scripts run as the operator runs them: a separate process with DATA_DIR set.
 */
import { spawn } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import sharp from 'sharp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, type GrisailleApp } from '../../server/app';
import { DEMO_PASSWORD } from '../../server/db/seed';
import { backupManifestSchema, serverPidFile, type BackupManifest } from '../../server/services/backup';
import { makeBackup } from '../../scripts/backup';
import { copyRunUpsampleTable } from '../setup/upsample-table-file';
import { startTestApp, type Agent, type TestApp } from '../helpers/api';
import { binary } from './photo-fixtures';

const ROOT = path.resolve(import.meta.dirname, '..', '..');
/** The demo production's owner (server/db/seed.ts). */
const OWNER = 'camera@demo.grisaille.test';
/** A generous bound for a child process (tsx compiles on start; the machine is shared). */
const CHILD_TIMEOUT_MS = 60_000;

interface Run {
  code: number | null;
  out: string;
  err: string;
}

/** Runs scripts/<name>.ts with `arg` the way `npm run <name> -- arg` does (tsx), with DATA_DIR set. */
function runScript(name: 'backup' | 'restore', arg: string | undefined, dataDir: string): Promise<Run> {
  return new Promise((resolve, reject) => {
    const args = ['--import', 'tsx', path.join(ROOT, 'scripts', `${name}.ts`), ...(arg === undefined ? [] : [arg])];
    const child = spawn(process.execPath, args, { cwd: ROOT, env: { ...process.env, DATA_DIR: dataDir }, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (err += d));
    const timer = setTimeout(() => child.kill('SIGKILL'), CHILD_TIMEOUT_MS);
    child.on('error', reject);
    child.on('close', (code) => {
      clearTimeout(timer);
      resolve({ code, out, err });
    });
  });
}

const temps: string[] = [];
/** A fresh temporary folder, removed after the file. */
function tempDir(label: string): string {
  const d = fs.mkdtempSync(path.join(os.tmpdir(), `grisaille-${label}-`));
  temps.push(d);
  return d;
}
/** A path that does not exist yet, in a fresh temporary folder. */
const freshPath = (label: string) => path.join(tempDir(label), label);

const sha256 = (file: string) => crypto.createHash('sha256').update(fs.readFileSync(file)).digest('hex');
const readManifest = (dir: string): BackupManifest => backupManifestSchema.parse(JSON.parse(fs.readFileSync(path.join(dir, 'manifest.json'), 'utf8')));

/** Every file the manifest lists under `root` has its size and sha256; with `exact`, `root` holds nothing else. */
function expectMatchesManifest(root: string, m: BackupManifest, exact: boolean) {
  for (const f of [m.database, ...m.files]) {
    const p = path.join(root, f.path);
    expect(fs.statSync(p).size, f.path).toBe(f.bytes);
    expect(sha256(p), f.path).toBe(f.sha256);
  }
  if (exact) {
    const all = (fs.readdirSync(root, { recursive: true }) as string[]).filter((p) => fs.statSync(path.join(root, p)).isFile()).map((p) => p.split(path.sep).join('/'));
    expect(all.sort()).toEqual(['manifest.json', m.database.path, ...m.files.map((f) => f.path)].sort());
  }
}

function integrity(dbFile: string): string {
  const db = new Database(dbFile, { readonly: true, fileMustExist: true });
  try {
    return String(db.pragma('integrity_check', { simple: true }));
  } finally {
    db.close();
  }
}

/** A small JPEG of one colour (each write a different file). */
const smallJpeg = (i: number) => sharp({ create: { width: 48, height: 32, channels: 3, background: { r: (i * 37) % 256, g: (i * 91) % 256, b: (i * 53) % 256 } } }).jpeg().toBuffer();

/** The app on an existing DATA_DIR (a restored one), not seeded, signed in as the owner. */
async function startOn(dataDir: string): Promise<{ g: GrisailleApp; owner: ReturnType<typeof request.agent> }> {
  copyRunUpsampleTable(dataDir);
  const g = await createApp({ env: { dataDir, demo: true, nodeEnv: 'test', authRateLimit: 10_000, writeRateLimit: 100_000, publicUrl: 'http://localhost:5178' }, seed: false, serveClient: false });
  const owner = request.agent(g.app);
  const c = await owner.get('/api/auth/csrf');
  owner.set('X-CSRF-Token', c.body.csrfToken);
  const r = await owner.post('/api/auth/sign-in').send({ email: OWNER, password: DEMO_PASSWORD });
  expect(r.status).toBe(200);
  owner.set('X-CSRF-Token', r.body.csrfToken);
  return { g, owner };
}

/** Waits until `ok()` holds, failing on a writer's error or after `ms`. */
async function until(ok: () => boolean, failed: () => unknown, ms = 60_000): Promise<void> {
  const end = Date.now() + ms;
  while (!ok()) {
    if (failed()) throw failed();
    if (Date.now() > end) throw new Error('timed out waiting for writes');
    await new Promise((r) => setTimeout(r, 20));
  }
}

/** A write the app answered with success: what it was and what should come back after a restore. */
interface Ack {
  kind: 'swatch' | 'photo';
  id: number;
  name: string;
  /** sha256 of the uploaded photo */
  sha?: string;
}

let t: TestApp;
let owner: Agent;
let base: string;
/** the backup taken under writes, made by the first test and reused by the refusal tests */
let backupDir = '';

beforeAll(async () => {
  t = await startTestApp();
  owner = await t.agent(OWNER);
  base = `/api/productions/${t.demoProductionId}`;
});
afterAll(async () => {
  await t?.close();
  for (const d of temps) fs.rmSync(d, { recursive: true, force: true });
});

describe('a backup taken while the app takes writes', () => {
  it('restores every write acknowledged before it began, photos with their files; the manifest checksums hold', { timeout: 180_000 }, async () => {
    const acks: Ack[] = [];
    const state: { stop: boolean; error: unknown } = { stop: false, error: null };
    const swatchWriter = async (w: number) => {
      for (let i = 0; !state.stop; i++) {
        const name = `Backup test swatch ${w}.${i}`;
        const hex = `#${crypto.randomBytes(3).toString('hex')}`;
        const r = await owner.post(`${base}/swatches`).send({ name, origin: { type: 'colour', colour: { space: 'hex', hex } } });
        if (r.status !== 201) throw new Error(`swatch write answered ${r.status}: ${JSON.stringify(r.body)}`);
        acks.push({ kind: 'swatch', id: r.body.swatch.id, name });
      }
    };
    const photoWriter = async () => {
      for (let i = 0; !state.stop; i++) {
        const buf = await smallJpeg(i);
        const r = await owner.post(`${base}/photos`).attach('file', buf, `backup-test-${i}.jpg`);
        if (r.status !== 201) throw new Error(`photo upload answered ${r.status}: ${JSON.stringify(r.body)}`);
        acks.push({ kind: 'photo', id: r.body.photo.id, name: r.body.photo.name, sha: crypto.createHash('sha256').update(buf).digest('hex') });
      }
    };
    const writers = [swatchWriter(1), swatchWriter(2), photoWriter()].map((p) => p.catch((e) => (state.error = e)));
    await until(() => acks.length >= 12 && acks.filter((a) => a.kind === 'photo').length >= 3, () => state.error);

    const before = acks.slice(); // acknowledged before the backup began
    backupDir = freshPath('backup');
    const run = await runScript('backup', backupDir, t.dataDir);
    const during = acks.length - before.length;
    state.stop = true;
    await Promise.all(writers);
    expect(state.error).toBeNull();
    expect(run.err).toBe('');
    expect(run.code).toBe(0);
    expect(run.out).toMatch(/^Backup written to /);
    // the writes really overlapped the backup (a count, not a timing)
    expect(during).toBeGreaterThan(0);
    console.log(`backup under writes: ${before.length} writes acknowledged before it began (${before.filter((a) => a.kind === 'photo').length} photos), ${during} during it`);

    // the backup: private modes, every checksum, nothing unlisted, a sound database whose every photo has its files
    const m = readManifest(backupDir);
    expect(fs.statSync(backupDir).mode & 0o777).toBe(0o700);
    expect(fs.statSync(path.join(backupDir, 'app.sqlite')).mode & 0o777).toBe(0o600);
    expectMatchesManifest(backupDir, m, true);
    expect(integrity(path.join(backupDir, 'app.sqlite'))).toBe('ok');
    expect(m.files).toHaveLength(3 * m.database.photos);
    expect(m.photosWithoutFiles).toEqual([]);
    expect(m.skipped.map((s) => s.path)).toEqual(expect.arrayContaining(['cache/', 'uploads/.incoming/']));
    expect(fs.readdirSync(path.dirname(backupDir))).toEqual(['backup']); // no temporary folder left beside it

    // restore into a fresh DATA_DIR with the script, check it, then start the app on it
    const restored = freshPath('restored');
    const back = await runScript('restore', backupDir, restored);
    expect(back.err).toBe('');
    expect(back.code).toBe(0);
    expect(back.out).toMatch(/every checksum matched/);
    expectMatchesManifest(restored, m, false);
    expect(integrity(path.join(restored, 'app.sqlite'))).toBe('ok');
    expect(fs.readdirSync(restored).filter((n) => n.startsWith('.'))).toEqual([]); // no stage left, nothing to keep aside

    const { g, owner: again } = await startOn(restored);
    try {
      const swatches = (await again.get(`${base}/swatches`)).body.swatches as { id: number; name: string }[];
      const byId = new Map(swatches.map((s) => [s.id, s.name]));
      for (const a of before.filter((x) => x.kind === 'swatch')) expect(byId.get(a.id), a.name).toBe(a.name);
      const photos = (await again.get(`${base}/photos`)).body.photos as { id: number; urls: Record<'original' | 'preview' | 'thumb', string> }[];
      const photoById = new Map(photos.map((p) => [p.id, p]));
      for (const a of before.filter((x) => x.kind === 'photo')) {
        const p = photoById.get(a.id);
        expect(p, `photo ${a.id}`).toBeDefined();
        for (const which of ['original', 'preview', 'thumb'] as const) {
          const r = await again.get(p!.urls[which]).buffer(true).parse(binary);
          expect(r.status, `${which} of photo ${a.id}`).toBe(200);
          if (which === 'original') expect(crypto.createHash('sha256').update(r.body as Buffer).digest('hex')).toBe(a.sha);
        }
      }
    } finally {
      await g.close();
    }
  });
});

describe('photos whose files go missing', () => {
  it('a photo deleted while the backup copies files is left out, row and files; one missing its files already is kept and reported', { timeout: 120_000 }, async () => {
    const keyOf = async (id: number) => ((await t.ctx.ds.query('SELECT storageKey FROM photos WHERE id = ?', [id])) as { storageKey: string }[])[0].storageKey;
    const up = async (i: number) => (await owner.post(`${base}/photos`).attach('file', await smallJpeg(100 + i), `gone-${i}.jpg`)).body.photo.id as number;
    const deleted = await up(1);
    const bare = await up(2);
    const deletedKey = await keyOf(deleted);
    const bareKey = await keyOf(bare);
    fs.rmSync(path.join(t.dataDir, 'uploads', 'photos', bareKey), { recursive: true }); // damaged before the backup

    const dir = freshPath('backup-race');
    const { manifest: m } = await makeBackup(t.dataDir, dir, {
      // the database copy has the photo; the owner deletes it before its files are copied
      afterDatabaseCopy: async () => expect((await owner.delete(`${base}/photos/${deleted}`)).status).toBe(204),
    });
    expect(m.photosLeftOut).toEqual([{ id: deleted, storageKey: deletedKey }]);
    expect(m.photosWithoutFiles).toEqual([{ id: bare, storageKey: bareKey, missing: ['original.jpg', 'preview.jpg', 'thumb.jpg'] }]);
    const db = new Database(path.join(dir, 'app.sqlite'), { readonly: true });
    try {
      expect(db.prepare('SELECT id FROM photos WHERE id IN (?, ?)').all(deleted, bare)).toEqual([{ id: bare }]);
    } finally {
      db.close();
    }
    expect(fs.existsSync(path.join(dir, 'uploads', 'photos', deletedKey))).toBe(false);
    expectMatchesManifest(dir, m, true);

    const back = await runScript('restore', dir, freshPath('restored-race'));
    expect(back.code).toBe(0);
    expect(back.out).toMatch(/Warning: 1 photo\(s\) in the database have no files in the backup/);
    await t.ctx.ds.query('DELETE FROM photos WHERE id = ?', [bare]); // leave the live data sound for the other tests
  });
});

describe('refusals', () => {
  it('backup refuses a folder that is not empty, and writes nothing there or beside it', async () => {
    const dir = freshPath('not-empty');
    fs.mkdirSync(dir);
    fs.writeFileSync(path.join(dir, 'keep.txt'), 'mine');
    const run = await runScript('backup', dir, t.dataDir);
    expect(run.code).toBe(1);
    expect(run.err).toMatch(/is not empty\. Give a new or empty folder/);
    expect(fs.readdirSync(dir)).toEqual(['keep.txt']);
    expect(fs.readdirSync(path.dirname(dir))).toEqual(['not-empty']);
  });

  it('restore refuses while the pid file names a live process; a stale one (a killed server) does not stop it; the previous data is kept aside', async () => {
    expect(backupDir).not.toBe('');
    const dataDir = tempDir('data');
    const renders = path.join(dataDir, 'cache', 'photo-renders', 'a'.repeat(32));
    fs.mkdirSync(renders, { recursive: true });
    fs.writeFileSync(path.join(renders, 'r.jpg'), 'render');
    fs.writeFileSync(path.join(dataDir, 'app.sqlite'), 'previous database');
    fs.writeFileSync(path.join(dataDir, 'app.sqlite-wal'), 'previous log');
    fs.writeFileSync(serverPidFile(dataDir), `${process.pid}\n`); // this test's process: alive

    const refused = await runScript('restore', backupDir, dataDir);
    expect(refused.code).toBe(1);
    expect(refused.err).toMatch(new RegExp(`The server is running on .* \\(process ${process.pid}, from .*server\\.pid\\)\\. Stop it first`));
    expect(fs.readFileSync(path.join(dataDir, 'app.sqlite'), 'utf8')).toBe('previous database');
    expect(fs.readdirSync(dataDir).filter((n) => n.startsWith('.'))).toEqual([]);

    // a process that has ended: its pid file is stale
    const dead = spawn(process.execPath, ['-e', '']);
    await new Promise((r) => dead.on('close', r));
    fs.writeFileSync(serverPidFile(dataDir), `${dead.pid}\n`);
    const run = await runScript('restore', backupDir, dataDir);
    expect(run.err).toBe('');
    expect(run.code).toBe(0);
    const aside = fs.readdirSync(dataDir).filter((n) => n.startsWith('.before-restore-'));
    expect(aside).toHaveLength(1);
    expect(run.out).toContain(path.join(dataDir, aside[0]));
    expect(fs.readFileSync(path.join(dataDir, aside[0], 'app.sqlite'), 'utf8')).toBe('previous database');
    expect(fs.readFileSync(path.join(dataDir, aside[0], 'app.sqlite-wal'), 'utf8')).toBe('previous log');
    expect(fs.existsSync(path.join(dataDir, 'app.sqlite-wal'))).toBe(false); // the old log is not replayed into the restored database
    expect(fs.existsSync(path.join(dataDir, 'cache', 'photo-renders'))).toBe(false);
    expect(integrity(path.join(dataDir, 'app.sqlite'))).toBe('ok');
  });

  it('the server leaves DATA_DIR/server.pid while it runs (restore refuses) and removes it when stopped', { timeout: 120_000 }, async () => {
    const dataDir = tempDir('server');
    copyRunUpsampleTable(dataDir);
    const env = { ...process.env, DATA_DIR: dataDir, PORT: '0', GRISAILLE_DEMO: 'false', SESSION_SECRET: crypto.randomBytes(32).toString('hex'), NODE_ENV: 'test' };
    const server = spawn(process.execPath, ['--import', 'tsx', path.join(ROOT, 'server', 'index.ts')], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
    let err = '';
    server.stderr.on('data', (d) => (err += d));
    const exited = new Promise<number | null>((r) => server.on('close', r));
    try {
      const pidFile = serverPidFile(dataDir);
      const end = Date.now() + CHILD_TIMEOUT_MS;
      while (!fs.existsSync(pidFile) && server.exitCode === null && Date.now() < end) await new Promise((r) => setTimeout(r, 50));
      expect(fs.existsSync(pidFile), `server did not start: ${err}`).toBe(true);
      expect(Number(fs.readFileSync(pidFile, 'utf8'))).toBe(server.pid);
      const refused = await runScript('restore', backupDir, dataDir);
      expect(refused.code).toBe(1);
      expect(refused.err).toMatch(/The server is running on/);
      server.kill('SIGTERM');
      expect(await exited).toBe(0);
      expect(fs.existsSync(pidFile)).toBe(false);
    } finally {
      if (server.exitCode === null) server.kill('SIGKILL');
    }
  });

  it('restore refuses a backup whose file was changed (checksum), and changes nothing', async () => {
    const m = readManifest(backupDir);
    for (const rel of [m.files[0].path, 'app.sqlite']) {
      const copy = freshPath('tampered');
      fs.cpSync(backupDir, copy, { recursive: true });
      const file = path.join(copy, rel);
      const bytes = fs.readFileSync(file);
      bytes[bytes.length >> 1] ^= 0xff; // same size, one byte changed
      fs.writeFileSync(file, bytes);
      const dataDir = tempDir('data');
      const run = await runScript('restore', copy, dataDir);
      expect(run.code).toBe(1);
      expect(run.err).toContain(`Checksum mismatch for ${rel}`);
      expect(fs.readdirSync(dataDir)).toEqual([]); // nothing restored, no stage left
    }
  });

  it('restore refuses, with a message saying why, a folder that is not a backup or a manifest it cannot trust', async () => {
    const m = readManifest(backupDir);
    const variant = (label: string, change: (dir: string) => void) => {
      const dir = freshPath(label);
      fs.cpSync(backupDir, dir, { recursive: true });
      change(dir);
      return dir;
    };
    const writeManifest = (dir: string, mm: unknown) => fs.writeFileSync(path.join(dir, 'manifest.json'), JSON.stringify(mm));
    const cases: [string, string, RegExp][] = [
      ['nowhere', freshPath('missing'), /There is no backup folder at/],
      ['empty', tempDir('empty'), /has no manifest\.json: it is not a backup made by "npm run backup"/],
      ['bad JSON', variant('bad-json', (d) => fs.writeFileSync(path.join(d, 'manifest.json'), '{"format":')), /manifest\.json is not valid JSON/],
      ['not a manifest', variant('not-manifest', (d) => writeManifest(d, { hello: 1 })), /is not a Grisaille backup manifest \(format:/],
      ['a path outside the layout', variant('escape', (d) => writeManifest(d, { ...m, files: [{ ...m.files[0], path: '../../outside.txt' }] })), /lists "\.\.\/\.\.\/outside\.txt", which is not a photo file of a backup/],
      ['a newer version', variant('newer', (d) => writeManifest(d, { ...m, database: { ...m.database, migrations: [...m.database.migrations, { timestamp: 9999999999999, name: 'Future9999999999999' }] } })), /migrations this version of the app does not know \(Future9999999999999\)/],
    ];
    const runs = await Promise.all(cases.map(async ([, dir]) => runScript('restore', dir, tempDir('data'))));
    runs.forEach((run, i) => {
      expect(run.code, cases[i][0]).toBe(1);
      expect(run.err, cases[i][0]).toMatch(cases[i][2]);
    });
  });
});
