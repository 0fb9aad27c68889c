import fs from 'node:fs';
import path from 'node:path';
import { findInProduction } from '../../db/in-production';
import type { DataSource } from 'typeorm';
import { Photo } from '../../db/entities/photo.entity';
import { Look } from '../../db/entities/look.entity';
import type { Membership } from '../../db/entities/membership.entity';
import { AppError, NotFoundError } from '../../errors';
import { assertDepartmentAccess } from '../../policy/department-access';
import type { LookDefinition } from '../../../shared/schemas/look';
import { MAX_PHOTO_BYTES, MAX_PHOTO_PIXELS, type PhotoLookView, type PhotoView, type RenderFormat, type RenderStatus, type UncertaintyStatus } from '../../../shared/schemas/photo';
import { ingestPhoto } from './photo-ingest';
import { ORPHAN_AGE_MS, PhotoStorage, removeQuietly } from './photo-storage';
import { fileNamePart, nameFromFile } from './photo-names';
import { logEvent } from '../../services/log';
import { cleanName } from '../../../shared/schemas/names';
import { RenderJobs, renderKey } from './render-jobs';
import { UncertaintyJobs } from './uncertainty-jobs';
import { getUpsampleTable } from '../../services/upsample-table';
import { photoLookView, resolvePhotoLook } from './photo-looks';

/** Limits an instance enforces (tests lower them). */
export interface PhotoLimits {
  maxBytes: number;
  maxPixels: number;
  /** the most one production's photos may take on disk (originals, previews, thumbnails), bytes */
  quotaBytes: number;
}

/** Default production quota when none is configured: 2 GiB (env PRODUCTION_QUOTA_MB). */
export const DEFAULT_QUOTA_BYTES = 2048 * 1024 * 1024;

/** How often the sweep of left-behind upload and render files runs while the app serves, ms. */
export const SWEEP_EVERY_MS = 10 * 60_000;

/** A size for a person: "150 MB", "1.9 GB", "64 kB" (binary multiples, as the quota is set in MB). */
export function sizeText(bytes: number): string {
  const kb = 1024;
  const mb = kb * 1024;
  const gb = mb * 1024;
  const one = (n: number) => (n >= 10 || Number.isInteger(Math.round(n * 10) / 10) ? String(Math.round(n)) : (Math.round(n * 10) / 10).toFixed(1));
  if (bytes >= gb) return `${one(bytes / gb)} GB`;
  if (bytes >= mb) return `${one(bytes / mb)} MB`;
  return `${Math.max(1, Math.round(bytes / kb))} kB`;
}

/** File system failures that mean the server cannot store files (not the upload's fault). */
const STORAGE_FAULTS: Record<string, { status: number; code: string; message: string }> = {
  ENOSPC: { status: 507, code: 'storage_full', message: "The server's disk is full; the photo was not stored. Tell the site operator." },
  EDQUOT: { status: 507, code: 'storage_full', message: "The server's disk quota is used up; the photo was not stored. Tell the site operator." },
  EACCES: { status: 500, code: 'storage', message: 'The server cannot write its photo folder; the photo was not stored. Tell the site operator.' },
  EPERM: { status: 500, code: 'storage', message: 'The server cannot write its photo folder; the photo was not stored. Tell the site operator.' },
  EROFS: { status: 500, code: 'storage', message: 'The server cannot write its photo folder; the photo was not stored. Tell the site operator.' },
  ENOTDIR: { status: 500, code: 'storage', message: 'The server cannot write its photo folder; the photo was not stored. Tell the site operator.' },
};

export function photoUrls(productionId: number, id: number) {
  const base = `/api/productions/${productionId}/photos/${id}`;
  return { preview: `${base}/preview`, thumb: `${base}/thumb`, original: `${base}/original` };
}

export function photoView(p: Photo, productionId: number): PhotoView {
  return {
    id: p.id,
    name: p.name,
    notes: p.notes,
    department: p.department,
    format: p.format,
    bitDepth: p.bitDepth,
    width: p.width,
    height: p.height,
    previewWidth: p.previewWidth,
    previewHeight: p.previewHeight,
    fileBytes: p.fileBytes,
    originalName: p.originalName ?? '',
    iccProfile: p.iccProfile,
    orientation: p.orientation,
    isDemo: p.isDemo,
    uploadedBy: p.uploadedBy ? { id: p.uploadedBy.id, name: p.uploadedBy.name } : null,
    createdAt: new Date(p.createdAt).toISOString(),
    urls: photoUrls(productionId, p.id),
  };
}

