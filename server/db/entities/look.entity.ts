import { Column, CreateDateColumn, Entity, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { Production } from './production.entity';
import type { User } from './user.entity';
import type { LookFilter, LookLight, LookMedium } from '../../../shared/schemas/look';
import type { ToneSettings } from '../../../shared/schemas/exposure';

/** A saved look: light, an ordered stack of filters (each on the lens or the light), medium, tone settings. */
@Entity('looks')
export class Look {
  @PrimaryGeneratedColumn({ type: 'integer' }) id: number;
  @ManyToOne('Production', { onDelete: 'CASCADE', nullable: false }) production: Relation<Production>;
  @Column({ type: 'varchar', length: 120 }) name: string;
  @Column({ type: 'text', default: '' }) notes: string;
  @Column({ type: 'simple-json' }) light: LookLight;
  @Column({ type: 'simple-json' }) filters: LookFilter[];
  @Column({ type: 'simple-json' }) medium: LookMedium;
  /** development, rating, print and key settings (shared/schemas/exposure toneSettingsSchema) */
  @Column({ type: 'simple-json' }) tone: ToneSettings;
  @ManyToOne('User', { onDelete: 'SET NULL', nullable: true }) createdBy: Relation<User> | null;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
  @UpdateDateColumn({ type: 'datetime' }) updatedAt: Date;
}
