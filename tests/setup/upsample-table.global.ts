/**
 * Vitest global setup: builds the spectral upsampling table (shared/spectral/upsample-table.ts, a second or more)
 * once per test run, instead of once per test file, and writes it where the tests read it
 * (`upsampleTable()` in tests/unit/spectral/fixtures.ts). The file is the server's cache file, same bytes
 * (`encodeUpsampleTable`) and same name (`upsampleCacheFile`) under a fresh temporary folder, so it can also be
 * copied into a test app's DATA_DIR/cache. Built fresh on every run: a table left by an earlier run could
 * predate a change to the fit, which the tests are there to check.
 *
 * Several projects (unit, reference) name this file; vitest runs it once per project in the same process, so
 * the first build is shared through `globalThis` and the folder is removed after the last teardown.
 */
import type { TestProject } from 'vitest/node';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { buildUpsampleTable, encodeUpsampleTable } from '../../shared/spectral/upsample-table';
import { upsampleCacheFile } from '../../server/services/upsample-table';
import { UPSAMPLE_TABLE_FILE_ENV } from './upsample-table-file';

interface Shared {
  file: string;
  users: number;
}

const KEY = Symbol.for('grisaille.test.upsampleTable');
const store = globalThis as unknown as Record<symbol, Shared | undefined>;

export default function setup(project: TestProject): () => void {
  let shared = store[KEY];
  if (!shared) {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-upsample-'));
    const file = upsampleCacheFile(dir);
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(file, encodeUpsampleTable(buildUpsampleTable()));
    shared = store[KEY] = { file, users: 0 };
  }
  shared.users++;
  // Workers start after the global setups and inherit the environment.
  process.env[UPSAMPLE_TABLE_FILE_ENV] = shared.file;
  // In watch mode the engine may have changed since the build: reruns go back to building in each test file.
  project.onTestsRerun(() => {
    delete process.env[UPSAMPLE_TABLE_FILE_ENV];
  });
  return () => {
    const s = store[KEY];
    if (!s || --s.users > 0) return;
    store[KEY] = undefined;
    delete process.env[UPSAMPLE_TABLE_FILE_ENV];
    fs.rmSync(path.dirname(path.dirname(s.file)), { recursive: true, force: true });
  };
}
