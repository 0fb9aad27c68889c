import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity('users')
export class User {
  @PrimaryGeneratedColumn({ type: 'integer' }) id: number;
  @Column({ type: 'varchar', length: 254, unique: true }) email: string;
  @Column({ type: 'varchar', length: 120 }) name: string;
  /** scrypt$N$r$p$salt$hash (node:crypto scrypt, memory-hard) */
  @Column({ type: 'varchar', length: 300 }) passwordHash: string;
  @Column({ type: 'boolean', default: false }) isAdmin: boolean;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}
