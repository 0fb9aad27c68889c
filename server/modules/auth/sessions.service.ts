import type { DataSource, EntityManager } from 'typeorm';
import { Not } from 'typeorm';
import { SessionRow } from '../../db/entities/session.entity';
import { InvalidError, NotFoundError } from '../../errors';
import { sessionKey, type TypeormSessionStore } from './session-store';
import type { SessionInfo } from '../../../shared/schemas/auth';

/** The User-Agent as the list shows it: at most 120 characters. */
function shortAgent(ua: string): string {
  return ua.length > 120 ? `${ua.slice(0, 119)}…` : ua;
}

/**
 * Ends every session of a user ("sign out everywhere", on a password reset), inside the caller's
 * transaction: an exact match on the indexed userId column, nothing loaded into memory.
 */
export async function endAllSessions(m: EntityManager, userId: number): Promise<number> {
  const r = await m.delete(SessionRow, { userId });
  return r.affected ?? 0;
}

/** Ends every session of a user but `keepSid` (the request's own session id). */
export async function endOtherSessions(m: EntityManager, userId: number, keepSid: string): Promise<number> {
  const r = await m.delete(SessionRow, { userId, sid: Not(sessionKey(keepSid)) });
  return r.affected ?? 0;
}

/** A user's own sessions: list them, end one, end all but the current one. */
export class SessionsService {
  constructor(private ds: DataSource, private store: TypeormSessionStore) {}

  /** The user's live sessions, most recently seen first; `currentSid` is the request's own session id. */
  async list(userId: number, currentSid: string): Promise<SessionInfo[]> {
    const rows = await this.ds.getRepository(SessionRow).find({ where: { userId }, order: { lastSeenAt: 'DESC' } });
    const current = sessionKey(currentSid);
    return rows
      .filter((r) => this.store.isLive(r))
      .map((r) => ({
        id: r.publicId,
        createdAt: new Date(Number(r.createdAt)).toISOString(),
        lastSeenAt: new Date(Number(r.lastSeenAt)).toISOString(),
        userAgent: shortAgent(r.userAgent),
        ip: r.ip,
        current: r.sid === current,
      }));
  }

  /** Ends one of the user's other sessions by its public id (404 for someone else's or an unknown one). */
  async end(userId: number, publicId: string, currentSid: string): Promise<void> {
    const repo = this.ds.getRepository(SessionRow);
    const row = await repo.findOneBy({ userId, publicId });
    if (!row) throw new NotFoundError('That session');
    if (row.sid === sessionKey(currentSid)) throw new InvalidError('This is the session you are using; sign out to end it.', 'id');
    await repo.delete({ sid: row.sid, userId });
  }

  /** Ends every session of the user but the current one; answers how many ended. */
  endOthers(userId: number, currentSid: string): Promise<number> {
    return endOtherSessions(this.ds.manager, userId, currentSid);
  }
}
