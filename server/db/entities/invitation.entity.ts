import { Column, CreateDateColumn, Entity, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { User } from './user.entity';
import type { Production } from './production.entity';
import type { Role, Department } from '../../../shared/schemas/roles';

@Entity('invitations')
export class Invitation {
  @PrimaryGeneratedColumn({ type: 'integer' }) id: number;
  @ManyToOne('Production', { onDelete: 'CASCADE', nullable: false }) production: Relation<Production>;
  @ManyToOne('User', { onDelete: 'SET NULL', nullable: true }) invitedBy: Relation<User> | null;
  @Column({ type: 'varchar', length: 254 }) email: string;
  @Column({ type: 'varchar', length: 20 }) role: Role;
  @Column({ type: 'varchar', length: 20 }) department: Department;
  /** sha256 of the single-use token; the token itself only travels in the mail */
  @Column({ type: 'varchar', length: 64, unique: true }) tokenHash: string;
  @Column({ type: 'datetime' }) expiresAt: Date;
  @Column({ type: 'datetime', nullable: true }) acceptedAt: Date | null;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}