/** A file system failure of the server as an AppError saying so (logged for the operator); any other error as it is. */
function storageFault(e: unknown, m: Membership): unknown {
  const code = e && typeof e === 'object' && 'code' in e ? String((e as { code: unknown }).code) : '';
  const fault = e instanceof AppError ? undefined : STORAGE_FAULTS[code];
  if (!fault) return e;
  logEvent('photo-storage-failed', { code, productionId: m.production.id, userId: m.user?.id, message: e instanceof Error ? e.message : String(e) }, 'warn');
  return new AppError(fault.status, fault.code, fault.message);
}

/**
 * Photos: viewers see and render them; contributors upload, and rename or delete their own
 * department's; editors and owners any. Uploads are checked by content before anything is stored.
 */
export class PhotosService {
  readonly storage: PhotoStorage;
  readonly renders: RenderJobs;
  readonly uncertainty: UncertaintyJobs;
  private sweepTimer: NodeJS.Timeout | null = null;
  /** Sizes of the previews and thumbnails of stored photos by storage key, bytes (the files never change). */
  private derivedBytes = new Map<string, number>();

  constructor(
    private ds: DataSource,
    private dataDir: string,
    readonly limits: PhotoLimits = { maxBytes: MAX_PHOTO_BYTES, maxPixels: MAX_PHOTO_PIXELS, quotaBytes: DEFAULT_QUOTA_BYTES },
  ) {
    this.storage = new PhotoStorage(dataDir);
    this.renders = new RenderJobs(this.storage, () => getUpsampleTable(dataDir));
    this.uncertainty = new UncertaintyJobs(() => getUpsampleTable(dataDir));
    // at start nothing is in progress: whatever an earlier process left behind goes now, whatever its age
    this.sweepOrphans(0);
    this.sweepTimer = setInterval(() => this.sweepOrphans(), SWEEP_EVERY_MS);
    this.sweepTimer.unref();
  }

  /**
   * Removes left-behind upload and render files (PhotoStorage.sweep) untouched for `maxAgeMs`; runs at start
   * and every SWEEP_EVERY_MS. Answers the paths removed and tells the operator's log when there were any.
   */
  sweepOrphans(maxAgeMs = ORPHAN_AGE_MS): string[] {
    const removed = this.storage.sweep(maxAgeMs);
    if (removed.length) logEvent('orphan-files-removed', { count: removed.length, paths: removed.slice(0, 20) });
    return removed;
  }

  /** Stops the periodic sweep and waits for the render running now (the app's close calls this). */
  async close(): Promise<void> {
    if (this.sweepTimer) clearInterval(this.sweepTimer);
    this.sweepTimer = null;
    await this.renders.idle();
  }

  /** Bytes the photos of a production take on disk: originals (their recorded size) plus previews and thumbnails. */
  async usedBytes(productionId: number): Promise<number> {
    const rows = await this.ds.getRepository(Photo).find({ where: { production: { id: productionId } }, select: { id: true, storageKey: true, fileBytes: true } });
    let total = 0;
    for (const p of rows) {
      let derived = this.derivedBytes.get(p.storageKey);
      if (derived === undefined) {
        derived = 0;
        for (const f of [this.storage.preview(p.storageKey), this.storage.thumb(p.storageKey)]) {
          try {
            derived += fs.statSync(f).size;
          } catch {
            /* a missing file takes no room */
          }
        }
        this.derivedBytes.set(p.storageKey, derived);
      }
      total += p.fileBytes + derived;
    }
    return total;
  }

  /** Refuses (413) a photo of `bytes` that would take the production over its quota. */
  private async assertFits(productionId: number, bytes: number): Promise<void> {
    const quota = this.limits.quotaBytes;
    const used = await this.usedBytes(productionId);
    if (used + bytes <= quota) return;
    throw new AppError(
      413,
      'quota_exceeded',
      `This production's photos use ${sizeText(used)} of its ${sizeText(quota)}; this file (${sizeText(bytes)}) does not fit. Delete photos or ask the site operator to raise PRODUCTION_QUOTA_MB.`,
      'file',
    );
  }

