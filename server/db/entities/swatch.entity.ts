import { Column, CreateDateColumn, Entity, Index, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { Production } from './production.entity';
import type { User } from './user.entity';
import type { Department } from '../../../shared/schemas/roles';
import type { SwatchOrigin } from '../../../shared/schemas/swatch';

/**
 * A surface. Measured swatches keep their reflectance on the working grid (fraction 0..1); colour and
 * photo swatches keep only their sRGB colour, and the engine estimates a spectrum for them.
 */
@Entity('swatches')
@Index(['production', 'department'])
export class Swatch {
  @PrimaryGeneratedColumn({ type: 'integer' }) id: number;
  @ManyToOne('Production', { onDelete: 'CASCADE', nullable: false }) production: Relation<Production>;
  @Column({ type: 'varchar', length: 20 }) department: Department;
  @Column({ type: 'varchar', length: 120 }) name: string;
  @Column({ type: 'text', default: '' }) notes: string;
  /** how it was given: colour (hex / RGB / L*a*b*), measured table, or a photo region */
  @Column({ type: 'simple-json' }) origin: SwatchOrigin;
  /** its colour to the eye as sRGB '#rrggbb' (for measured swatches: under D65) */
  @Column({ type: 'varchar', length: 7 }) hex: string;
  /** measured reflectance `[nm, 0..1]` on the grid; null when the spectrum is estimated from the colour */
  @Column({ type: 'simple-json', nullable: true }) reflectance: [number, number][] | null;
  @ManyToOne('User', { onDelete: 'SET NULL', nullable: true }) createdBy: Relation<User> | null;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
  @UpdateDateColumn({ type: 'datetime' }) updatedAt: Date;
}
