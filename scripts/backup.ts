/**
 * `npm run backup -- DIR`: a consistent copy of DATA_DIR's database and photos into DIR (new or empty), taken
 * while the app runs. Restore it with `npm run restore -- DIR` (scripts/restore.ts).
 *
 * 1. The database: SQLite's online backup API (better-sqlite3 `db.backup`) from a connection that only reads, all
 *    pages in one step, so the copy is one read transaction — a snapshot in which every write committed
 *    before it is present and none after it is half-present. In WAL mode readers do not block the server's
 *    writers, so the app keeps answering. (sqlite.org/backup.html; sqlite.org/wal.html §2.2)
 * 2. The photos: the directories the COPY's photos table names, so files and rows agree. The app writes a
 *    photo's directory (atomic rename) before its row, never changes it, and deletes the row before the
 *    files; so every row of the snapshot had its files when the snapshot was taken, and a directory can
 *    only vanish afterwards if its row was deleted after the snapshot. Such a photo is checked against the
 *    live database: gone there too → deleted while the backup ran, so its row is deleted from the copy as
 *    well (with the same foreign-key cascades the app's delete applied) and listed in the manifest as left
 *    out; still there → its files were missing before the backup began, the row is kept and the manifest
 *    lists it. Either way a restored row never points at files that are silently absent.
 * 3. manifest.json: sizes and sha256 of every file, the migrations, what was skipped and why.
 *
 * Everything is written into a temporary folder beside DIR (mode 0700, files 0600) and renamed into place
 * at the end, so an interrupted backup leaves no half-written DIR; the temporary folder is removed on error.
 */
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import Database from 'better-sqlite3';
import { loadEnv } from '../server/env';
import { EXTENSIONS } from '../server/modules/photos/photo-storage';
import type { PhotoFormat } from '../shared/schemas/photo';
import {
  BACKUP_FORMAT_VERSION, BackupError, DB_FILE, MANIFEST_FILE, PHOTOS_DIR, STORAGE_KEY, describeError, formatBytes, fsyncPath,
  photoFilePath, sha256File, type BackupFileEntry, type BackupManifest,
} from '../server/services/backup';

/** Pages per backup step: all of them, so the copy is taken in one read transaction (see above). */
const ALL_PAGES = 0x7fffffff;

type Skipped = BackupManifest['skipped'];

function appVersion(): string {
  return JSON.parse(fs.readFileSync(path.join(import.meta.dirname, '..', 'package.json'), 'utf8')).version;
}

/** Resolves DIR and refuses one that exists and is not an empty folder, or lies inside DATA_DIR. */
function checkTarget(arg: string | undefined, dataDir: string): string {
  if (!arg) throw new BackupError('Usage: npm run backup -- DIR   (DIR: a new or empty folder for the backup)');
  const dir = path.resolve(arg);
  const rel = path.relative(dataDir, dir);
  if (!rel.startsWith('..') && !path.isAbsolute(rel)) {
    throw new BackupError(`${dir} is inside DATA_DIR (${dataDir}). Put the backup outside it: a restore replaces parts of DATA_DIR, and a backup should survive losing it.`);
  }
  if (fs.existsSync(dir)) {
    if (!fs.statSync(dir).isDirectory()) throw new BackupError(`${dir} exists and is not a folder. Give a new or empty folder.`);
    if (fs.readdirSync(dir).length > 0) throw new BackupError(`${dir} is not empty. Give a new or empty folder, so no earlier backup is overwritten.`);
  }
  return dir;
}

/** The database: the online backup into `to`, then a self-contained file (rollback journal, no -wal beside it). */
async function copyDatabase(live: Database.Database, to: string): Promise<void> {
  await live.backup(to, { progress: () => ALL_PAGES });
  const copy = new Database(to);
  try {
    copy.pragma('journal_mode = DELETE');
  } finally {
    copy.close();
  }
}

interface PhotoCopyResult {
  files: BackupFileEntry[];
  leftOut: BackupManifest['photosLeftOut'];
  withoutFiles: BackupManifest['photosWithoutFiles'];
}

/** Copies one file into the backup (mode 0600, flushed) and answers its manifest entry. */
async function copyFile(from: string, to: string, rel: string): Promise<BackupFileEntry> {
  fs.copyFileSync(from, to, fs.constants.COPYFILE_EXCL);
  fs.chmodSync(to, 0o600);
  fsyncPath(to);
  return { path: rel, bytes: fs.statSync(to).size, sha256: await sha256File(to) };
}

