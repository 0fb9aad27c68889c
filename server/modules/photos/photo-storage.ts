import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import type { PhotoFormat } from '../../../shared/schemas/photo';

/**
 * How long an incoming file, a staging directory or a render's temporary file may go untouched before the
 * sweep takes it as left behind, ms: an upload in progress writes to its file continually, an ingest or a
 * render finishes in well under a minute, so 15 minutes of silence means its process is gone.
 */
export const ORPHAN_AGE_MS = 15 * 60_000;

/**
 * Where photo files live. Uploads: `${dataDir}/uploads/photos/<storageKey>/original.<ext>`, `preview.jpg`,
 * `thumb.jpg`; multer's incoming files in `${dataDir}/uploads/.incoming/`. Renders (a cache, safe to
 * delete): `${dataDir}/cache/photo-renders/<storageKey>/<renderKey>.<ext>`. Storage keys are random hex,
 * never taken from the request, so no path is built from user input.
 */
export class PhotoStorage {
  readonly photosRoot: string;
  readonly incomingDir: string;
  readonly rendersRoot: string;

  constructor(dataDir: string) {
    ({ photosRoot: this.photosRoot, incomingDir: this.incomingDir, rendersRoot: this.rendersRoot } = photoRoots(dataDir));
    fs.mkdirSync(this.photosRoot, { recursive: true });
    fs.mkdirSync(this.incomingDir, { recursive: true });
    fs.mkdirSync(this.rendersRoot, { recursive: true });
  }

  /**
   * Removes what interrupted uploads and renders left behind (a refused or cut-off upload, a kill -9 mid-
   * transfer or mid-render): incoming files, `.staging-*` directories, renders' `*.tmp` files, and the
   * render caches of photos that no longer exist, each only when nothing touched it for `maxAgeMs` (an
   * upload in progress writes to its file all the time). At start (nothing in progress) `maxAgeMs` is 0.
   * Answers the paths removed.
   */
  sweep(maxAgeMs = ORPHAN_AGE_MS, now = Date.now()): string[] {
    const removed: string[] = [];
    const stale = (p: string) => maxAgeMs <= 0 || newestMtime(p) < now - maxAgeMs;
    const clear = (p: string) => {
      try {
        if (!stale(p)) return;
        fs.rmSync(p, { recursive: true, force: true });
        removed.push(p);
      } catch {
        /* gone meanwhile */
      }
    };
    for (const f of listDir(this.incomingDir)) clear(path.join(this.incomingDir, f));
    for (const f of listDir(this.photosRoot)) if (f.startsWith('.staging-')) clear(path.join(this.photosRoot, f));
    for (const key of listDir(this.rendersRoot)) {
      const dir = path.join(this.rendersRoot, key);
      if (!/^[0-9a-f]{32}$/.test(key) || !fs.existsSync(path.join(this.photosRoot, key))) {
        clear(dir);
        continue;
      }
      for (const f of listDir(dir)) if (f.endsWith('.tmp')) clear(path.join(dir, f));
    }
    return removed;
  }

  static newKey(): string {
    return crypto.randomBytes(16).toString('hex');
  }

  static checkKey(key: string): string {
    if (!/^[0-9a-f]{32}$/.test(key)) throw new Error('bad storage key');
    return key;
  }

  dir(key: string): string {
    return path.join(this.photosRoot, PhotoStorage.checkKey(key));
  }

  original(key: string, format: PhotoFormat): string {
    return path.join(this.dir(key), `original.${EXTENSIONS[format]}`);
  }

  preview(key: string): string {
    return path.join(this.dir(key), 'preview.jpg');
  }

  thumb(key: string): string {
    return path.join(this.dir(key), 'thumb.jpg');
  }

  /**
   * A fresh staging directory next to the photos (same file system, so the final rename is atomic). Call it
   * inside the block that removes it on failure.
   */
  stagingDir(): string {
    const d = path.join(this.photosRoot, `.staging-${crypto.randomBytes(8).toString('hex')}`);
    fs.mkdirSync(d);
    return d;
  }

  /** Moves a finished staging directory into place as the photo `key`. */
  commit(staging: string, key: string): void {
    fs.renameSync(staging, this.dir(key));
  }

  renderDir(key: string): string {
    return path.join(this.rendersRoot, PhotoStorage.checkKey(key));
  }

  renderFile(key: string, renderKey: string, ext: string): string {
    if (!/^[0-9a-f]{16,64}$/.test(renderKey)) throw new Error('bad render key');
    return path.join(this.renderDir(key), `${renderKey}.${ext}`);
  }

  /** Removes a photo's files and its cached renders. */
  remove(key: string): void {
    fs.rmSync(this.dir(key), { recursive: true, force: true });
    fs.rmSync(this.renderDir(key), { recursive: true, force: true });
  }
}

/** The three roots of photo files under a data directory (layout in PhotoStorage's comment). */
export function photoRoots(dataDir: string) {
  return {
    photosRoot: path.join(dataDir, 'uploads', 'photos'),
    incomingDir: path.join(dataDir, 'uploads', '.incoming'),
    rendersRoot: path.join(dataDir, 'cache', 'photo-renders'),
  };
}

/**
 * Removes the files of photos by storage key (originals, previews, thumbnails, cached renders), e.g.
 * after their production's row was deleted; a key that is not a storage key is skipped.
 */
export function removePhotoFiles(dataDir: string, keys: string[]): void {
  const { photosRoot, rendersRoot } = photoRoots(dataDir);
  for (const key of keys) {
    if (!/^[0-9a-f]{32}$/.test(key)) continue;
    removeQuietly(path.join(photosRoot, key));
    removeQuietly(path.join(rendersRoot, key));
  }
}

/** Entries of a directory; none when it is missing or unreadable. */
function listDir(dir: string): string[] {
  try {
    return fs.readdirSync(dir);
  } catch {
    return [];
  }
}

/** The latest modification time of a file, or of a directory and anything directly in it, ms. */
function newestMtime(p: string): number {
  const st = fs.statSync(p);
  let t = st.mtimeMs;
  if (st.isDirectory()) {
    for (const f of listDir(p)) {
      try {
        t = Math.max(t, fs.statSync(path.join(p, f)).mtimeMs);
      } catch {
        /* gone meanwhile */
      }
    }
  }
  return t;
}

export const EXTENSIONS: Record<PhotoFormat, string> = { jpeg: 'jpg', png: 'png', tiff: 'tif', webp: 'webp' };
export const MIME_TYPES: Record<PhotoFormat, string> = { jpeg: 'image/jpeg', png: 'image/png', tiff: 'image/tiff', webp: 'image/webp' };

/** Removes a file or directory, ignoring one that is already gone. */
export function removeQuietly(p: string | undefined): void {
  if (!p) return;
  try {
    fs.rmSync(p, { recursive: true, force: true });
  } catch {
    /* already gone */
  }
}