  async list(productionId: number): Promise<PhotoView[]> {
    const rows = await this.ds.getRepository(Photo).find({ where: { production: { id: productionId } }, relations: { uploadedBy: true }, order: { createdAt: 'DESC', id: 'DESC' } });
    return rows.map((p) => photoView(p, productionId));
  }

  async entity(productionId: number, id: number): Promise<Photo> {
    const p = await findInProduction(this.ds.manager, Photo, productionId, id, 'Photo', { uploadedBy: true });
    return p;
  }

  async get(productionId: number, id: number): Promise<PhotoView> {
    return photoView(await this.entity(productionId, id), productionId);
  }

  /**
   * Stores an upload: checks the production's quota with the upload's size, checks the file (ingestPhoto),
   * writes original, preview and thumbnail into a staging directory, checks the quota again with the
   * preview and thumbnail, moves it into place, then inserts the row in a transaction. Everything from the
   * staging directory on sits inside the guarded block: on any failure the files are removed (the incoming
   * file too) and nothing is stored. A file system failure of the server is a 500/507 saying so.
   */
  async create(m: Membership, upload: { path: string; originalname?: string; size?: number }, fields: { name?: string; notes?: string }): Promise<PhotoView> {
    let staging: string | null = null;
    const key = PhotoStorage.newKey();
    let committed = false;
    try {
      await this.assertFits(m.production.id, upload.size ?? fs.statSync(upload.path).size);
      staging = this.storage.stagingDir();
      const info = await ingestPhoto(upload.path, staging, { maxPixels: this.limits.maxPixels });
      const derived = fs.statSync(path.join(staging, 'preview.jpg')).size + fs.statSync(path.join(staging, 'thumb.jpg')).size;
      await this.assertFits(m.production.id, info.fileBytes + derived);
      this.storage.commit(staging, key);
      committed = true;
      this.derivedBytes.set(key, derived);
      const saved = await this.ds.transaction(async (t) =>
        t.save(
          Photo,
          t.create(Photo, {
            production: m.production,
            uploadedBy: m.user,
            department: m.department,
            name: fields.name ?? nameFromFile(upload.originalname),
            notes: fields.notes ?? '',
            originalName: [...cleanName(upload.originalname ?? '')].slice(0, 200).join(''),
            storageKey: key,
            isDemo: false,
            ...info,
          }),
        ),
      );
      return photoView(saved, m.production.id);
    } catch (e) {
      if (staging) removeQuietly(staging);
      if (committed) {
        this.storage.remove(key);
        this.derivedBytes.delete(key);
      }
      throw storageFault(e, m);
    } finally {
      removeQuietly(upload.path);
    }
  }

  private assertMayChange(m: Membership, p: Photo) {
    assertDepartmentAccess(m, p.department, 'photos');
  }

  async update(m: Membership, id: number, input: { name?: string; notes?: string }): Promise<PhotoView> {
    return this.ds.transaction(async (t) => {
      const p = await findInProduction(t, Photo, m.production.id, id, 'Photo', { uploadedBy: true });
      this.assertMayChange(m, p);
      if (input.name !== undefined) p.name = input.name;
      if (input.notes !== undefined) p.notes = input.notes;
      return photoView(await t.save(p), m.production.id);
    });
  }

  /** Deletes the row (in a transaction), then the files. */
  async remove(m: Membership, id: number): Promise<void> {
    const key = await this.ds.transaction(async (t) => {
      const p = await findInProduction(t, Photo, m.production.id, id, 'Photo');
      this.assertMayChange(m, p);
      await t.remove(p);
      return p.storageKey;
    });
    this.storage.remove(key);
    this.derivedBytes.delete(key);
  }

  /** A stored file of a photo: its path and type. */
  async file(productionId: number, id: number, which: 'preview' | 'thumb' | 'original'): Promise<{ path: string; type: string; photo: Photo }> {
    const p = await this.entity(productionId, id);
    const file = which === 'original' ? this.storage.original(p.storageKey, p.format) : which === 'preview' ? this.storage.preview(p.storageKey) : this.storage.thumb(p.storageKey);
    if (!fs.existsSync(file)) throw new NotFoundError('The photo file');
    return { path: file, type: which === 'original' ? `image/${p.format}` : 'image/jpeg', photo: p };
  }

