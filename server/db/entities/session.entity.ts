import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

/** express-session rows, written by server/modules/auth/session-store.ts */
@Entity('sessions')
export class SessionRow {
  @PrimaryColumn({ type: 'varchar', length: 128 }) sid: string;
  @Index() @Column({ type: 'bigint' }) expiresAt: number;
  @Column({ type: 'text' }) data: string;
}
