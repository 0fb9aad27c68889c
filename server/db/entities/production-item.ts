import { Column, CreateDateColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { Production } from './production.entity';
import type { User } from './user.entity';
import type { Department } from '../../../shared/schemas/roles';

/**
 * The columns every item of a production has (curve, look, swatch, board, photo): id, the production
 * (deleted with it), name, notes, and when it was made and last changed. Not a table of its own: each
 * entity that extends it gets these columns in its own table (TypeORM's inherited columns).
 */
export abstract class ProductionItem {
  @PrimaryGeneratedColumn({ type: 'integer' }) id: number;
  @ManyToOne('Production', { onDelete: 'CASCADE', nullable: false }) production: Relation<Production>;
  @Column({ type: 'varchar', length: 120 }) name: string;
  @Column({ type: 'text', default: '' }) notes: string;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
  @UpdateDateColumn({ type: 'datetime' }) updatedAt: Date;
}

/** The department an item belongs to (contributors change their own department's items). */
export const DepartmentColumn = () => Column({ type: 'varchar', length: 20 });

/** The member who made an item; null once that account is gone. */
export const CreatorColumn = () => ManyToOne('User', { onDelete: 'SET NULL', nullable: true });

/** A production item with the member who made it. */
export abstract class AuthoredItem extends ProductionItem {
  @CreatorColumn() createdBy: Relation<User> | null;
}

/** A production item of one department, with the member who made it. */
export abstract class DepartmentItem extends AuthoredItem {
  @DepartmentColumn() department: Department;
}
