import type { DataSource } from 'typeorm';
import type { Env } from './env';
import type { MailService } from './services/mail';

/** What every router factory receives: `fooRouter(ctx)`. */
export interface AppContext {
  env: Env;
  ds: DataSource;
  mail: MailService;
}
