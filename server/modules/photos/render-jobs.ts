/**
 * Full-resolution renders as jobs: one at a time (a 24-megapixel render holds a few hundred MB), the
 * rest queued; each has a key (a hash of the photo, the look's content and the format), so an unchanged
 * look is never rendered twice: a finished render is a file in the cache, found by its key. The client
 * polls a job's status (stage and progress) and downloads the file when it is done. Statuses leave
 * here with `url` null; the service fills in the route.
 * A render is written to a `*.tmp` file beside its final name, then renamed: a failed render removes it,
 * and one a killed process left is removed by the storage sweep (PhotoStorage.sweep).
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Photo } from '../../db/entities/photo.entity';
import type { ComposedLook } from '../../../shared/look/compose-look';
import { photoToneModel } from '../../../shared/photo/look-photo-model';
import type { RenderFormat, RenderStatus } from '../../../shared/schemas/photo';
import { buildRenderTable, renderPhoto, type RenderTable } from '../../services/photo-render';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';
import { PhotoStorage } from './photo-storage';
import { AppError } from '../../errors';

/** Bump when the renderer's output changes, so old cached renders are not served. */
export const RENDER_VERSION = 2;
/** Look tables kept in memory (8-bit photos: 32 MB each at 8-bit output, 64 MB at 16-bit), most recent first. */
const TABLE_CACHE = 3;
/** Finished renders kept per photo on disk; the oldest beyond this are removed. */
const RENDERS_KEPT_PER_PHOTO = 16;
/** Renders allowed to wait; beyond, a request is refused (429) rather than queued. */
export const MAX_QUEUED_RENDERS = 12;
/** How long a finished or failed job's status stays in memory, ms (the file outlives it). */
const STATUS_TTL_MS = 30 * 60 * 1000;

const EXT: Record<RenderFormat, string> = { png16: 'png', jpeg: 'jpg' };

interface Job {
  status: RenderStatus;
  photo: Pick<Photo, 'storageKey' | 'format' | 'bitDepth' | 'iccProfile'>;
  look: ComposedLook;
  contentHash: string;
  finishedAt?: number;
}

/** The render key of a photo, a look's content hash and a format. */
export function renderKey(storageKey: string, contentHash: string, format: RenderFormat): string {
  return crypto.createHash('sha256').update(`${RENDER_VERSION}|${storageKey}|${contentHash}|${format}`).digest('hex').slice(0, 32);
}

export class RenderJobs {
  private jobs = new Map<string, Job>();
  private queue: string[] = [];
  private running = false;
  private lookTables: { key: string; table: Promise<RenderTable> }[] = [];

  constructor(
    private storage: PhotoStorage,
    private upsampleTable: () => Promise<UpsampleTable>,
  ) {}

  private file(storageKey: string, key: string, format: RenderFormat): string {
    return this.storage.renderFile(storageKey, key, EXT[format]);
  }

  private doneStatus(key: string, format: RenderFormat, file: string, cached: boolean): RenderStatus {
    return { key, status: 'done', progress: 1, stage: 'done', format, cached, url: null, bytes: fs.statSync(file).size, error: null };
  }

  /** Starts (or finds) the render of `photo` through a look; answers its status at once. */
  request(photo: Pick<Photo, 'storageKey' | 'format' | 'bitDepth' | 'iccProfile'>, look: ComposedLook, contentHash: string, format: RenderFormat): RenderStatus {
    const key = renderKey(photo.storageKey, contentHash, format);
    const existing = this.jobs.get(key);
    if (existing && existing.status.status === 'done') return { ...existing.status, cached: true };
    if (existing && existing.status.status !== 'failed') return { ...existing.status };
    const file = this.file(photo.storageKey, key, format);
    if (fs.existsSync(file)) return this.doneStatus(key, format, file, true);
    if (this.queue.length >= MAX_QUEUED_RENDERS) {
      throw new AppError(429, 'busy', `The renderer has ${this.queue.length} renders waiting; try again in a minute.`);
    }
    const job: Job = {
      status: { key, status: 'queued', progress: 0, stage: 'queued', format, cached: false, url: null, bytes: null, error: null },
      photo,
      look,
      contentHash,
    };
    this.jobs.set(key, job);
    this.queue.push(key);
    void this.pump();
    return { ...job.status };
  }

