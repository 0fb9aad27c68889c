import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

/**
 * What `npm run backup` and `npm run restore` (scripts/backup.ts, scripts/restore.ts) share, and the marker
 * the running server leaves so a restore never swaps the data under it.
 *
 * A backup folder holds `app.sqlite` (a consistent copy of the database), `uploads/photos/<storageKey>/…`
 * (the files of every photo the copy names) and `manifest.json` (BackupManifest: sizes and sha256 of each
 * file, the migrations, what was skipped and why). The layout of DATA_DIR is PhotoStorage's
 * (server/modules/photos/photo-storage.ts); the names below repeat it because services never import modules.
 */

/** The database file in DATA_DIR and in a backup. */
export const DB_FILE = 'app.sqlite';
/** Photo directories, relative to DATA_DIR and to a backup. */
export const PHOTOS_DIR = path.join('uploads', 'photos');
/** Cached renders (rebuildable), relative to DATA_DIR. */
export const RENDERS_DIR = path.join('cache', 'photo-renders');
export const MANIFEST_FILE = 'manifest.json';
/** Bump when the layout of a backup changes; restore refuses a newer format. */
export const BACKUP_FORMAT_VERSION = 1;
/** A photo's storage key (random hex, PhotoStorage.newKey). */
export const STORAGE_KEY = /^[0-9a-f]{32}$/;
/** A file inside a photo directory: original.<ext>, preview.jpg, thumb.jpg (never a dot file, never a path). */
const PHOTO_FILE = /^[a-z0-9][a-z0-9._-]{0,63}$/;

const fileEntry = z.object({
  path: z.string(),
  bytes: z.number().int().nonnegative(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
});

export const backupManifestSchema = z.object({
  format: z.literal('grisaille-backup'),
  formatVersion: z.number().int().positive(),
  appVersion: z.string(),
  createdAt: z.string(),
  database: fileEntry.extend({
    path: z.literal(DB_FILE),
    /** names of the TypeORM migrations applied in the copy, oldest first */
    migrations: z.array(z.object({ timestamp: z.number(), name: z.string() })),
    photos: z.number().int().nonnegative(),
  }),
  /** every other file of the backup (photo files), relative paths with '/' */
  files: z.array(fileEntry),
  /** photos deleted while the backup ran (row gone from the live database, files gone): left out of the copy */
  photosLeftOut: z.array(z.object({ id: z.number(), storageKey: z.string() })),
  /** photos whose files were already missing from DATA_DIR (the row is kept; restore warns) */
  photosWithoutFiles: z.array(z.object({ id: z.number(), storageKey: z.string(), missing: z.array(z.string()) })),
  skipped: z.array(z.object({ path: z.string(), reason: z.string(), count: z.number().int().optional() })),
});
export type BackupManifest = z.infer<typeof backupManifestSchema>;
export type BackupFileEntry = z.infer<typeof fileEntry>;

/** An error a person can act on: the scripts print its message alone and exit with 1. */
export class BackupError extends Error {}

/** The relative path of a photo file in a backup and in DATA_DIR ('/'-separated, as written in the manifest). */
export function photoFilePath(storageKey: string, file: string): string {
  return `uploads/photos/${storageKey}/${file}`;
}

/** True when `rel` names a photo file exactly as a backup stores it, so a tampered manifest cannot point elsewhere. */
export function isPhotoFilePath(rel: string): boolean {
  const parts = rel.split('/');
  return parts.length === 4 && parts[0] === 'uploads' && parts[1] === 'photos' && STORAGE_KEY.test(parts[2]) && PHOTO_FILE.test(parts[3]);
}

/** sha256 of a file, hex, read in a stream (photo originals can be large). */
export async function sha256File(file: string): Promise<string> {
  const h = crypto.createHash('sha256');
  for await (const chunk of fs.createReadStream(file)) h.update(chunk as Buffer);
  return h.digest('hex');
}

/**
 * Flushes a file or directory to disk, so a rename that follows cannot publish unwritten data (common practice
 * for durable writes on POSIX). Some platforms cannot open or flush a directory; that is skipped.
 */
export function fsyncPath(p: string): void {
  let fd: number;
  try {
    fd = fs.openSync(p, 'r');
  } catch (e) {
    if (fs.statSync(p).isDirectory()) return;
    throw e;
  }
  try {
    fs.fsyncSync(fd);
  } catch (e) {
    if (!fs.fstatSync(fd).isDirectory()) throw e;
  } finally {
    fs.closeSync(fd);
  }
}

/** The server's marker in DATA_DIR: its process id while it runs. */
export function serverPidFile(dataDir: string): string {
  return path.join(dataDir, 'server.pid');
}

/**
 * Writes DATA_DIR/server.pid (mode 0600) for a server starting on `dataDir`; answers the function that removes
 * it again (only if it still names this process), for the server to call when it stops.
 */
export function markServerRunning(dataDir: string): () => void {
  const file = serverPidFile(dataDir);
  fs.writeFileSync(file, `${process.pid}\n`, { mode: 0o600 });
  return () => {
    try {
      if (fs.readFileSync(file, 'utf8').trim() === String(process.pid)) fs.rmSync(file, { force: true });
    } catch {
      /* already gone */
    }
  };
}

/**
 * The process id of a server running on `dataDir`, or null. A pid file whose process no longer exists (a
 * server killed with -9, a reboot) is stale and ignored; `process.kill(pid, 0)` tests for the process
 * without signalling it (EPERM: it exists but belongs to another user).
 */
export function runningServerPid(dataDir: string): number | null {
  let text: string;
  try {
    text = fs.readFileSync(serverPidFile(dataDir), 'utf8');
  } catch {
    return null;
  }
  const pid = Number(text.trim());
  if (!Number.isInteger(pid) || pid <= 0) return null;
  try {
    process.kill(pid, 0);
    return pid;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM' ? pid : null;
  }
}

/** Bytes for a person: 1.2 MB. */
export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 ** 2) return `${(n / 1024).toFixed(1)} kB`;
  if (n < 1024 ** 3) return `${(n / 1024 ** 2).toFixed(1)} MB`;
  return `${(n / 1024 ** 3).toFixed(2)} GB`;
}

/** The message of an error for the terminal: a BackupError as it is, anything else with its own text. */
export function describeError(e: unknown): string {
  if (e instanceof BackupError) return e.message;
  return e instanceof Error ? `${e.message}` : String(e);
}
