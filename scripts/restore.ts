/**
 * `npm run restore -- DIR`: puts a backup made by `npm run backup -- DIR` (scripts/backup.ts) back into
 * DATA_DIR, with the server stopped.
 *
 * 1. Refuses while a server runs on DATA_DIR (its DATA_DIR/server.pid names a live process): swapping the
 *    database under an open connection would lose writes or corrupt it.
 * 2. Reads manifest.json and refuses a folder that is not a backup, a manifest it does not understand, a
 *    path outside the backup's layout, or migrations this version of the app does not know (a backup from a
 *    newer version).
 * 3. Stages the backup in DATA_DIR/.restore-<time> (same file system, so the moves below are renames),
 *    checking every staged file's size and sha256 against the manifest and running SQLite's
 *    `PRAGMA integrity_check` on the staged database. Any mismatch stops here with nothing changed.
 * 4. Moves the current app.sqlite (with its -wal/-shm, so the old state stays whole) and uploads/photos
 *    aside to DATA_DIR/.before-restore-<time> (kept; delete it once the restored app looks right), renames
 *    the staged ones into place, and clears the cached renders. If a rename fails, the moves are undone.
 */
import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { loadEnv } from '../server/env';
import {
  BACKUP_FORMAT_VERSION, BackupError, DB_FILE, MANIFEST_FILE, PHOTOS_DIR, RENDERS_DIR, backupManifestSchema, describeError,
  formatBytes, fsyncPath, isPhotoFilePath, runningServerPid, serverPidFile, sha256File, type BackupFileEntry, type BackupManifest,
} from '../server/services/backup';

/** Refuses while a server runs on `dataDir`. */
function assertServerStopped(dataDir: string): void {
  const pid = runningServerPid(dataDir);
  if (pid !== null) {
    throw new BackupError(`The server is running on ${dataDir} (process ${pid}, from ${serverPidFile(dataDir)}). Stop it first, then restore. If no server is running there, delete that file.`);
  }
}

/** Reads and checks DIR/manifest.json. */
function readManifest(dir: string): BackupManifest {
  if (!fs.existsSync(dir) || !fs.statSync(dir).isDirectory()) throw new BackupError(`There is no backup folder at ${dir}.`);
  const file = path.join(dir, MANIFEST_FILE);
  if (!fs.existsSync(file)) throw new BackupError(`${dir} has no ${MANIFEST_FILE}: it is not a backup made by "npm run backup".`);
  let json: unknown;
  try {
    json = JSON.parse(fs.readFileSync(file, 'utf8'));
  } catch (e) {
    throw new BackupError(`${file} is not valid JSON (${(e as Error).message}); the backup is damaged.`);
  }
  const version = (json as { formatVersion?: unknown } | null)?.formatVersion;
  if (typeof version === 'number' && version > BACKUP_FORMAT_VERSION) {
    throw new BackupError(`This backup has format ${version}, made by a newer version of the app; this one reads format ${BACKUP_FORMAT_VERSION}. Restore it with the newer version.`);
  }
  const parsed = backupManifestSchema.safeParse(json);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new BackupError(`${file} is not a Grisaille backup manifest (${issue.path.join('.') || 'top level'}: ${issue.message}).`);
  }
  const m = parsed.data;
  const bad = m.files.find((f) => !isPhotoFilePath(f.path));
  if (bad) throw new BackupError(`${file} lists "${bad.path}", which is not a photo file of a backup; refusing to restore it.`);
  return m;
}

/** Refuses a backup whose database has migrations this code does not have (a backup from a newer version). */
function assertKnownMigrations(m: BackupManifest): void {
  // The migration files are named <timestamp>-<name>.ts (server/db/migrations); reading the folder avoids loading TypeORM.
  const dir = path.join(import.meta.dirname, '..', 'server', 'db', 'migrations');
  const known = new Set(fs.readdirSync(dir).map((f) => Number(f.split('-')[0])));
  const unknown = m.database.migrations.filter((x) => !known.has(Number(x.timestamp)));
  if (unknown.length) {
    throw new BackupError(`The backup's database has migrations this version of the app does not know (${unknown.map((x) => x.name).join(', ')}), so it was made by a newer version (${m.appVersion}). Restore it with that version.`);
  }
}

/** Copies one file of the backup into the stage and checks the copy against the manifest. */
async function stageFile(dir: string, stage: string, entry: BackupFileEntry): Promise<void> {
  const from = path.join(dir, ...entry.path.split('/'));
  const to = path.join(stage, ...entry.path.split('/'));
  if (!fs.existsSync(from)) throw new BackupError(`The backup lacks ${entry.path}, which its manifest lists; the backup is incomplete.`);
  fs.mkdirSync(path.dirname(to), { recursive: true, mode: 0o700 });
  fs.copyFileSync(from, to, fs.constants.COPYFILE_EXCL);
  fs.chmodSync(to, 0o600);
  fsyncPath(to);
  const bytes = fs.statSync(to).size;
  const sha = await sha256File(to);
  if (bytes !== entry.bytes || sha !== entry.sha256) {
    throw new BackupError(`Checksum mismatch for ${entry.path}: the manifest says ${entry.bytes} bytes, sha256 ${entry.sha256}; the file has ${bytes} bytes, sha256 ${sha}. The backup was changed or damaged after it was made.`);
  }
}

