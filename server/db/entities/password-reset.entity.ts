import { Column, CreateDateColumn, Entity, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { User } from './user.entity';

@Entity('password_resets')
export class PasswordReset {
  @PrimaryGeneratedColumn({ type: 'integer' }) id: number;
  @ManyToOne('User', { onDelete: 'CASCADE', nullable: false }) user: Relation<User>;
  @Column({ type: 'varchar', length: 64, unique: true }) tokenHash: string;
  @Column({ type: 'datetime' }) expiresAt: Date;
  @Column({ type: 'datetime', nullable: true }) usedAt: Date | null;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}
