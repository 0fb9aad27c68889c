import { Column, Entity, Index, type Relation } from 'typeorm';
import { CreatorColumn, DepartmentColumn, ProductionItem } from './production-item';
import type { User } from './user.entity';
import type { Department } from '../../../shared/schemas/roles';
import type { PhotoFormat } from '../../../shared/schemas/photo';

/**
 * An uploaded reference photo. The files live under `${dataDir}/uploads/photos/<storageKey>/`: the
 * original as uploaded, and an sRGB preview and thumbnail made from it (orientation applied, embedded
 * ICC profile converted). Width and height are those of the oriented image.
 */
@Entity('photos')
@Index(['production', 'createdAt'])
export class Photo extends ProductionItem {
  /** the department of the member who uploaded it (contributors edit their own department's photos) */
  @DepartmentColumn() department: Department;
  /** the format read from the content: jpeg, png, tiff or webp */
  @Column({ type: 'varchar', length: 10 }) format: PhotoFormat;
  /** bits per channel of the original: 8 or 16 */
  @Column({ type: 'integer' }) bitDepth: number;
  @Column({ type: 'integer' }) width: number;
  @Column({ type: 'integer' }) height: number;
  @Column({ type: 'integer' }) previewWidth: number;
  @Column({ type: 'integer' }) previewHeight: number;
  /** size of the original file, bytes */
  @Column({ type: 'integer' }) fileBytes: number;
  /** the embedded ICC profile's description, null when there was none (the image is taken as sRGB) */
  @Column({ type: 'varchar', length: 200, nullable: true }) iccProfile: string | null;
  /** the EXIF orientation tag (1..8) that was applied; 1 = none */
  @Column({ type: 'integer', default: 1 }) orientation: number;
  /** random directory name of the files (never taken from the upload) */
  @Column({ type: 'varchar', length: 64, unique: true }) storageKey: string;
  /** the file name given at upload, for the download name only */
  @Column({ type: 'varchar', length: 200, default: '' }) originalName: string;
  /** marks invented demo content */
  @Column({ type: 'boolean', default: false }) isDemo: boolean;
  @CreatorColumn() uploadedBy: Relation<User> | null;
}
