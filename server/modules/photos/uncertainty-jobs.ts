/**
 * Uncertainty tables of looks for the photos page's overlay (shared/photo/uncertainty-table.ts): built as
 * jobs in slices, so the event loop stays free and the page can poll the progress; kept per look content
 * (the key is the look's content hash), so an unchanged look is built once. Statuses live in memory.
 */
import type { LightPath } from '../../../shared/spectral/compute';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';
import { fillUncertaintyTable, UNCERTAINTY_TABLE_SIZE } from '../../../shared/photo/uncertainty-table';
import type { UncertaintyStatus } from '../../../shared/schemas/photo';

/** Nodes computed between two turns of the event loop. */
const SLICE = 1024;
/** Finished tables kept in memory (about 140 kB each), most recent last. */
const KEPT = 32;

interface Job {
  status: UncertaintyStatus;
  widths: Float32Array | null;
}

export class UncertaintyJobs {
  private jobs = new Map<string, Job>();

  constructor(private upsampleTable: () => Promise<UpsampleTable>) {}

  /** Starts (or finds) the table of a look's light path; answers its status at once. */
  request(key: string, lightPath: LightPath): UncertaintyStatus {
    const existing = this.jobs.get(key);
    if (existing && existing.status.status !== 'failed') return this.view(existing);
    const size = UNCERTAINTY_TABLE_SIZE;
    const job: Job = { status: { key, status: 'running', progress: 0, size, widths: null, error: null }, widths: null };
    this.jobs.set(key, job);
    while (this.jobs.size > KEPT) this.jobs.delete(this.jobs.keys().next().value!);
    void this.run(job, lightPath);
    return this.view(job);
  }

  /** A job's status by key; null when unknown. */
  status(key: string): UncertaintyStatus | null {
    const job = this.jobs.get(key);
    return job ? this.view(job) : null;
  }

  private view(job: Job): UncertaintyStatus {
    return { ...job.status, widths: job.widths ? Array.from(job.widths, (v) => Math.round(v * 1000) / 1000) : null };
  }

  private async run(job: Job, lightPath: LightPath): Promise<void> {
    try {
      const table = await this.upsampleTable();
      const size = job.status.size;
      const n = size ** 3;
      const out = new Float32Array(n);
      for (let from = 0; from < n; from += SLICE) {
        fillUncertaintyTable(out, size, lightPath, table, from, Math.min(n, from + SLICE));
        job.status = { ...job.status, progress: Math.min(n, from + SLICE) / n };
        await new Promise<void>((resolve) => setImmediate(resolve));
      }
      job.widths = out;
      job.status = { ...job.status, status: 'done', progress: 1 };
    } catch (e) {
      job.status = { ...job.status, status: 'failed', error: e instanceof Error ? e.message : String(e) };
    }
  }
}