/** Copies the files of every photo the copy names (see the comment at the top for a directory that vanished). */
async function copyPhotos(dataDir: string, tmp: string, copy: Database.Database, live: Database.Database): Promise<PhotoCopyResult> {
  const rows = copy.prepare('SELECT id, storageKey, format FROM photos ORDER BY id').all() as { id: number; storageKey: string; format: PhotoFormat }[];
  const stillLive = live.prepare('SELECT 1 FROM photos WHERE storageKey = ?');
  const out: PhotoCopyResult = { files: [], leftOut: [], withoutFiles: [] };
  for (const { id, storageKey, format } of rows) {
    if (!STORAGE_KEY.test(storageKey)) throw new BackupError(`Photo ${id} has the storage key "${storageKey}", which is not one the app makes; the database may be damaged.`);
    const names = [`original.${EXTENSIONS[format] ?? format}`, 'preview.jpg', 'thumb.jpg'];
    const src = path.join(dataDir, PHOTOS_DIR, storageKey);
    const dst = path.join(tmp, PHOTOS_DIR, storageKey);
    fs.mkdirSync(dst, { recursive: true, mode: 0o700 });
    const copied: BackupFileEntry[] = [];
    const missing: string[] = [];
    for (const name of names) {
      try {
        copied.push(await copyFile(path.join(src, name), path.join(dst, name), photoFilePath(storageKey, name)));
      } catch (e) {
        if ((e as NodeJS.ErrnoException).code !== 'ENOENT') throw e;
        missing.push(name);
      }
    }
    if (missing.length > 0 && !stillLive.get(storageKey)) {
      // deleted while we copied: leave it out of the copy as the app left it out of the live data
      fs.rmSync(dst, { recursive: true, force: true });
      copy.prepare('DELETE FROM photos WHERE storageKey = ?').run(storageKey);
      out.leftOut.push({ id, storageKey });
      continue;
    }
    if (missing.length > 0) out.withoutFiles.push({ id, storageKey, missing });
    out.files.push(...copied);
  }
  return out;
}

/** What of DATA_DIR is not in the backup, and why (the manifest's `skipped`). */
function skippedEntries(dataDir: string, namedKeys: Set<string>): Skipped {
  const skipped: Skipped = [];
  const list = (d: string) => (fs.existsSync(d) ? fs.readdirSync(d) : []);
  for (const name of list(dataDir)) {
    if (name === DB_FILE || name === 'uploads') continue;
    if (name === `${DB_FILE}-wal` || name === `${DB_FILE}-shm`) skipped.push({ path: name, reason: 'folded into the database copy (the online backup reads through the write-ahead log)' });
    else if (name === 'cache') skipped.push({ path: 'cache/', reason: 'rebuildable: rendered photos and computed tables are made again when needed' });
    else if (name === 'server.pid') skipped.push({ path: name, reason: "the running server's marker" });
    else if (name.startsWith('.before-restore-')) skipped.push({ path: `${name}/`, reason: 'data an earlier restore moved aside' });
    else if (name.startsWith('.restore-')) skipped.push({ path: `${name}/`, reason: 'an unfinished restore' });
    else skipped.push({ path: name, reason: 'not written by the app (e.g. the published tables shipped with the code when DATA_DIR is ./data)' });
  }
  for (const name of list(path.join(dataDir, 'uploads'))) {
    if (name === 'photos') continue;
    if (name === '.incoming') skipped.push({ path: 'uploads/.incoming/', reason: 'uploads in flight, not yet acknowledged', count: list(path.join(dataDir, 'uploads', name)).length });
    else skipped.push({ path: `uploads/${name}`, reason: 'not a photo folder' });
  }
  const dirs = list(path.join(dataDir, PHOTOS_DIR));
  const staging = dirs.filter((n) => n.startsWith('.staging-')).length;
  const unnamed = dirs.filter((n) => STORAGE_KEY.test(n) && !namedKeys.has(n)).length;
  const other = dirs.filter((n) => !n.startsWith('.staging-') && !STORAGE_KEY.test(n)).length;
  if (staging) skipped.push({ path: 'uploads/photos/.staging-*/', reason: 'uploads in flight, not yet acknowledged', count: staging });
  if (unnamed) skipped.push({ path: 'uploads/photos/<storageKey>/', reason: 'photo folders the database copy does not name (an upload that finished after the copy was taken, or a leftover)', count: unnamed });
  if (other) skipped.push({ path: 'uploads/photos/*', reason: 'not a photo folder', count: other });
  return skipped;
}

/** Test seams: called between steps so a test can write at exactly that moment (the CLI passes none). */
export interface BackupHooks {
  /** after the database copy is taken, before any photo file is copied */
  afterDatabaseCopy?: () => Promise<void>;
}

