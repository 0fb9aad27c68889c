/**
 * Compute-pool jobs for tests/api/fair-use.test.ts only (a job module: no side effects when imported, since
 * the pool's threads import it): one that keeps a thread busy, one that crashes its thread.
 */
import { computeJob } from '../../server/services/compute-jobs';

/** Keeps the thread busy for `ms` (a stand-in for a long computation), answers `ms`. */
export const busyJob = computeJob<number, number>('busy', import.meta.url, (ms) => {
  const end = performance.now() + ms;
  while (performance.now() < end);
  return ms;
});

/** Throws outside any job's try, as a bug in a native add-on or a stray timer would: the thread dies. */
export const crashJob = computeJob<null, never>('crash', import.meta.url, () => new Promise<never>(() => {
  setTimeout(() => {
    throw new Error('a crash on purpose (test)');
  }, 0);
}));
