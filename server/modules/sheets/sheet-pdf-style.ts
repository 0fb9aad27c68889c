/**
 * The exposure sheet PDF's page, colours and typeface: Inter from @fontsource/inter (WOFF, read by pdfkit's
 * fontkit), Helvetica when the font files cannot be found.
 */
import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';

export const C = { ink: '#1b1a18', soft: '#4a4742', mute: '#77736b', line: '#d9d5ca', sunk: '#ebe8e0', accent: '#1d5c7a', warn: '#c2410c', warnSoft: '#fbe3d6' };
/** A4 portrait with margins that also print on US Letter. */
export const PAGE = { size: 'A4' as const, margin: 42 };

/** The faces registered in a document. */
export interface Faces { reg: string; bold: string; /** Inter is in use (OpenType features available) */ inter: boolean }

/** Inter's WOFF files from @fontsource/inter, or null when they are not installed. */
export function interFiles(): { regular: string; semibold: string } | null {
  try {
    const dir = path.join(path.dirname(createRequire(import.meta.url).resolve('@fontsource/inter/package.json')), 'files');
    const regular = path.join(dir, 'inter-latin-400-normal.woff');
    const semibold = path.join(dir, 'inter-latin-600-normal.woff');
    return fs.existsSync(regular) && fs.existsSync(semibold) ? { regular, semibold } : null;
  } catch {
    return null;
  }
}
