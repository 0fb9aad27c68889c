/**
 * Where the test run's upsampling table is (written by tests/setup/upsample-table.global.ts): the environment
 * variable holding the file's path, and a reader that returns null when there is no such file.
 */
import fs from 'node:fs';
import path from 'node:path';
import { upsampleCacheFile } from '../../server/services/upsample-table';
import { decodeUpsampleTable, UPSAMPLE_METHOD, type UpsampleTable } from '../../shared/spectral/upsample-table';

/** Environment variable naming the file with the run's table (the server's cache format). */
export const UPSAMPLE_TABLE_FILE_ENV = 'GRISAILLE_TEST_UPSAMPLE_TABLE';

/** The table written by the global setup of this run, or null when run without it (or the file is unreadable). */
export function readRunUpsampleTable(): UpsampleTable | null {
  const file = process.env[UPSAMPLE_TABLE_FILE_ENV];
  if (!file) return null;
  try {
    const table = decodeUpsampleTable(new Uint8Array(fs.readFileSync(file)));
    return table.resolution === UPSAMPLE_METHOD.resolution ? table : null;
  } catch {
    return null; // missing, or from another method version: the caller builds it
  }
}

/** Puts the run's table where a server with DATA_DIR `dataDir` caches it, so the app under test does not rebuild it. */
export function copyRunUpsampleTable(dataDir: string): void {
  const file = process.env[UPSAMPLE_TABLE_FILE_ENV];
  if (!file || !fs.existsSync(file)) return;
  const to = upsampleCacheFile(dataDir);
  fs.mkdirSync(path.dirname(to), { recursive: true });
  fs.copyFileSync(file, to);
}
