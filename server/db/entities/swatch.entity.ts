import { Column, Entity, Index } from 'typeorm';
import { DepartmentItem } from './production-item';
import type { SwatchOrigin } from '../../../shared/schemas/swatch';

/**
 * A surface. Measured swatches keep their reflectance on the working grid (fraction 0..1); skin and makeup
 * swatches keep their model parameters in `origin` and the model's reflectance here; colour and photo
 * swatches keep only their sRGB colour, and the engine estimates a spectrum for them.
 */
@Entity('swatches')
@Index(['production', 'department'])
export class Swatch extends DepartmentItem {
  /** how it was given: colour (hex / RGB / L*a*b*), measured table, or a photo region */
  @Column({ type: 'simple-json' }) origin: SwatchOrigin;
  /** its colour to the eye as sRGB '#rrggbb' (for measured swatches: under D65) */
  @Column({ type: 'varchar', length: 7 }) hex: string;
  /**
   * reflectance `[nm, 0..1]` on the grid: measured, or the skin/makeup model's (recomputed when its
   * parameters change); null when the spectrum is estimated from the colour
   */
  @Column({ type: 'simple-json', nullable: true }) reflectance: [number, number][] | null;
  /** its own light against the key, stops (+ lit hotter, − under); tones move by it */
  @Column({ type: 'real', default: 0 }) lightStops: number;
}
