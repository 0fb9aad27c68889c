/**
 * Reads a table of wavelength and value from a CSV, TSV, semicolon or whitespace-separated text, as
 * spectrometers, data sheets and spreadsheets export it. Parsing is done by papaparse; this file only
 * decides the delimiter, the decimal mark, which lines are headers and how to name a bad line.
 *
 * Rules (the same on the client, for the preview, and on the server, before anything is saved):
 * - Delimiter: tab if any data line has one, else semicolon, else comma, else runs of spaces.
 * - Decimal comma: accepted when the delimiter is not a comma ("550;0,85"), or in a quoted field
 *   of a comma file ("550,\"0,85\"").
 * - Header rows: every line before the first one that starts with a number is a header (kept, shown).
 * - Lines starting with `#` are comments; fully blank lines are skipped (they carry nothing).
 * - After the data starts, a line with a missing or non-numeric wavelength or value is an error that
 *   names the line (1-based, as an editor shows it) and the problem. Nothing partial is returned.
 * - Wavelengths are in nm; values keep the file's units (the caller names the basis).
 */
import Papa from 'papaparse';

/** One data point with the 1-based line it came from. */
export interface CurveTablePoint {
  nm: number;
  value: number;
  line: number;
}

export type CurveTableDelimiter = 'tab' | 'semicolon' | 'comma' | 'space';

export interface CurveTable {
  /** `[nm, value]` pairs in file order */
  pairs: [number, number][];
  /** the 1-based line of each pair, same order */
  lines: number[];
  delimiter: CurveTableDelimiter;
  /** true when at least one number used a decimal comma */
  decimalComma: boolean;
  /** header lines found before the data, as text */
  headers: string[];
  /** column index (0-based) the values were read from */
  valueColumn: number;
}

/** A file that cannot be read, with the 1-based line at fault (0 when it is the file as a whole). */
export class CurveTableError extends Error {
  readonly name = 'CurveTableError';
  constructor(
    readonly line: number,
    readonly problem: string,
  ) {
    super(line > 0 ? `line ${line}: ${problem}` : problem);
  }
}

export interface CurveTableOptions {
  /** 0-based column of the values (default 1: the column after the wavelength) */
  valueColumn?: number;
  /** largest text accepted, characters (default 1 000 000) */
  maxChars?: number;
}

const NUMBER = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/;
const DELIMS: Record<CurveTableDelimiter, string> = { tab: '\t', semicolon: ';', comma: ',', space: '\t' };

/** A field as a number (decimal point, or decimal comma when `commaOk`); null when it is not one. */
function toNumber(field: string, commaOk: boolean): { value: number; comma: boolean } | null {
  const s = field.trim();
  if (!NUMBER.test(s)) return null;
  const comma = s.includes(',');
  if (comma && !commaOk) return null;
  const v = Number(s.replace(',', '.'));
  return Number.isFinite(v) ? { value: v, comma } : null;
}

function isComment(line: string): boolean {
  return line.trimStart().startsWith('#');
}