/** Stages and checks the whole backup; answers warnings for the person restoring. */
async function stageBackup(dir: string, stage: string, m: BackupManifest): Promise<string[]> {
  await stageFile(dir, stage, m.database);
  for (const f of m.files) await stageFile(dir, stage, f);
  fs.mkdirSync(path.join(stage, PHOTOS_DIR), { recursive: true, mode: 0o700 });
  const db = new Database(path.join(stage, DB_FILE), { readonly: true, fileMustExist: true });
  try {
    const check = db.pragma('integrity_check', { simple: true });
    if (check !== 'ok') throw new BackupError(`The backup's database fails SQLite's integrity check (${String(check)}).`);
    const keys = (db.prepare('SELECT storageKey FROM photos').all() as { storageKey: string }[]).map((r) => r.storageKey);
    const withFiles = new Set(m.files.map((f) => f.path.split('/')[2]));
    const bare = keys.filter((k) => !withFiles.has(k)).length;
    return bare ? [`Warning: ${bare} photo(s) in the database have no files in the backup (their files were already missing when it was made); they will show as missing.`] : [];
  } finally {
    db.close();
  }
}

/** One rename of the swap, remembered so it can be undone. */
interface Move {
  from: string;
  to: string;
}

function move(from: string, to: string, done: Move[]): void {
  fs.mkdirSync(path.dirname(to), { recursive: true, mode: 0o700 });
  fs.renameSync(from, to);
  done.push({ from, to });
}

/** Moves the current data aside and the staged data into place; undoes the moves when one fails. */
function swapIn(dataDir: string, stage: string, aside: string): boolean {
  const done: Move[] = [];
  const current = [DB_FILE, `${DB_FILE}-wal`, `${DB_FILE}-shm`, PHOTOS_DIR].filter((p) => fs.existsSync(path.join(dataDir, p)));
  try {
    for (const p of current) move(path.join(dataDir, p), path.join(aside, p), done);
    for (const p of [DB_FILE, PHOTOS_DIR]) move(path.join(stage, p), path.join(dataDir, p), done);
  } catch (e) {
    for (const m of done.reverse()) fs.renameSync(m.to, m.from);
    throw new BackupError(`Could not put the backup in place (${(e as Error).message}); the previous data was put back.`);
  }
  return current.length > 0;
}

async function main(): Promise<void> {
  const arg = process.argv[2];
  if (!arg) throw new BackupError('Usage: npm run restore -- DIR   (DIR: a folder made by "npm run backup"; stop the server first)');
  const dir = path.resolve(arg);
  const { dataDir } = loadEnv();
  assertServerStopped(dataDir);
  const m = readManifest(dir);
  assertKnownMigrations(m);

  fs.mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  const stamp = new Date().toISOString().replace(/[:.]/g, '-');
  const stage = path.join(dataDir, `.restore-${stamp}`);
  const aside = path.join(dataDir, `.before-restore-${stamp}`);
  fs.mkdirSync(stage, { mode: 0o700 });
  const onSignal = (sig: NodeJS.Signals) => {
    fs.rmSync(stage, { recursive: true, force: true });
    console.error(`Restore interrupted (${sig}) before anything was replaced; ${dataDir} is as it was.`);
    process.exit(1);
  };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  try {
    const warnings = await stageBackup(dir, stage, m);
    assertServerStopped(dataDir); // again: staging a large backup takes a while
    const movedAside = swapIn(dataDir, stage, aside);
    for (const d of [dataDir, path.join(dataDir, 'uploads')]) fsyncPath(d); // the renames, on disk
    fs.rmSync(path.join(dataDir, RENDERS_DIR), { recursive: true, force: true }); // cached renders of the replaced photos
    const bytes = m.database.bytes + m.files.reduce((s, f) => s + f.bytes, 0);
    console.log(`Restored the backup of ${m.createdAt} (app ${m.appVersion}) from ${dir} into ${dataDir}: ${m.database.photos} photos, ${m.files.length} photo files, ${formatBytes(bytes)}; every checksum matched and the database passed its integrity check.`);
    console.log(movedAside ? `The previous data is kept in ${aside}; delete it once the restored app looks right.` : 'There was no previous data to keep.');
    for (const w of warnings) console.log(w);
  } finally {
    fs.rmSync(stage, { recursive: true, force: true });
  }
}

try {
  await main();
} catch (e) {
  console.error(`Restore failed: ${describeError(e)}`);
  process.exitCode = 1;
}
