import fs from 'node:fs';
import path from 'node:path';

/** Folders of the data directory that hold private data (the database's folder is the data directory itself). */
const PRIVATE_DIRS = ['', 'uploads', path.join('uploads', 'photos'), path.join('uploads', '.incoming'), 'cache'];
/** The database and its write-ahead log and shared-memory index. */
const DB_FILES = ['app.sqlite', 'app.sqlite-wal', 'app.sqlite-shm'];

/**
 * Makes the data directory readable by the service's user only: its folders 0700 and the database files
 * 0600 (common practice for a service's state, e.g. a PostgreSQL data directory must be 0700). Folders are
 * created when missing; files that do not exist yet are skipped (call again once they do). A file system
 * that does not keep modes (some mounts) is left as it is.
 */
export function lockDownDataDir(dataDir: string): void {
  for (const d of PRIVATE_DIRS) {
    const p = path.join(dataDir, d);
    fs.mkdirSync(p, { recursive: true, mode: 0o700 });
    chmodQuietly(p, 0o700);
  }
  for (const f of DB_FILES) chmodQuietly(path.join(dataDir, f), 0o600);
}

function chmodQuietly(p: string, mode: number): void {
  try {
    fs.chmodSync(p, mode);
  } catch {
    /* missing, or a file system without modes */
  }
}
