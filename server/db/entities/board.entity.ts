import { Column, Entity, JoinTable, ManyToMany, RelationId, type Relation } from 'typeorm';
import { DepartmentItem } from './production-item';
import type { Swatch } from './swatch.entity';

/**
 * A department's board: a set of swatches (any of the production's, e.g. the wall behind a costume)
 * seen through up to four looks, with its merge thresholds.
 */
@Entity('boards')
export class Board extends DepartmentItem {
  /** look ids in display order (at most four); ids of deleted looks are dropped when the look is deleted */
  @Column({ type: 'simple-json' }) lookIds: number[];
  /** two swatches merge when within this many stops on the medium … */
  @Column({ type: 'real', default: 1 / 3 }) mergeStops: number;
  /** … yet more than this ΔE00 apart to the eye */
  @Column({ type: 'real', default: 10 }) mergeDeltaE: number;
  @ManyToMany('Swatch', { onDelete: 'CASCADE' })
  @JoinTable({ name: 'board_swatches', joinColumn: { name: 'boardId' }, inverseJoinColumn: { name: 'swatchId' } })
  swatches: Relation<Swatch[]>;
  /**
   * The ids of its swatches, read from the join table with every load (one light query): a board of 2,000
   * swatches would otherwise load 2,000 entities with their spectra to list them. Read-only; set `swatches`
   * to change the set.
   */
  @RelationId((b: Board) => b.swatches) swatchIds: number[];
}
