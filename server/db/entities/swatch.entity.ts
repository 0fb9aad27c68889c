import { Column, Entity, Index } from 'typeorm';
import { DepartmentItem } from './production-item';
import type { SwatchOrigin } from '../../../shared/schemas/swatch';

/**
 * A surface. Measured swatches keep their reflectance on the working grid (fraction 0..1); colour and
 * photo swatches keep only their sRGB colour, and the engine estimates a spectrum for them.
 */
@Entity('swatches')
@Index(['production', 'department'])
export class Swatch extends DepartmentItem {
  /** how it was given: colour (hex / RGB / L*a*b*), measured table, or a photo region */
  @Column({ type: 'simple-json' }) origin: SwatchOrigin;
  /** its colour to the eye as sRGB '#rrggbb' (for measured swatches: under D65) */
  @Column({ type: 'varchar', length: 7 }) hex: string;
  /** measured reflectance `[nm, 0..1]` on the grid; null when the spectrum is estimated from the colour */
  @Column({ type: 'simple-json', nullable: true }) reflectance: [number, number][] | null;
}