function chooseDelimiter(lines: string[]): CurveTableDelimiter {
  const body = lines.filter((l) => l.trim() && !isComment(l) && /^\s*"?[+-]?[\d.]/.test(l));
  const sample = body.length ? body : lines;
  if (sample.some((l) => l.includes('\t'))) return 'tab';
  if (sample.some((l) => l.includes(';'))) return 'semicolon';
  if (sample.some((l) => l.includes(','))) return 'comma';
  return 'space';
}

/**
 * Parses a wavelength/value table (see the rules above). Wavelength in nm, value in the file's units.
 * Throws CurveTableError naming the line and the problem; returns at least one point otherwise.
 */
export function parseCurveTable(text: string, opts: CurveTableOptions = {}): CurveTable {
  const maxChars = opts.maxChars ?? 1_000_000;
  const valueColumn = opts.valueColumn ?? 1;
  if (typeof text !== 'string' || !text.trim()) throw new CurveTableError(0, 'the file is empty');
  if (text.length > maxChars) throw new CurveTableError(0, `the file is too long (${text.length} characters; at most ${maxChars})`);
  const clean = text.replace(/^\uFEFF/, '');
  const rawLines = clean.split(/\r\n|\r|\n/);
  const delimiter = chooseDelimiter(rawLines);
  // Whitespace tables: runs of spaces and tabs become one tab, so papaparse sees one delimiter.
  const input = delimiter === 'space' ? rawLines.map((l) => l.trim().replace(/[ \t]+/g, '\t')).join('\n') : rawLines.join('\n');
  const parsed = Papa.parse<string[]>(input, { delimiter: DELIMS[delimiter], skipEmptyLines: false, newline: '\n' });
  const quoteError = parsed.errors.find((e) => e.type === 'Quotes');
  if (quoteError) throw new CurveTableError((quoteError.row ?? 0) + 1, 'a quoted field is not closed');
  if (parsed.data.length !== rawLines.length) throw new CurveTableError(0, 'a quoted field spans several lines; put one point on each line');

  const headers: string[] = [];
  const pairs: [number, number][] = [];
  const lineNos: number[] = [];
  let decimalComma = false;
  let started = false;
  parsed.data.forEach((fields, i) => {
    const line = i + 1;
    const raw = rawLines[i];
    if (!raw.trim() || isComment(raw)) return;
    const commaOk = delimiter !== 'comma' || /"[^"]*,[^"]*"/.test(raw);
    const first = toNumber(fields[0] ?? '', commaOk);
    if (!started && !first) {
      headers.push(raw.trim());
      return;
    }
    started = true;
    if (!first) {
      const f = (fields[0] ?? '').trim();
      throw new CurveTableError(line, f ? `the wavelength "${f}" is not a number` : 'the wavelength is missing');
    }
    const field = fields[valueColumn];
    if (field === undefined || !field.trim()) {
      throw new CurveTableError(line, `there is no value after ${first.value} nm${fields.length < valueColumn + 1 ? ` (expected at least ${valueColumn + 1} columns)` : ''}`);
    }
    const v = toNumber(field, commaOk);
    if (!v) {
      const hint = delimiter === 'comma' && /^\s*[+-]?\d+$/.test(field) && fields.length > valueColumn + 1 ? '; a decimal comma in a comma-separated file must be quoted, or use semicolons' : '';
      throw new CurveTableError(line, `the value "${field.trim()}" at ${first.value} nm is not a number${hint}`);
    }
    if (first.comma || v.comma) decimalComma = true;
    pairs.push([first.value, v.value]);
    lineNos.push(line);
  });
  if (!pairs.length) throw new CurveTableError(0, 'no data lines: expected lines of wavelength (nm) and value');
  if (delimiter === 'comma' && opts.valueColumn === undefined && looksLikeBareDecimalCommas(parsed.data, lineNos)) {
    throw new CurveTableError(
      lineNos[0],
      'every line reads as three whole numbers, as decimal commas in a comma-separated file would; separate the columns with semicolons or tabs, quote the values, or choose the value column',
    );
  }
  const maxNm = Math.max(...pairs.map((p) => p[0]));
  if (maxNm < 10) throw new CurveTableError(lineNos[0], `the wavelengths look like micrometres (largest ${maxNm}); give them in nm`);
  return { pairs, lines: lineNos, delimiter, decimalComma, headers, valueColumn };
}

/** True when every data line of a comma file is `int,int,digits` (e.g. "380,0,12" meant as 380 nm → 0,12). */
function looksLikeBareDecimalCommas(rows: string[][], lines: number[]): boolean {
  return lines.every((l) => {
    const f = rows[l - 1];
    return f.length === 3 && /^\s*\d+\s*$/.test(f[1]) && /^\s*\d+\s*$/.test(f[2]);
  });
}

/**
 * The file line of pair `index` (as in an engine error path `[index, …]`); 0 when out of range.
 */
export function lineOfPair(table: Pick<CurveTable, 'lines'>, index: number): number {
  return table.lines[index] ?? 0;
}
