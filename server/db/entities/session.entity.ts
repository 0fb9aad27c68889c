import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

/**
 * express-session rows, written by server/modules/auth/session-store.ts. Only signed-in sessions are
 * stored (anonymous visitors carry a CSRF cookie instead, server/middleware/csrf.ts).
 */
@Entity('sessions')
export class SessionRow {
  /** sha256(session id), hex: a copy of the table does not hand out usable cookies (issue 14 item 6) */
  @PrimaryColumn({ type: 'varchar', length: 64 }) sid: string;
  /** an opaque random handle for the session list (GET /api/auth/sessions); never derived from the sid */
  @Column({ type: 'varchar', length: 32, unique: true }) publicId: string;
  /** the signed-in user (sess.passport.user), so "sign out everywhere" deletes by an exact, indexed match */
  @Index('IDX_sessions_userId') @Column({ type: 'integer', nullable: true }) userId: number | null;
  /** rolling idle expiry, ms since the epoch */
  @Index() @Column({ type: 'bigint' }) expiresAt: number;
  /** when the row was first written (the sign-in): the absolute lifetime counts from here, ms */
  @Column({ type: 'bigint' }) createdAt: number;
  /** the last time the store touched the row (at most once a minute), ms */
  @Column({ type: 'bigint' }) lastSeenAt: number;
  /** the browser's User-Agent at sign-in, cut short; shown in the session list */
  @Column({ type: 'varchar', length: 160, default: '' }) userAgent: string;
  /** the client address at sign-in; shown in the session list */
  @Column({ type: 'varchar', length: 64, default: '' }) ip: string;
  @Column({ type: 'text' }) data: string;
}
