/**
 * File names of photos: a photo's name taken from an upload's file name, and the names downloads are
 * served under (the original's as uploaded, a render's made of the photo's and the look's names), with the
 * Content-Disposition that carries them.
 */
import type { Photo } from '../../db/entities/photo.entity';
import type { PhotoFormat } from '../../../shared/schemas/photo';
import { cleanName } from '../../../shared/schemas/names';
import { EXTENSIONS } from './photo-storage';

/** A name from an upload's file name: no extension, no path, no control or invisible characters (names.ts), at most 120 characters. */
export function nameFromFile(original: string | undefined): string {
  const base = (original ?? '').split(/[\\/]/).pop() ?? '';
  const stem = cleanName(base.replace(/\.[^.]*$/, '').replace(/[_]+/g, ' '));
  return ([...(stem || 'Photo')].slice(0, 120).join('') || 'Photo').trim();
}

/** Extensions a download of each format may keep from the uploaded name (others get the format's own). */
const KNOWN_EXTENSIONS: Record<PhotoFormat, string[]> = { jpeg: ['jpg', 'jpeg', 'jpe'], png: ['png'], tiff: ['tif', 'tiff'], webp: ['webp'] };

/**
 * The name an original downloads under: the uploaded file's name as it was (any script, spaces, dashes),
 * its last path segment only, without control or invisible characters (names.ts), with the characters a
 * file name may not hold on common systems (`<>:"/\|?*`) as `_`, no leading or trailing dots or spaces,
 * at most 150 characters; its extension is one of the stored format's (a JPEG named `x.html` downloads as
 * `x.html.jpg`). Without an uploaded name: the photo's name and the format's extension.
 */
export function originalDownloadName(p: Pick<Photo, 'originalName' | 'name' | 'format'>): string {
  const clean = (s: string) =>
    cleanName(s.normalize('NFC'))
      .replace(/[<>:"/\\|?*]/g, '_')
      .replace(/^[\s.]+|[\s.]+$/g, '');
  const given = clean((p.originalName ?? '').split(/[\\/]/).pop() ?? '');
  const ext = /\.([^.]+)$/.exec(given)?.[1]?.toLowerCase();
  const named = given && ext && KNOWN_EXTENSIONS[p.format].includes(ext) ? given : `${given || clean(p.name) || 'photo'}.${EXTENSIONS[p.format]}`;
  const chars = [...named];
  if (chars.length <= 150) return named;
  const suffix = `.${EXTENSIONS[p.format]}`;
  return `${chars.slice(0, 150 - suffix.length).join('').replace(/[\s.]+$/, '')}${suffix}`;
}

/**
 * A Content-Disposition for a download (RFC 6266 §4.1): `attachment`, an ASCII `filename` (accents dropped,
 * anything else non-ASCII, quotes and backslashes as `_`) and, when that is not the name itself, the exact
 * name as `filename*` in UTF-8 percent-encoding (RFC 8187 §3.2.1: only attr-char left as is), which every
 * current browser prefers (RFC 6266 §4.3). Control characters never reach the header (they become `_`).
 */
export function attachmentHeader(given: string): string {
  // a lone surrogate cannot be encoded as UTF-8 (encodeURIComponent would throw): U+FFFD stands for it
  const name = given.replace(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '\uFFFD');
  const ascii = name
    .normalize('NFKD')
    .replace(/\p{M}/gu, '')
    .replace(/[^\x20-\x7e]|["\\]/g, '_');
  if (ascii === name) return `attachment; filename="${ascii}"`;
  const encoded = encodeURIComponent(name).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}

/**
 * One part of a download's file name from a user's name for something: letters (any script, NFC), digits,
 * spaces as hyphens, `.`, `-`; no path separators, quotes, control characters or leading dots; at most 80
 * characters. The header carries it as RFC 6266 `filename*` (UTF-8) with an ASCII `filename` fallback.
 */
export function fileNamePart(name: string, fallback: string): string {
  const safe = name
    .normalize('NFC')
    .replace(/[^\p{L}\p{M}\p{N} .-]+|\.{2,}/gu, ' ')
    .trim()
    .replace(/\s+/g, '-')
    .replace(/-{2,}/g, '-')
    .replace(/^[.-]+|[.-]+$/g, '')
    .slice(0, 80)
    .replace(/[.-]+$/, '');
  return safe || fallback;
}