/** Makes the backup in `tmp` (beside DIR) and answers its manifest. */
async function writeBackup(dataDir: string, tmp: string, hooks: BackupHooks): Promise<BackupManifest> {
  const dbFile = path.join(dataDir, DB_FILE);
  if (!fs.existsSync(dbFile)) throw new BackupError(`There is no database at ${dbFile}. Is DATA_DIR right? (It is ${dataDir}.)`);
  const live = new Database(dbFile, { fileMustExist: true }); // read-write but only read: a read-only connection would leave an empty -wal and -shm behind
  try {
    live.pragma('busy_timeout = 5000');
    const tmpDb = path.join(tmp, DB_FILE);
    await copyDatabase(live, tmpDb);
    const createdAt = new Date().toISOString();
    await hooks.afterDatabaseCopy?.();
    const copy = new Database(tmpDb);
    let photos: PhotoCopyResult;
    let migrations: BackupManifest['database']['migrations'];
    let photoCount: number;
    try {
      copy.pragma('foreign_keys = ON');
      migrations = copy.prepare('SELECT timestamp, name FROM migrations ORDER BY id').all() as typeof migrations;
      photos = await copyPhotos(dataDir, tmp, copy, live);
      const check = copy.pragma('integrity_check', { simple: true });
      if (check !== 'ok') throw new BackupError(`The database copy fails SQLite's integrity check (${String(check)}); the live database may be damaged.`);
      photoCount = (copy.prepare('SELECT count(*) AS n FROM photos').get() as { n: number }).n;
    } finally {
      copy.close();
    }
    fs.chmodSync(tmpDb, 0o600);
    fsyncPath(tmpDb);
    const namedKeys = new Set(photos.files.map((f) => f.path.split('/')[2]));
    return {
      format: 'grisaille-backup',
      formatVersion: BACKUP_FORMAT_VERSION,
      appVersion: appVersion(),
      createdAt,
      database: { path: DB_FILE, bytes: fs.statSync(tmpDb).size, sha256: await sha256File(tmpDb), migrations, photos: photoCount },
      files: photos.files,
      photosLeftOut: photos.leftOut,
      photosWithoutFiles: photos.withoutFiles,
      skipped: skippedEntries(dataDir, namedKeys),
    };
  } finally {
    live.close();
  }
}

/** The summary printed at the end. */
function summary(dir: string, m: BackupManifest, ms: number): string {
  const bytes = m.database.bytes + m.files.reduce((s, f) => s + f.bytes, 0);
  const lines = [
    `Backup written to ${dir} in ${(ms / 1000).toFixed(1)} s: the database (${formatBytes(m.database.bytes)}, ${m.database.migrations.length} migrations, ${m.database.photos} photos) and ${m.files.length} photo files; ${formatBytes(bytes)} in all.`,
  ];
  if (m.photosLeftOut.length) lines.push(`${m.photosLeftOut.length} photo(s) deleted while the backup ran were left out.`);
  if (m.photosWithoutFiles.length) lines.push(`Warning: ${m.photosWithoutFiles.length} photo(s) were already missing files in DATA_DIR (listed in ${MANIFEST_FILE}).`);
  lines.push(`Not copied: ${m.skipped.map((s) => `${s.path}${s.count ? ` (${s.count})` : ''}`).join(', ') || 'nothing'} (reasons in ${MANIFEST_FILE}).`);
  return lines.join('\n');
}

/**
 * Backs up `dataDir` into `target` (a new or empty folder outside it): the whole of what the comment at the
 * top describes. Answers the folder and its manifest; throws BackupError with a message for a person.
 */
export async function makeBackup(dataDir: string, target: string | undefined, hooks: BackupHooks = {}): Promise<{ dir: string; manifest: BackupManifest; ms: number }> {
  const started = Date.now();
  const dir = checkTarget(target, dataDir);
  fs.mkdirSync(path.dirname(dir), { recursive: true });
  const tmp = fs.mkdtempSync(path.join(path.dirname(dir), `.${path.basename(dir)}.partial-`)); // mode 0700
  const cleanUp = () => fs.rmSync(tmp, { recursive: true, force: true });
  const onSignal = (sig: NodeJS.Signals) => {
    cleanUp();
    console.error(`Backup interrupted (${sig}); nothing was written to ${dir}.`);
    process.exit(1);
  };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  try {
    const manifest = await writeBackup(dataDir, tmp, hooks);
    const mf = path.join(tmp, MANIFEST_FILE);
    fs.writeFileSync(mf, JSON.stringify(manifest, null, 2) + '\n', { mode: 0o600 });
    fsyncPath(mf);
    for (const d of [path.join(tmp, PHOTOS_DIR), path.join(tmp, 'uploads'), tmp]) if (fs.existsSync(d)) fsyncPath(d);
    try {
      fs.renameSync(tmp, dir); // replaces DIR when it is an empty folder
    } catch (e) {
      throw new BackupError(`Could not move the finished backup into ${dir} (${(e as NodeJS.ErrnoException).code ?? e}); was it filled meanwhile? Nothing was written there.`);
    }
    fsyncPath(path.dirname(dir));
    return { dir, manifest, ms: Date.now() - started };
  } catch (e) {
    cleanUp();
    throw e;
  } finally {
    process.off('SIGINT', onSignal);
    process.off('SIGTERM', onSignal);
  }
}

// run as a script (npm run backup -- DIR), not when a test imports makeBackup
if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  try {
    const { dir, manifest, ms } = await makeBackup(loadEnv().dataDir, process.argv[2]);
    console.log(summary(dir, manifest, ms));
  } catch (e) {
    console.error(`Backup failed: ${describeError(e)}`);
    process.exitCode = 1;
  }
}
