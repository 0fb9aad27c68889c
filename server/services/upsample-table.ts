/**
 * Server-side loading and caching of the colour estimate's table (shared/spectral/upsample-table.ts).
 * Built once per install (a few seconds) on first use, and cached in DATA_DIR/cache so a restart only
 * reads it; the browser gets its compact form, gzip-compressed once. The file is versioned by the method's version and resolution; a stale or damaged
 * file is rebuilt.
 */
import fs from 'node:fs/promises';
import path from 'node:path';
import zlib from 'node:zlib';
import { buildUpsampleTable, decodeUpsampleTable, encodeUpsampleTable, encodeUpsampleTableCompact, UPSAMPLE_METHOD, type UpsampleTable } from '../../shared/spectral/upsample-table';

let built: { table: UpsampleTable; bytes: Uint8Array } | null = null;
const perDir = new Map<string, Promise<{ table: UpsampleTable; bytes: Uint8Array }>>();

/** File name of the cached table for the current method version and resolution. */
export function upsampleCacheFile(dataDir: string): string {
  return path.join(dataDir, 'cache', `upsample-srgb-d65-r${UPSAMPLE_METHOD.resolution}-v${UPSAMPLE_METHOD.version}.bin`);
}

async function readCache(file: string): Promise<{ table: UpsampleTable; bytes: Uint8Array } | null> {
  try {
    const bytes = new Uint8Array(await fs.readFile(file));
    const table = decodeUpsampleTable(bytes);
    return table.resolution === UPSAMPLE_METHOD.resolution ? { table, bytes } : null;
  } catch {
    return null; // missing, stale or damaged
  }
}

async function load(dataDir: string): Promise<{ table: UpsampleTable; bytes: Uint8Array }> {
  const file = upsampleCacheFile(dataDir);
  const cached = await readCache(file);
  if (cached) return (built ??= cached);
  if (!built) {
    const table = buildUpsampleTable();
    built = { table, bytes: encodeUpsampleTable(table) };
  }
  try {
    await fs.mkdir(path.dirname(file), { recursive: true });
    const tmp = `${file}.${process.pid}.tmp`;
    await fs.writeFile(tmp, built.bytes);
    await fs.rename(tmp, file);
  } catch {
    // a read-only data dir only costs the rebuild at the next start
  }
  return built;
}

function entry(dataDir: string) {
  let p = perDir.get(dataDir);
  if (!p) {
    p = load(dataDir);
    p.catch(() => perDir.delete(dataDir));
    perDir.set(dataDir, p);
  }
  return p;
}

/** The upsampling table (built or read from DATA_DIR/cache on first call; then kept in memory). */
export async function getUpsampleTable(dataDir: string): Promise<UpsampleTable> {
  return (await entry(dataDir)).table;
}

const compact = new WeakMap<UpsampleTable, Promise<Buffer>>();

/** The table's compact binary form ("GSQ2", shared/spectral/upsample-table.ts), gzip-compressed, for the browser. */
export async function getUpsampleTableGzip(dataDir: string): Promise<Buffer> {
  const table = (await entry(dataDir)).table;
  let p = compact.get(table);
  if (!p) {
    const bytes = encodeUpsampleTableCompact(table);
    p = new Promise<Buffer>((resolve, reject) => zlib.gzip(bytes, { level: 6 }, (e, out) => (e ? reject(e) : resolve(out))));
    compact.set(table, p);
  }
  return p;
}
