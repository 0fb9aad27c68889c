import fs from 'node:fs';
import path from 'node:path';
import sharp, { type Metadata } from 'sharp';
import { AppError, InvalidError } from '../../errors';
import { PREVIEW_WIDTH, THUMB_SIZE, type PhotoFormat, type PhotoView } from '../../../shared/schemas/photo';
import { EXTENSIONS } from './photo-storage';
import { iccDescription } from './icc-description';
import { sharpInput, srgbReader } from '../../services/srgb-reader';

/** Tallest preview kept, px: a 2:3 portrait still gets a preview about 1700 px wide. */
export const PREVIEW_MAX_HEIGHT = 2560;

/** What the ingest learnt about an accepted image: the file fields of a photo (size oriented, px). */
export type IngestedPhoto = Pick<PhotoView, 'format' | 'width' | 'height' | 'previewWidth' | 'previewHeight' | 'fileBytes' | 'iccProfile' | 'orientation'> & {
  bitDepth: 8 | 16;
};

/** The magic numbers of the accepted formats (first bytes of the file). */
export function sniffFormat(head: Uint8Array): PhotoFormat | null {
  const at = (i: number, ...bytes: number[]) => bytes.every((b, k) => head[i + k] === b);
  if (at(0, 0xff, 0xd8, 0xff)) return 'jpeg';
  if (at(0, 0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a)) return 'png';
  if (at(0, 0x49, 0x49, 0x2a, 0x00) || at(0, 0x4d, 0x4d, 0x00, 0x2a) || at(0, 0x49, 0x49, 0x2b, 0x00) || at(0, 0x4d, 0x4d, 0x00, 0x2b)) return 'tiff';
  if (at(0, 0x52, 0x49, 0x46, 0x46) && at(8, 0x57, 0x45, 0x42, 0x50)) return 'webp';
  return null;
}

const NOT_AN_IMAGE = 'The file is not a JPEG, PNG, TIFF or WebP image (checked by its content, not its name).';

/**
 * Checks an uploaded file by its content and writes the sRGB preview and thumbnail (orientation applied,
 * an embedded ICC profile converted to sRGB, transparency flattened on white) into `stagingDir`, then moves
 * the original there as `original.<ext>`. Throws InvalidError (400) with a message for the person, or
 * 413 for too many pixels; on a throw nothing is left in `stagingDir` by this function.
 */
export async function ingestPhoto(file: string, stagingDir: string, limits: { maxPixels: number }): Promise<IngestedPhoto> {
  const fd = fs.openSync(file, 'r');
  const head = Buffer.alloc(16);
  let fileBytes: number;
  try {
    fs.readSync(fd, head, 0, 16, 0);
    fileBytes = fs.fstatSync(fd).size;
  } finally {
    fs.closeSync(fd);
  }
  const sniffed = sniffFormat(head);
  if (!sniffed) throw new InvalidError(NOT_AN_IMAGE, 'file');

  let meta: Metadata;
  try {
    // the header only (no pixels are decoded), so the size check below can name the size
    meta = await sharp(file, { ...sharpInput(limits.maxPixels), limitInputPixels: false }).metadata();
  } catch {
    throw new InvalidError(`The file starts like a ${sniffed.toUpperCase()} image but its header cannot be read; it may be damaged.`, 'file');
  }
  if (meta.format !== sniffed) {
    throw new InvalidError(NOT_AN_IMAGE, 'file');
  }
  const width = meta.width ?? 0;
  const height = meta.height ?? 0;
  if (!width || !height) throw new InvalidError('The image has no size; it may be damaged.', 'file');
  if (width * height > limits.maxPixels) {
    throw new AppError(
      413,
      'too_large',
      `The image is ${width} × ${height} pixels (${(width * height / 1e6).toFixed(1)} megapixels); the limit is ${limits.maxPixels / 1e6} megapixels.`,
      'file',
    );
  }
  const bitDepth = meta.depth === 'uchar' ? 8 : meta.depth === 'ushort' ? 16 : null;
  if (!bitDepth) {
    throw new InvalidError(`The image stores ${meta.depth ?? 'unknown'} samples; Grisaille reads 8 or 16 bits per channel. Save it as 8- or 16-bit.`, 'file');
  }
  if ((meta.channels ?? 0) < 1 || (meta.channels ?? 0) > 4) throw new InvalidError(`The image has ${meta.channels} channels; 1 to 4 are read.`, 'file');

  const orientation = meta.orientation && meta.orientation >= 1 && meta.orientation <= 8 ? meta.orientation : 1;
  const oriented = orientation >= 5 ? { width: height, height: width } : { width, height };

  const previewScale = Math.min(1, PREVIEW_WIDTH / oriented.width, PREVIEW_MAX_HEIGHT / oriented.height);
  const previewWidth = Math.max(1, Math.round(oriented.width * previewScale));
  const previewHeight = Math.max(1, Math.round(oriented.height * previewScale));
  const preview = path.join(stagingDir, 'preview.jpg');
  const thumb = path.join(stagingDir, 'thumb.jpg');
  try {
    // one full decode: this is where a truncated or corrupt file fails
    const base = srgbReader(file, { bits: bitDepth, hasProfile: !!meta.icc, maxPixels: limits.maxPixels }).toColourspace('srgb');
    await base
      .clone()
      .resize({ width: previewWidth, height: previewHeight, fit: 'fill' })
      .jpeg({ quality: 92, chromaSubsampling: '4:4:4' })
      .toFile(preview);
    await sharp(preview).resize({ width: THUMB_SIZE, height: THUMB_SIZE, fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 82 }).toFile(thumb);
  } catch (e) {
    fs.rmSync(preview, { force: true });
    fs.rmSync(thumb, { force: true });
    const why = e instanceof Error ? e.message.replace(/^Vips\w*:\s*/, '').replace(/\s+/g, ' ').slice(0, 160) : '';
    if (/pixel limit/i.test(why)) {
      throw new AppError(413, 'too_large', `The image is larger than ${limits.maxPixels / 1e6} megapixels.`, 'file');
    }
    throw new InvalidError(`The image data is truncated or damaged and cannot be read${why ? ` (${why})` : ''}.`, 'file');
  }
  fs.renameSync(file, path.join(stagingDir, `original.${EXTENSIONS[sniffed]}`));
  return {
    format: sniffed,
    bitDepth,
    width: oriented.width,
    height: oriented.height,
    previewWidth,
    previewHeight,
    fileBytes,
    iccProfile: meta.icc ? (iccDescription(meta.icc) ?? 'embedded profile (unnamed)') : null,
    orientation,
  };
}
