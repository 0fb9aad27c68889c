/**
 * How the server reads an uploaded image: one set of sharp options (the pixel limit against decompression
 * bombs, strict decoding) and one sRGB reader, shared by the upload check and the renderer.
 */
import sharp, { type Sharp, type SharpOptions } from 'sharp';
import { MAX_PHOTO_PIXELS } from '../../shared/schemas/photo';

/** sharp options for every read of an upload: the pixel limit against decompression bombs, and strictness. */
export function sharpInput(maxPixels: number = MAX_PHOTO_PIXELS): SharpOptions {
  return { limitInputPixels: maxPixels, failOn: 'warning', sequentialRead: true };
}

/**
 * A sharp pipeline that reads an upload into sRGB: orientation applied, transparency flattened on white,
 * an embedded ICC profile converted. sharp moves 16-bit images with a profile into Display P3 for
 * processing and would hand those numbers on as if they were sRGB; naming sRGB as the output profile
 * converts them back (8-bit images are processed in sRGB already).
 */
export function srgbReader(input: string | Buffer, opts: { bits: 8 | 16; hasProfile: boolean; maxPixels?: number }): Sharp {
  const s = sharp(input, sharpInput(opts.maxPixels)).rotate().flatten({ background: '#ffffff' });
  return opts.bits === 16 && opts.hasProfile ? s.withIccProfile('srgb', { attach: false }) : s;
}

