import { Column, CreateDateColumn, Entity, ManyToOne, PrimaryGeneratedColumn, Unique, type Relation } from 'typeorm';
import type { User } from './user.entity';
import type { Production } from './production.entity';
import type { Role, Department } from '../../../shared/schemas/roles';

@Entity('memberships')
@Unique(['user', 'production'])
export class Membership {
  @PrimaryGeneratedColumn({ type: 'integer' }) id: number;
  @ManyToOne('User', { onDelete: 'CASCADE', nullable: false }) user: Relation<User>;
  @ManyToOne('Production', { onDelete: 'CASCADE', nullable: false }) production: Relation<Production>;
  @Column({ type: 'varchar', length: 20 }) role: Role;
  @Column({ type: 'varchar', length: 20 }) department: Department;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}
