/**
 * Monitoring tables: a look as a 3-D table for on-set monitors and grading tools, in two files.
 *
 * - the plain 3-D cube text format (`TITLE`, `LUT_3D_SIZE N`, `DOMAIN_MIN`/`DOMAIN_MAX`, then N³ lines
 *   "r g b" with the red index changing fastest, as the format's published description has it);
 * - the Academy/ASC Common LUT Format version 3 (S-2014-006, CLF 3.0): a `ProcessList` holding one
 *   `LUT3D` whose `Array dim="N N N 3"` lists the entries with the blue index changing fastest.
 *
 * Input: sRGB-encoded RGB per IEC 61966-2-1 (the app's hex values divided by 255), domain 0..1 on each
 * axis; node i of an axis sits at the encoded value i / (N − 1). Output: r = g = b = the look's grey at
 * that colour, sRGB-encoded 0..1 (the value a board's grey code is × 255 of, before its rounding).
 * Each node's grey is the engine's own, with no table of its own in between: the node's linear value
 * (srgbDecode of i / (N − 1)) → stops through the look's photo model (`pixelStops`, the blend of the
 * upsampling table's node exposures, the same number a swatch of that colour gets on a board) → the
 * look's tone table (`greyOfStops`). Between nodes a monitor interpolates, so a colour off the nodes reads
 * within the table's interpolation error of the board.
 *
 * Pure: no I/O; the writers answer strings.
 */
import { z } from 'zod';
import { greyOfStops } from './tone-curve-table';
import { pixelStops, type PhotoToneModel } from '../photo/look-photo-model';
import { lutNodeEncoded } from '../photo/exposure-lut';
import { srgbDecode } from '../tone/print';

/** Nodes per axis a monitoring table may have, and the default (33³, a common monitor size). */
export const MONITOR_TABLE_SIZE = { min: 17, max: 65, default: 33 } as const;
/** The two file formats. */
export const MONITOR_TABLE_FORMATS = ['cube', 'clf'] as const;
export type MonitorTableFormat = (typeof MONITOR_TABLE_FORMATS)[number];

/** Query of GET …/looks/:lookId/lut: `format` (cube | clf, default cube) and `size` (17..65, default 33). */
export const monitorTableQuerySchema = z.object({
  format: z.enum(MONITOR_TABLE_FORMATS, { message: 'format must be cube or clf' }).default('cube'),
  size: z.coerce
    .number({ message: `size must be a whole number ${MONITOR_TABLE_SIZE.min}..${MONITOR_TABLE_SIZE.max}` })
    .int(`size must be a whole number ${MONITOR_TABLE_SIZE.min}..${MONITOR_TABLE_SIZE.max}`)
    .min(MONITOR_TABLE_SIZE.min, `size must be ${MONITOR_TABLE_SIZE.min}..${MONITOR_TABLE_SIZE.max}`)
    .max(MONITOR_TABLE_SIZE.max, `size must be ${MONITOR_TABLE_SIZE.min}..${MONITOR_TABLE_SIZE.max}`)
    .default(MONITOR_TABLE_SIZE.default),
});
export type MonitorTableQuery = z.infer<typeof monitorTableQuerySchema>;

/** A look's greys at the nodes of an N³ cube. */
export interface MonitorTable {
  /** nodes per axis */
  readonly size: number;
  /** output grey (sRGB-encoded 0..1) at node (r, g, b), index r + N·g + N²·b (red fastest) */
  readonly grey: Float64Array;
}

/** What the files say about the look besides its greys. */
export interface MonitorTableMeta {
  /** the look's name, as the user gave it (escaped or cleaned by the writers) */
  lookName: string;
  /** a stable identifier for the CLF ProcessList's `id` (e.g. from the look's id and content) */
  id: string;
  /** the app's name and version line, e.g. "Grisaille" */
  app: string;
}

/** The input encoding, said the same way in both files. */
export const MONITOR_TABLE_INPUT = 'sRGB-encoded RGB per IEC 61966-2-1 (the same as the app\'s hex values / 255), domain 0..1 on each axis';
/** The output, said the same way in both files. */
export const MONITOR_TABLE_OUTPUT = 'the look\'s output grey, sRGB-encoded 0..1, with R = G = B';

/**
 * The look's grey at every node of an N³ cube (N = `size`, nodes at the encoded values i / (N − 1)):
 * greyOfStops(look tone table, pixelStops(model, linear r, g, b)), sRGB-encoded 0..1, clamped to 0..1.
 */
