import { Column, Entity } from 'typeorm';
import { AuthoredItem } from './production-item';
import type { LookFilter, LookLight, LookMedium } from '../../../shared/schemas/look';
import type { ToneSettings } from '../../../shared/schemas/exposure';

/** A saved look: light, an ordered stack of filters (each on the lens or the light), medium, tone settings. */
@Entity('looks')
export class Look extends AuthoredItem {
  @Column({ type: 'simple-json' }) light: LookLight;
  @Column({ type: 'simple-json' }) filters: LookFilter[];
  @Column({ type: 'simple-json' }) medium: LookMedium;
  /** development, rating, print and key settings (shared/schemas/exposure toneSettingsSchema) */
  @Column({ type: 'simple-json' }) tone: ToneSettings;
}
