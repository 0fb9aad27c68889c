import { Column, Entity, Index } from 'typeorm';
import { AuthoredItem } from './production-item';
import type { CurveKind, CurveOrigin } from '../../../shared/schemas/curve';

/**
 * A production's own curve in its library: a light, a filter or a medium. `origin` keeps what was given
 * (a table with its basis, a parametric filter, or a light through a gel) so it can be edited and its
 * source shown; `samples` holds the curve on the working grid in the engine's basis (transmittance 0..1,
 * relative power or relative energy sensitivity, peak 1), computed when it is saved.
 */
@Entity('curves')
@Index(['production', 'kind'])
export class Curve extends AuthoredItem {
  @Column({ type: 'varchar', length: 12 }) kind: CurveKind;
  @Column({ type: 'simple-json' }) origin: CurveOrigin;
  /** `[nm, value]` on the working grid, engine basis */
  @Column({ type: 'simple-json' }) samples: [number, number][];
  /** one line saying where the curve came from */
  @Column({ type: 'text', default: '' }) source: string;
}