export function monitorTable(model: PhotoToneModel, size: number): MonitorTable {
  if (!Number.isInteger(size) || size < 2 || size > 129) throw new Error('monitorTable: size must be an integer 2..129');
  const lin = Float64Array.from({ length: size }, (_, i) => srgbDecode(lutNodeEncoded(i, size)));
  const grey = new Float64Array(size * size * size);
  let k = 0;
  for (let b = 0; b < size; b++) {
    for (let g = 0; g < size; g++) {
      for (let r = 0; r < size; r++, k++) {
        const v = greyOfStops(model.tone, pixelStops(model, lin[r], lin[g], lin[b]));
        grey[k] = v < 0 ? 0 : v > 1 ? 1 : v;
      }
    }
  }
  return { size, grey };
}

/** Decimals written per value: 1e-6 of full scale is 0.000255 of an 8-bit code, far below banding. */
export const MONITOR_TABLE_DECIMALS = 6;

/** One line of free text: no control characters or line breaks, at most 200 characters. */
function oneLine(s: string): string {
  return s.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]+/g, ' ').trim().slice(0, 200);
}

/** Text for XML character data and attribute values (XML 1.0): the five special characters escaped. */
export function xmlEscape(s: string): string {
  return oneLine(s).replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;');
}

/** The cube file: header, comments on the input and the look, N³ lines "r g b" with red fastest. */
export function writeCube(t: MonitorTable, meta: MonitorTableMeta): string {
  const name = oneLine(meta.lookName);
  const n = t.size;
  const lines: string[] = [
    `TITLE "${name.replace(/"/g, "'")}"`,
    `# ${oneLine(meta.app)}: monitoring table of the look "${name}"`,
    `# Input: ${MONITOR_TABLE_INPUT}.`,
    '# Not camera log: convert a log signal to sRGB-encoded display values before this table.',
    `# Output: ${MONITOR_TABLE_OUTPUT}.`,
    `# ${n}x${n}x${n} nodes at the encoded values i/${n - 1}; lines in order red fastest, then green, then blue.`,
    `LUT_3D_SIZE ${n}`,
    'DOMAIN_MIN 0 0 0',
    'DOMAIN_MAX 1 1 1',
  ];
  const head = lines.join('\n') + '\n';
  const body = new Array<string>(t.grey.length);
  for (let k = 0; k < t.grey.length; k++) {
    const v = t.grey[k].toFixed(MONITOR_TABLE_DECIMALS);
    body[k] = `${v} ${v} ${v}`;
  }
  return head + body.join('\n') + '\n';
}

/** The Common LUT Format (v3) file: a ProcessList with one 32-bit float LUT3D, entries with blue fastest. */
export function writeClf(t: MonitorTable, meta: MonitorTableMeta): string {
  const n = t.size;
  const name = xmlEscape(meta.lookName);
  const rows = new Array<string>(t.grey.length);
  let k = 0;
  // CLF order: red slowest, blue fastest; the table is stored red fastest (index r + N·g + N²·b)
  for (let r = 0; r < n; r++) {
    for (let g = 0; g < n; g++) {
      for (let b = 0; b < n; b++, k++) {
        const v = t.grey[r + n * (g + n * b)].toFixed(MONITOR_TABLE_DECIMALS);
        rows[k] = `${v} ${v} ${v}`;
      }
    }
  }
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<ProcessList compCLFversion="3.0" id="${xmlEscape(meta.id)}" name="${name}">`,
    `  <Description>${xmlEscape(meta.app)}: monitoring table of the look "${name}"</Description>`,
    `  <InputDescriptor>${xmlEscape(MONITOR_TABLE_INPUT)}; not camera log</InputDescriptor>`,
    `  <OutputDescriptor>${xmlEscape(MONITOR_TABLE_OUTPUT)}</OutputDescriptor>`,
    `  <LUT3D id="${xmlEscape(meta.id)}-lut3d" name="${name}" inBitDepth="32f" outBitDepth="32f" interpolation="trilinear">`,
    `    <Description>${n}x${n}x${n} nodes at the encoded values i/${n - 1}; entries with blue fastest, then green, then red</Description>`,
    `    <Array dim="${n} ${n} ${n} 3">`,
    rows.join('\n'),
    '    </Array>',
    '  </LUT3D>',
    '</ProcessList>',
    '',
  ].join('\n');
}

/** A download's file name from the look's name: plain letters, digits and dashes, and the format's extension. */
export function monitorTableFileName(lookName: string, format: MonitorTableFormat, size: number): string {
  const slug = lookName.normalize('NFKD').replace(/[^\w\s-]/g, '').replace(/_/g, '-').trim().replace(/\s+/g, '-').replace(/-+/g, '-').toLowerCase().slice(0, 60).replace(/^-|-$/g, '');
  return `${slug || 'look'}-${size}.${format}`;
}

/** Content type of each format. */
export const MONITOR_TABLE_TYPES: Record<MonitorTableFormat, string> = { cube: 'text/plain; charset=utf-8', clf: 'application/xml; charset=utf-8' };
