import crypto from 'node:crypto';
import session from 'express-session';
import type { DataSource } from 'typeorm';
import { LessThan } from 'typeorm';
import { SessionRow } from '../../db/entities/session.entity';

declare module 'express-session' {
  interface SessionData {
    /** passport's part: the signed-in user's id */
    passport?: { user?: number };
    /** the browser and address at sign-in (set by logIn), copied into the row for the session list */
    client?: { userAgent: string; ip: string };
  }
}

/**
 * The row key of a session id: sha256, hex. Only the hash is stored, so a copy of the table (a backup, a
 * leaked file) holds no usable session cookie: the cookie carries the raw id, and the store hashes what
 * it is given (common practice; OWASP Session Management Cheat Sheet, "session ID" storage).
 */
export function sessionKey(sid: string): string {
  return crypto.createHash('sha256').update(sid).digest('hex');
}

export interface SessionStoreOptions {
  /** rolling idle expiry when the cookie names none (default 14 days) */
  idleTtlMs?: number;
  /** absolute lifetime: a session ends this long after sign-in whatever its activity (default 30 days) */
  maxAgeMs?: number;
  /** touch() writes only when the expiry would move by at least this much (default 60 s) */
  touchEveryMs?: number;
}

const DAY_MS = 24 * 3600 * 1000;
/** sessions whose last touch is remembered before the memory is cleared (a bound, not a cache policy) */
const TOUCHED_KEPT = 10_000;

/**
 * express-session store over the app's own SQLite database through TypeORM (no second driver, no timer
 * keeping the process alive: expired rows are swept on writes).
 *
 * - Rows are keyed by sessionKey(sid), never the raw id.
 * - Only signed-in sessions are kept: a session without a passport user is not stored (and a row whose
 *   session signed out is removed), so anonymous visits write nothing.
 * - userId is a column of its own, so "sign out everywhere" deletes by an exact, indexed match.
 * - get() refuses a session older than the absolute lifetime; touch() writes at most once a minute.
 */
export class TypeormSessionStore extends session.Store {
  private writes = 0;
  /** when this process last touched each session (by key): a second touch within touchEveryMs skips the database */
  private readonly touched = new Map<string, number>();
  readonly idleTtlMs: number;
  readonly maxAgeMs: number;
  readonly touchEveryMs: number;

  constructor(private ds: DataSource, opts: SessionStoreOptions = {}) {
    super();
    this.idleTtlMs = opts.idleTtlMs ?? 14 * DAY_MS;
    this.maxAgeMs = opts.maxAgeMs ?? 30 * DAY_MS;
    this.touchEveryMs = opts.touchEveryMs ?? 60_000;
  }

  private repo() {
    return this.ds.getRepository(SessionRow);
  }

  private expiry(sess: session.SessionData): number {
    const e = sess.cookie?.expires;
    return e ? new Date(e).getTime() : Date.now() + this.idleTtlMs;
  }

  /** A row is live while its idle expiry is ahead and its sign-in is within the absolute lifetime. */
  isLive(row: Pick<SessionRow, 'expiresAt' | 'createdAt'>, now = Date.now()): boolean {
    return Number(row.expiresAt) > now && Number(row.createdAt) + this.maxAgeMs > now;
  }

  override get(sid: string, cb: (err: unknown, session?: session.SessionData | null) => void): void {
    const run = async () => {
      const key = sessionKey(sid);
      const row = await this.repo().findOneBy({ sid: key });
      if (!row) return null;
      if (!this.isLive(row)) {
        await this.repo().delete({ sid: key });
        return null;
      }
      return JSON.parse(row.data) as session.SessionData;
    };
    run().then((s) => cb(null, s), cb);
  }

  override set(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void): void {
    const run = async () => {
      const key = sessionKey(sid);
      const userId = sess.passport?.user;
      if (typeof userId !== 'number') {
        await this.repo().delete({ sid: key }); // not signed in (or just signed out): nothing to keep
        return;
      }
      const now = Date.now();
      // insert with a fresh public id and sign-in time; on conflict keep both and update the rest
      await this.repo()
        .createQueryBuilder()
        .insert()
        .values({
          sid: key,
          publicId: crypto.randomBytes(16).toString('base64url'),
          userId,
          expiresAt: this.expiry(sess),
          createdAt: now,
          lastSeenAt: now,
          userAgent: (sess.client?.userAgent ?? '').slice(0, 160),
          ip: (sess.client?.ip ?? '').slice(0, 64),
          data: JSON.stringify(sess),
        })
        .orUpdate(['userId', 'expiresAt', 'lastSeenAt', 'userAgent', 'ip', 'data'], ['sid'])
        .execute();
      if (++this.writes % 100 === 0) await this.sweep(now);
    };
    run().then(() => cb?.(), (e) => cb?.(e));
  }

  /**
   * Moves the idle expiry forward, but only when it would move by touchEveryMs or more: one conditional
   * UPDATE that changes nothing on most requests, instead of a write per GET.
   */
  override touch(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void): void {
    const key = sessionKey(sid);
    const now = Date.now();
    // this process touched it less than touchEveryMs ago: not even the conditional UPDATE is needed
    if (now - (this.touched.get(key) ?? -Infinity) < this.touchEveryMs) return void cb?.();
    if (this.touched.size >= TOUCHED_KEPT) this.touched.clear();
    this.touched.set(key, now);
    const expiresAt = this.expiry(sess);
    this.repo()
      .update({ sid: key, expiresAt: LessThan(expiresAt - this.touchEveryMs) }, { expiresAt, lastSeenAt: now })
      .then(() => cb?.(), (e) => cb?.(e));
  }

  override destroy(sid: string, cb?: (err?: unknown) => void): void {
    this.repo().delete({ sid: sessionKey(sid) }).then(() => cb?.(), (e) => cb?.(e));
  }

  /** Deletes rows past their idle expiry or their absolute lifetime. */
  async sweep(now = Date.now()): Promise<void> {
    await this.repo().delete({ expiresAt: LessThan(now) });
    await this.repo().delete({ createdAt: LessThan(now - this.maxAgeMs) });
  }
}