  /** A look resolved to spectra for the browser's live preview. */
  async photoLook(productionId: number, choice: { lookId?: number; look?: LookDefinition }): Promise<PhotoLookView> {
    return photoLookView(await resolvePhotoLook(this.ds.manager, productionId, choice, await getUpsampleTable(this.dataDir)));
  }

  /** Adds the file's route to a finished render; with `lookId` the file is named after that look. */
  private withUrl(productionId: number, photoId: number, s: RenderStatus, lookId?: number): RenderStatus {
    if (s.status !== 'done') return s;
    return { ...s, url: `/api/productions/${productionId}/photos/${photoId}/renders/${s.key}/file${lookId ? `?look=${lookId}` : ''}` };
  }

  /** Starts (or finds) the uncertainty table of a look for the overlay. */
  async startUncertainty(productionId: number, choice: { lookId?: number; look?: LookDefinition }): Promise<UncertaintyStatus> {
    const look = await resolvePhotoLook(this.ds.manager, productionId, choice, await getUpsampleTable(this.dataDir));
    const key = look.contentHash.slice(0, 32);
    return { ...this.uncertainty.request(`${productionId}:${key}`, look.composed.path), key };
  }

  /** An uncertainty table's status (and, once done, the table), within the production that asked for it. */
  uncertaintyStatus(productionId: number, key: string): UncertaintyStatus {
    const s = /^[0-9a-f]{32}$/.test(key) ? this.uncertainty.status(`${productionId}:${key}`) : null;
    if (!s) throw new NotFoundError('That uncertainty table');
    return { ...s, key };
  }

  /** Starts (or finds in the cache) a full-resolution render. */
  async startRender(productionId: number, photoId: number, req: { lookId?: number; look?: LookDefinition; format: RenderFormat }): Promise<RenderStatus> {
    const p = await this.entity(productionId, photoId);
    const look = await resolvePhotoLook(this.ds.manager, productionId, req, await getUpsampleTable(this.dataDir));
    return this.withUrl(productionId, photoId, this.renders.request(p, look.composed, look.contentHash, req.format), req.lookId);
  }

  async renderStatus(productionId: number, photoId: number, key: string): Promise<RenderStatus> {
    const p = await this.entity(productionId, photoId);
    const s = /^[0-9a-f]{32}$/.test(key) ? this.renders.status(p.storageKey, key) : null;
    if (!s) throw new NotFoundError('That render');
    return this.withUrl(productionId, photoId, s);
  }

  /**
   * A finished render's file and the name it downloads under: `<photo>_<look>_<first 8 of the key>.png|jpg`.
   * `lookId` (a saved look of this production) names the look; when the render is not of that look's saved
   * content (the live changes were rendered) the name says "retuned". An unknown look leaves its name out.
   */
  async renderFile(productionId: number, photoId: number, key: string, lookId?: number): Promise<{ path: string; type: string; downloadName: string }> {
    const p = await this.entity(productionId, photoId);
    const f = /^[0-9a-f]{32}$/.test(key) ? this.renders.fileOf(p.storageKey, key) : null;
    if (!f) throw new NotFoundError('That render');
    let lookPart: string | null = null;
    const look = lookId ? await this.ds.getRepository(Look).findOne({ where: { id: lookId, production: { id: productionId } } }) : null;
    if (look) {
      const resolved = await resolvePhotoLook(this.ds.manager, productionId, { lookId: look.id }, await getUpsampleTable(this.dataDir));
      lookPart = renderKey(p.storageKey, resolved.contentHash, f.format) === key ? look.name : `${look.name} retuned`;
    }
    const ext = f.format === 'jpeg' ? 'jpg' : 'png';
    const parts = [fileNamePart(p.name, 'photo'), ...(lookPart ? [fileNamePart(lookPart, 'look')] : ['grey']), key.slice(0, 8)];
    return { path: f.file, type: f.format === 'jpeg' ? 'image/jpeg' : 'image/png', downloadName: `${parts.join('_')}.${ext}` };
  }
}