  /** The status of a render by key (from memory, or from the cache on disk); null when unknown. */
  status(storageKey: string, key: string): RenderStatus | null {
    this.expire();
    const job = this.jobs.get(key);
    if (job) return { ...job.status };
    for (const format of ['png16', 'jpeg'] as const) {
      const file = this.file(storageKey, key, format);
      if (fs.existsSync(file)) return this.doneStatus(key, format, file, true);
    }
    return null;
  }

  /** The finished file of a render, or null. */
  fileOf(storageKey: string, key: string): { file: string; format: RenderFormat } | null {
    for (const format of ['png16', 'jpeg'] as const) {
      const file = this.file(storageKey, key, format);
      if (fs.existsSync(file)) return { file, format };
    }
    return null;
  }

  /** Waits until no render is queued or running (tests and shutdown). */
  async idle(): Promise<void> {
    while (this.running || this.queue.length) await new Promise((r) => setTimeout(r, 20));
  }

  private expire() {
    const now = Date.now();
    for (const [k, j] of this.jobs) if (j.finishedAt && now - j.finishedAt > STATUS_TTL_MS) this.jobs.delete(k);
  }

  private async pump(): Promise<void> {
    if (this.running) return;
    this.running = true;
    try {
      for (let key = this.queue.shift(); key; key = this.queue.shift()) {
        const job = this.jobs.get(key);
        if (job) await this.run(job);
      }
    } finally {
      this.running = false;
    }
  }

  /** The look's render table for these depths, from the cache or built (while the photo decodes). */
  private table(job: Job, inputBits: 8 | 16, outputBits: 8 | 16, upsample: UpsampleTable): Promise<RenderTable> {
    const k = `${job.contentHash}|${inputBits}|${outputBits}`;
    const hit = this.lookTables.find((p) => p.key === k);
    if (hit) return hit.table;
    const table = buildRenderTable(photoToneModel(job.look, upsample), inputBits, outputBits);
    table.catch(() => (this.lookTables = this.lookTables.filter((p) => p.key !== k)));
    this.lookTables = [{ key: k, table }, ...this.lookTables.filter((p) => p.key !== k)].slice(0, TABLE_CACHE);
    return table;
  }

  private async run(job: Job): Promise<void> {
    const s = job.status;
    const { storageKey, format: photoFormat, bitDepth } = job.photo;
    const file = this.file(storageKey, s.key, s.format);
    const tmp = `${file}.${process.pid}.${crypto.randomBytes(4).toString('hex')}.tmp`;
    try {
      const upsample = await this.upsampleTable();
      s.status = 'running';
      const result = await renderPhoto({
        input: this.storage.original(storageKey, photoFormat),
        bitDepth: bitDepth === 16 ? 16 : 8,
        hasProfile: job.photo.iccProfile !== null,
        format: s.format,
        table: (ib, ob) => this.table(job, ib, ob, upsample),
        onProgress: (p) => {
          s.stage = p.stage;
          s.progress = p.progress;
        },
      });
      // a photo deleted while it rendered gets no cache folder back (it would be left behind)
      if (!fs.existsSync(this.storage.dir(storageKey))) throw new Error('the photo was deleted while it rendered');
      fs.mkdirSync(path.dirname(file), { recursive: true });
      fs.writeFileSync(tmp, result.data);
      fs.renameSync(tmp, file);
      if (!fs.existsSync(this.storage.dir(storageKey))) {
        fs.rmSync(this.storage.renderDir(storageKey), { recursive: true, force: true });
        throw new Error('the photo was deleted while it rendered');
      }
      Object.assign(s, this.doneStatus(s.key, s.format, file, false));
      this.prune(storageKey);
    } catch (e) {
      fs.rmSync(tmp, { force: true });
      s.status = 'failed';
      s.stage = 'failed';
      s.error = 'The render failed: the original could not be read or written.';
      if (process.env.NODE_ENV !== 'test' || process.env.GRISAILLE_LOG_ERRORS) console.error(e);
    } finally {
      job.finishedAt = Date.now();
    }
  }

  /** Keeps the newest RENDERS_KEPT_PER_PHOTO renders of a photo. */
  private prune(storageKey: string) {
    const dir = this.storage.renderDir(storageKey);
    const files = fs
      .readdirSync(dir)
      .filter((f) => !f.endsWith('.tmp'))
      .map((f) => ({ f, t: fs.statSync(path.join(dir, f)).mtimeMs }))
      .sort((a, b) => b.t - a.t);
    for (const { f } of files.slice(RENDERS_KEPT_PER_PHOTO)) fs.rmSync(path.join(dir, f), { force: true });
  }
}
