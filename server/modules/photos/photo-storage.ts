import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import type { PhotoFormat } from '../../../shared/schemas/photo';

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
    this.sweep();
  }

  /** Removes what an interrupted upload left behind (staging directories, incoming files) over an hour old. */
  private sweep() {
    const old = Date.now() - 3600_000;
    const clear = (dir: string, match: (f: string) => boolean) => {
      for (const f of fs.readdirSync(dir)) {
        const p = path.join(dir, f);
        try {
          if (match(f) && fs.statSync(p).mtimeMs < old) fs.rmSync(p, { recursive: true, force: true });
        } catch {
          /* gone meanwhile */
        }
      }
    };
    clear(this.photosRoot, (f) => f.startsWith('.staging-'));
    clear(this.incomingDir, () => true);
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

  /** A fresh staging directory next to the photos (same file system, so the final rename is atomic). */
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
