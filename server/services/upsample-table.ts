/**
 * Server-side loading and caching of the colour estimate's table (shared/spectral/upsample-table.ts).
 * Built once per install (a few seconds) on first use, and cached in DATA_DIR/cache so a restart only
 * reads it; the browser gets its compact form, gzip-compressed once. The file is versioned by the method's version and resolution; a stale or damaged
 * file is rebuilt.
 * The table is held once, in shared memory: the file is read straight into a SharedArrayBuffer and the
 * spectra are a view on it (44 MB; reading it into a Buffer, copying the spectra out and keeping the bytes
 * for the cache file held three copies at the peak and two after), so the photo render workers
 * (photo-pass-pool.ts) read the same memory without a copy.
 */
import fs from 'node:fs/promises';
import path from 'node:path';
import zlib from 'node:zlib';
import { buildUpsampleTable, decodeUpsampleTable, encodeUpsampleTable, encodeUpsampleTableCompact, UPSAMPLE_METHOD, type UpsampleTable } from '../../shared/spectral/upsample-table';

let built: { table: UpsampleTable } | null = null;
const perDir = new Map<string, Promise<{ table: UpsampleTable }>>();

/** File name of the cached table for the current method version and resolution. */
export function upsampleCacheFile(dataDir: string): string {
  return path.join(dataDir, 'cache', `upsample-srgb-d65-r${UPSAMPLE_METHOD.resolution}-v${UPSAMPLE_METHOD.version}.bin`);
}

/** A whole file read into shared memory (one buffer, no intermediate copy). */
async function readShared(file: string): Promise<Uint8Array> {
  const fh = await fs.open(file, 'r');
  try {
    const { size } = await fh.stat();
    const bytes = new Uint8Array(new SharedArrayBuffer(size));
    for (let at = 0; at < size; ) {
      const { bytesRead } = await fh.read(bytes, at, size - at, at);
      if (bytesRead === 0) throw new Error('upsample table: file shorter than its size');
      at += bytesRead;
    }
    return bytes;
  } finally {
    await fh.close();
  }
}

async function readCache(file: string): Promise<{ table: UpsampleTable } | null> {
  try {
    const table = decodeUpsampleTable(await readShared(file), undefined, true);
    return table.resolution === UPSAMPLE_METHOD.resolution ? { table } : null;
  } catch {
    return null; // missing, stale or damaged
  }
}

/** A table built in this process, its spectra moved into shared memory (once per install). */
function inShared(table: UpsampleTable): UpsampleTable {
  const spectra = new Float32Array(new SharedArrayBuffer(table.spectra.byteLength));
  spectra.set(table.spectra);
  return { ...table, spectra };
}

async function load(dataDir: string): Promise<{ table: UpsampleTable }> {
  const file = upsampleCacheFile(dataDir);
  const cached = await readCache(file);
  if (cached) return (built ??= cached);
  built ??= { table: inShared(buildUpsampleTable()) };
  try {
    await fs.mkdir(path.dirname(file), { recursive: true });
    const tmp = `${file}.${process.pid}.tmp`;
    await fs.writeFile(tmp, encodeUpsampleTable(built.table));
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
