import { Column, CreateDateColumn, Entity, JoinTable, ManyToMany, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { Production } from './production.entity';
import type { User } from './user.entity';
import type { Swatch } from './swatch.entity';
import type { Department } from '../../../shared/schemas/roles';

/**
 * A department's board: a set of swatches (any of the production's, e.g. the wall behind a costume)
 * seen through up to four looks, with its merge thresholds.
 */
@Entity('boards')
export class Board {
  @PrimaryGeneratedColumn({ type: 'integer' }) id: number;
  @ManyToOne('Production', { onDelete: 'CASCADE', nullable: false }) production: Relation<Production>;
  @Column({ type: 'varchar', length: 20 }) department: Department;
  @Column({ type: 'varchar', length: 120 }) name: string;
  @Column({ type: 'text', default: '' }) notes: string;
  /** look ids in display order (at most four); ids of deleted looks are dropped when the look is deleted */
  @Column({ type: 'simple-json' }) lookIds: number[];
  /** two swatches merge when within this many stops on the medium … */
  @Column({ type: 'real', default: 1 / 3 }) mergeStops: number;
  /** … yet more than this ΔE00 apart to the eye */
  @Column({ type: 'real', default: 10 }) mergeDeltaE: number;
  @ManyToMany('Swatch', { onDelete: 'CASCADE' })
  @JoinTable({ name: 'board_swatches', joinColumn: { name: 'boardId' }, inverseJoinColumn: { name: 'swatchId' } })
  swatches: Relation<Swatch[]>;
  @ManyToOne('User', { onDelete: 'SET NULL', nullable: true }) createdBy: Relation<User> | null;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
  @UpdateDateColumn({ type: 'datetime' }) updatedAt: Date;
}
