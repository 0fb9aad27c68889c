import fs from 'node:fs';
import { findInProduction } from '../../db/in-production';
import type { DataSource } from 'typeorm';
import { Photo } from '../../db/entities/photo.entity';
import { Look } from '../../db/entities/look.entity';
import type { Membership } from '../../db/entities/membership.entity';
import { NotFoundError } from '../../errors';
import { assertDepartmentAccess } from '../../policy/department-access';
import type { LookDefinition } from '../../../shared/schemas/look';
import { MAX_PHOTO_BYTES, MAX_PHOTO_PIXELS, type PhotoLookView, type PhotoView, type RenderFormat, type RenderStatus, type UncertaintyStatus } from '../../../shared/schemas/photo';
import { ingestPhoto } from './photo-ingest';
import { PhotoStorage, removeQuietly } from './photo-storage';
import { RenderJobs, renderKey } from './render-jobs';
import { UncertaintyJobs } from './uncertainty-jobs';
import { getUpsampleTable } from '../../services/upsample-table';
import { photoLookView, resolvePhotoLook } from './photo-looks';

/** Limits an instance enforces (tests lower them). */
export interface PhotoLimits {
  maxBytes: number;
  maxPixels: number;
}

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
    iccProfile: p.iccProfile,
    orientation: p.orientation,
    isDemo: p.isDemo,
    uploadedBy: p.uploadedBy ? { id: p.uploadedBy.id, name: p.uploadedBy.name } : null,
    createdAt: new Date(p.createdAt).toISOString(),
    urls: photoUrls(productionId, p.id),
  };
}

/** A name from an upload's file name: no extension, no path, printable, at most 120 characters. */
export function nameFromFile(original: string | undefined): string {
  const base = (original ?? '').split(/[\\/]/).pop() ?? '';
  const stem = base.replace(/\.[^.]*$/, '').replace(/[\u0000-\u001f\u007f]/g, '').replace(/[_]+/g, ' ').trim();
  return (stem || 'Photo').slice(0, 120);
}

/**
 * Photos: viewers see and render them; contributors upload, and rename or delete their own
 * department's; editors and owners any. Uploads are checked by content before anything is stored.
 */
export class PhotosService {
  readonly storage: PhotoStorage;
  readonly renders: RenderJobs;
  readonly uncertainty: UncertaintyJobs;

  constructor(
    private ds: DataSource,
    private dataDir: string,
    readonly limits: PhotoLimits = { maxBytes: MAX_PHOTO_BYTES, maxPixels: MAX_PHOTO_PIXELS },
  ) {
    this.storage = new PhotoStorage(dataDir);
    this.renders = new RenderJobs(this.storage, () => getUpsampleTable(dataDir));
    this.uncertainty = new UncertaintyJobs(() => getUpsampleTable(dataDir));
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
   * Stores an upload: checks it (ingestPhoto), writes original, preview and thumbnail into a staging
   * directory, moves it into place, then inserts the row in a transaction. On any failure the files are
   * removed and nothing is stored.
   */
  async create(m: Membership, upload: { path: string; originalname?: string }, fields: { name?: string; notes?: string }): Promise<PhotoView> {
    const staging = this.storage.stagingDir();
    const key = PhotoStorage.newKey();
    let committed = false;
    try {
      const info = await ingestPhoto(upload.path, staging, { maxPixels: this.limits.maxPixels });
      this.storage.commit(staging, key);
      committed = true;
      const saved = await this.ds.transaction(async (t) =>
        t.save(
          Photo,
          t.create(Photo, {
            production: m.production,
            uploadedBy: m.user,
            department: m.department,
            name: fields.name ?? nameFromFile(upload.originalname),
            notes: fields.notes ?? '',
            originalName: (upload.originalname ?? '').slice(0, 200),
            storageKey: key,
            isDemo: false,
            ...info,
          }),
        ),
      );
      return photoView(saved, m.production.id);
    } catch (e) {
      removeQuietly(staging);
      if (committed) this.storage.remove(key);
      throw e;
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

/**
 * One part of a download's file name from a user's name for something: letters (any script, NFC), digits,
 * spaces as hyphens, `.`, `-`; no path separators, quotes, control characters or leading dots; at most 80
 * characters. The header carries it as RFC 6266 `filename*` (UTF-8) with an ASCII `filename` fallback.
 */
export function fileNamePart(name: string, fallback: string): string {
  const safe = name
    .normalize('NFC')
    .replace(/[^\p{L}\p{M}\p{N} .-]+|\.{2,}/gu, ' ')
    .trim()
    .replace(/\s+/g, '-')
    .replace(/-{2,}/g, '-')
    .replace(/^[.-]+|[.-]+$/g, '')
    .slice(0, 80)
    .replace(/[.-]+$/, '');
  return safe || fallback;
}
