import { Column, Entity, Index, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { Production } from './production.entity';
import type { User } from './user.entity';
import type { ActivityAction, ActivityKind } from '../../../shared/schemas/activity';

/**
 * One line of a production's activity log: who created, changed or deleted which item, and when.
 * Written by the recorder (server/services/activity/activity-recorder.ts) after a production write
 * succeeded; goes with its production; keeps the actor's name when the account is deleted.
 */
@Entity('activity')
@Index(['production', 'id'])
export class ActivityEntry {
  @PrimaryGeneratedColumn({ type: 'integer' }) id: number;
  @ManyToOne('Production', { onDelete: 'CASCADE', nullable: false }) production: Relation<Production>;
  @ManyToOne('User', { onDelete: 'SET NULL', nullable: true }) actor: Relation<User> | null;
  /** the actor's name when they acted, kept when the account goes */
  @Column({ type: 'varchar', length: 120 }) actorName: string;
  @Column({ type: 'varchar', length: 20 }) action: ActivityAction;
  @Column({ type: 'varchar', length: 20 }) kind: ActivityKind;
  /** the item's id (null for a summary such as an import of several swatches) */
  @Column({ type: 'integer', nullable: true }) itemId: number | null;
  /** the item's name (a member's name, an invitation's address) when it was acted on */
  @Column({ type: 'varchar', length: 254 }) itemName: string;
  /** e.g. the changed fields of a PATCH */
  @Column({ type: 'varchar', length: 500, default: '' }) detail: string;
  /** set by the recorder (milliseconds kept; SQLite's datetime('now') would drop them) */
  @Column({ type: 'datetime' }) at: Date;
}
