import type { PhotoView } from '../../../../shared/schemas/photo';

/**
 * The photo's own size upright, px: the original's width and height as stored, swapped when its orientation
 * tag turns it a quarter (5–8), as the preview and the renders are.
 */
export function uprightSize(photo: Pick<PhotoView, 'width' | 'height' | 'orientation'>): { width: number; height: number } {
  return photo.orientation >= 5 && photo.orientation <= 8 ? { width: photo.height, height: photo.width } : { width: photo.width, height: photo.height };
}
