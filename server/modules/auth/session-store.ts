import session from 'express-session';
import type { DataSource } from 'typeorm';
import { LessThan } from 'typeorm';
import { SessionRow } from '../../db/entities/session.entity';

/**
 * express-session store over the app's own SQLite database through TypeORM (no second driver, no GPL
 * dependency, no timer keeping the process alive: expired rows are swept on writes).
 */
export class TypeormSessionStore extends session.Store {
  private writes = 0;
  constructor(private ds: DataSource, private defaultTtlMs = 14 * 24 * 3600 * 1000) {
    super();
  }
  private repo() {
    return this.ds.getRepository(SessionRow);
  }
  private expiry(sess: session.SessionData): number {
    const e = sess.cookie?.expires;
    return e ? new Date(e).getTime() : Date.now() + this.defaultTtlMs;
  }
  override get(sid: string, cb: (err: unknown, session?: session.SessionData | null) => void): void {
    this.repo()
      .findOneBy({ sid })
      .then((row) => {
        if (!row || Number(row.expiresAt) < Date.now()) return cb(null, null);
        cb(null, JSON.parse(row.data));
      }, cb);
  }
  override set(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void): void {
    const run = async () => {
      await this.repo().save({ sid, expiresAt: this.expiry(sess), data: JSON.stringify(sess) });
      if (++this.writes % 100 === 0) await this.repo().delete({ expiresAt: LessThan(Date.now()) });
    };
    run().then(() => cb?.(), (e) => cb?.(e));
  }
  override touch(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void): void {
    this.repo().update({ sid }, { expiresAt: this.expiry(sess) }).then(() => cb?.(), (e) => cb?.(e));
  }
  override destroy(sid: string, cb?: (err?: unknown) => void): void {
    this.repo().delete({ sid }).then(() => cb?.(), (e) => cb?.(e));
  }
}
