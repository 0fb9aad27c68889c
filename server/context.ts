import type { DataSource } from 'typeorm';
import type { Env } from './env';
import type { MailService } from './services/mail';
import type { ComputePool } from './services/compute-pool';
import type { FairUseLimiter } from './middleware/fair-use';

/** What every router factory receives: `fooRouter(ctx)`. */
export interface AppContext {
  env: Env;
  ds: DataSource;
  mail: MailService;
  /** the threads that run heavy computations off the main event loop (services/compute-pool.ts) */
  compute: ComputePool;
  /** per-user limits on heavy computations (middleware/fair-use.ts) */
  fairUse: FairUseLimiter;
}
