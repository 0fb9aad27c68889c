/**
 * Reads spectral measurement files in the CGATS.17 text format (ANSI CGATS.17, ISO 28178 "exchange format
 * for colour and process control data using XML or ASCII text"), as spectrophotometers export them, and the
 * same structure as written by Argyll (`.ti3` with many sets, `.sp` with one spectrum). Pure TypeScript.
 *
 * Rules followed (from the standard as we know it; where the standard is strict and exporters are not,
 * we are lenient and say so):
 * - The first line that is not blank or a comment names the file type: one token, e.g. `CGATS.17`,
 *   `IT8.7/2`, Argyll's `CTI3` or `SPECT` (quotes around it are dropped).
 * - Then keyword lines: a keyword and its value (`ORIGINATOR "Lab"`, `NUMBER_OF_SETS 24`); values may be
 *   quoted strings (a `"` opens and the next `"` closes; no escapes), or bare tokens. `KEYWORD "X"`
 *   declares a private keyword X; undeclared private keywords are accepted too (exporters often omit the
 *   declaration). A keyword given twice keeps both values, joined by "; ".
 * - `#` starts a comment anywhere outside a quoted string; blank lines are ignored. Line ends may be
 *   LF, CRLF or CR; a leading byte-order mark is dropped.
 * - `BEGIN_DATA_FORMAT` … `END_DATA_FORMAT` lists the field names (on one or several lines). Field names
 *   must be unique. `NUMBER_OF_FIELDS`, when given, must equal their count.
 * - `BEGIN_DATA` … `END_DATA` holds the sets. The standard only asks for whitespace-separated values; we
 *   require one set per line (every exporter we know writes so), so a bad set can be named by its line.
 *   `NUMBER_OF_SETS`, when given, must equal the number of sets.
 * - A file may hold several tables (Argyll writes e.g. a calibration table after the first): only the
 *   first table is read, and the note says so.
 * - Spectral fields: `SPECTRAL_NM380`, `SPECTRAL_NM_380`, `SPECTRAL_380`, `SPEC_380` (Argyll), `NM380`,
 *   other names (e.g. `R380`) are not guessed; decimal wavelengths such as `SPECTRAL_NM380.5` are read as written.
 *   When `SPECTRAL_BANDS`, `SPECTRAL_START_NM` and `SPECTRAL_END_NM` are given (Argyll) and agree with the
 *   number of spectral fields, the wavelengths are taken from them (Argyll rounds the field names of
 *   non-integer steps); otherwise from the names.
 * - Sample ids: `SAMPLE_ID`, names `SAMPLE_NAME`; each falls back to the other, then to the set's index
 *   (1-based).
 * - Scale: `SPECTRAL_NORM` (Argyll; 1 = fraction, 100 = percent, any other positive number divides) wins;
 *   without it the values are percent when any spectral value exceeds 1.5, else fractions. The choice is
 *   returned as a sentence (`assumption`) for the interface to show.
 * - Errors name the 1-based line (as an editor shows it) and the field: a missing first line or
 *   BEGIN_DATA_FORMAT / END_DATA_FORMAT / BEGIN_DATA / END_DATA, a set with the wrong number of values, a
 *   non-number in a spectral field, counts that disagree, no spectral fields, duplicate fields or
 *   wavelengths, an unclosed quote. Nothing partial is returned.
 * Values are not range-checked here (the engine's reflectance reader does that and names the point).
 */

/** One set (sample) of the file. */
export interface CgatsSample {
  /** SAMPLE_ID, else SAMPLE_NAME, else the set's 1-based index */
  id: string;
  /** SAMPLE_NAME, else SAMPLE_ID, else "Sample <index>" */
  name: string;
  /** the 1-based line of the set */
  line: number;
  /** `[nm, value]` with the value as a fraction (0..1 for ordinary surfaces), in the order of the fields */
  pairs: [number, number][];
  /** `[nm, value]` as written in the file (before dividing by the norm), same order */
  rawPairs: [number, number][];
}

export interface CgatsFile {
  /** the file type named on the first line, e.g. "CGATS.17", "CTI3", "SPECT" */
  fileType: string;
  /** keyword → value (quotes removed); KEYWORD declarations are not included */
  headers: Record<string, string>;
  /** the wavelength of each spectral field, nm, in field order */
  wavelengthsNm: number[];
  /** the spectral field names, in the same order */
  spectralFields: string[];
  /** all field names of the data format */
  fields: string[];
  /** true when the values were read as percent */
  percent: boolean;
  /** what the values were taken to be and why, in a sentence */
  assumption: string;
  samples: CgatsSample[];
}

/** A file that cannot be read: the 1-based line at fault (0 for the file as a whole) and the field, if any. */
export class CgatsError extends Error {
  readonly name = 'CgatsError';
  constructor(
    readonly line: number,
    readonly problem: string,
    readonly field?: string,
  ) {
    super(`${line > 0 ? `line ${line}` : 'the file'}${field ? `, field ${field}` : ''}: ${problem}`);
  }
}

export interface CgatsOptions {
  /** largest text accepted, characters (default 4 000 000) */
  maxChars?: number;
  /** most sets accepted (default 5000) */
  maxSets?: number;
}

/** Values above this (in any spectral field, without SPECTRAL_NORM) mean the file is in percent. */
export const PERCENT_THRESHOLD = 1.5;

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const SPECTRAL_FIELD = /^(?:SPECTRAL_NM_?|SPECTRAL_|SPEC_|NM_?)(\d+(?:\.\d+)?)$/i;
const RESERVED = new Set(['BEGIN_DATA_FORMAT', 'END_DATA_FORMAT', 'BEGIN_DATA', 'END_DATA', 'KEYWORD', 'NUMBER_OF_FIELDS', 'NUMBER_OF_SETS']);

/** True when the text has the two block markers of a CGATS file (so it is not a plain CSV table). */
export function looksLikeCgats(text: string): boolean {
  return /^[ \t]*BEGIN_DATA_FORMAT\b/m.test(text) && /^[ \t]*BEGIN_DATA\b(?!_)/m.test(text);
}

interface Token {
  text: string;
  quoted: boolean;
}

/** The tokens of one line: whitespace-separated, `"…"` as one token, `#` to the end ignored outside quotes. */
function tokenize(raw: string, line: number): Token[] {
  const out: Token[] = [];
  let i = 0;
  while (i < raw.length) {
    const c = raw[i];
    if (c === ' ' || c === '\t') {
      i++;
      continue;
    }
    if (c === '#') break;
    if (c === '"') {
      const end = raw.indexOf('"', i + 1);
      if (end < 0) throw new CgatsError(line, 'a quoted string is not closed (a quote must end on the same line)');
      out.push({ text: raw.slice(i + 1, end), quoted: true });
      i = end + 1;
      continue;
    }
    let j = i;
    while (j < raw.length && raw[j] !== ' ' && raw[j] !== '\t' && raw[j] !== '"' && raw[j] !== '#') j++;
    out.push({ text: raw.slice(i, j), quoted: false });
    i = j;
  }
  return out;
}

function toCount(t: Token | undefined, line: number, keyword: string): number {
  const s = t?.text.trim() ?? '';
  if (!/^\d+$/.test(s)) throw new CgatsError(line, `${keyword} must be a whole number${s ? `, not "${s}"` : ''}`, keyword);
  return Number(s);
}

const fmt = (v: number) => String(Number(v.toPrecision(6)));

/**
 * Parses CGATS.17 / Argyll text (rules above). Throws CgatsError naming the line and field; answers at
 * least one sample with at least one spectral value otherwise. Wavelengths in nm; `pairs` as fractions.
 */
export function parseCgats(text: string, opts: CgatsOptions = {}): CgatsFile {
  const maxChars = opts.maxChars ?? 4_000_000;
  const maxSets = opts.maxSets ?? 5000;
  if (typeof text !== 'string' || !text.trim()) throw new CgatsError(0, 'the file is empty');
  if (text.length > maxChars) throw new CgatsError(0, `the file is too long (${text.length} characters; at most ${maxChars})`);
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);

  let fileType = '';
  const headers: Record<string, string> = {};
  const headerLine: Record<string, number> = {};
  let fields: string[] | null = null;
  let formatLine = 0;
  let numberOfFields: { n: number; line: number } | null = null;
  let numberOfSets: { n: number; line: number } | null = null;
  let state: 'start' | 'header' | 'format' | 'data' | 'done' = 'start';
  const sets: { tokens: Token[]; line: number }[] = [];
  let dataLine = 0;
  let trailing = false;

  for (let i = 0; i < lines.length; i++) {
    const line = i + 1;
    const tokens = tokenize(lines[i], line);
    if (!tokens.length) continue;
    const key = tokens[0].quoted ? '' : tokens[0].text.toUpperCase();
    if (state === 'done') {
      trailing = true;
      break;
    }
    if (state === 'start') {
      if (tokens.length > 1 || RESERVED.has(key)) {
        throw new CgatsError(line, `the first line must name the file type alone (e.g. CGATS.17, CTI3, SPECT), not "${lines[i].trim()}"`);
      }
      fileType = tokens[0].text.trim();
      state = 'header';
      continue;
    }
    if (state === 'header') {
      if (key === 'BEGIN_DATA_FORMAT') {
        if (fields) throw new CgatsError(line, 'a second BEGIN_DATA_FORMAT before the data', 'BEGIN_DATA_FORMAT');
        fields = [];
        formatLine = line;
        state = 'format';
        const rest = tokens.slice(1);
        if (rest.length && rest[rest.length - 1].text.toUpperCase() === 'END_DATA_FORMAT') {
          fields.push(...rest.slice(0, -1).map((t) => t.text));
          state = 'header';
        } else fields.push(...rest.map((t) => t.text));
        continue;
      }
      if (key === 'BEGIN_DATA') {
        if (!fields) throw new CgatsError(line, 'BEGIN_DATA comes before any BEGIN_DATA_FORMAT … END_DATA_FORMAT naming the fields', 'BEGIN_DATA_FORMAT');
        if (tokens.length > 1) throw new CgatsError(line, 'BEGIN_DATA must stand alone on its line; put the sets on the lines after it', 'BEGIN_DATA');
        dataLine = line;
        state = 'data';
        continue;
      }
      if (key === 'END_DATA' || key === 'END_DATA_FORMAT') throw new CgatsError(line, `${key} without a matching BEGIN`, key);
      if (tokens[0].quoted || !/^[A-Za-z_][A-Za-z0-9_.\-/]*$/.test(tokens[0].text)) {
        throw new CgatsError(line, `expected a keyword and its value, or BEGIN_DATA_FORMAT, found "${lines[i].trim()}"`);
      }
      if (key === 'KEYWORD') {
        if (tokens.length !== 2) throw new CgatsError(line, 'KEYWORD declares one keyword name, e.g. KEYWORD "SPECTRAL_NORM"', 'KEYWORD');
        continue;
      }
      if (key === 'NUMBER_OF_FIELDS') numberOfFields = { n: toCount(tokens[1], line, key), line };
      if (key === 'NUMBER_OF_SETS') numberOfSets = { n: toCount(tokens[1], line, key), line };
      const value = tokens.slice(1).map((t) => t.text).join(' ');
      const name = tokens[0].text;
      headers[name] = name in headers ? `${headers[name]}; ${value}` : value;
      headerLine[name] ??= line;
      continue;
    }
    if (state === 'format') {
      const end = tokens.findIndex((t) => !t.quoted && t.text.toUpperCase() === 'END_DATA_FORMAT');
      const names = (end >= 0 ? tokens.slice(0, end) : tokens).map((t) => t.text);
      for (const n of names) {
        if (/^(BEGIN_DATA|END_DATA)$/i.test(n)) throw new CgatsError(line, `${n.toUpperCase()} inside the data format: END_DATA_FORMAT is missing`, 'END_DATA_FORMAT');
      }
      fields!.push(...names);
      if (end >= 0) {
        if (end < tokens.length - 1) throw new CgatsError(line, 'nothing may follow END_DATA_FORMAT on its line', 'END_DATA_FORMAT');
        state = 'header';
      }
      continue;
    }
    // data
    if (key === 'END_DATA' && tokens.length === 1) {
      state = 'done';
      continue;
    }
    if (key === 'BEGIN_DATA' || key === 'BEGIN_DATA_FORMAT') throw new CgatsError(line, `${key} inside the data: END_DATA is missing before it`, 'END_DATA');
    if (sets.length >= maxSets) throw new CgatsError(line, `more than ${maxSets} sets; split the file`);
    sets.push({ tokens, line });
  }

  if (state === 'start') throw new CgatsError(0, 'the file has only comments and blank lines');
  if (state === 'format') throw new CgatsError(formatLine, 'END_DATA_FORMAT is missing after BEGIN_DATA_FORMAT', 'END_DATA_FORMAT');
  if (!fields) throw new CgatsError(0, 'BEGIN_DATA_FORMAT is missing: a CGATS file names its fields between BEGIN_DATA_FORMAT and END_DATA_FORMAT', 'BEGIN_DATA_FORMAT');
  if (state === 'header') throw new CgatsError(0, 'BEGIN_DATA is missing: the sets go between BEGIN_DATA and END_DATA', 'BEGIN_DATA');
  if (state === 'data') throw new CgatsError(lines.length, `END_DATA is missing (the data began on line ${dataLine})`, 'END_DATA');

  if (!fields.length) throw new CgatsError(formatLine, 'the data format names no fields', 'BEGIN_DATA_FORMAT');
  const seen = new Map<string, number>();
  fields.forEach((f, k) => {
    const u = f.toUpperCase();
    if (seen.has(u)) throw new CgatsError(formatLine, `the field ${f} is named twice (fields ${seen.get(u)! + 1} and ${k + 1})`, f);
    seen.set(u, k);
  });
  if (numberOfFields && numberOfFields.n !== fields.length) {
    throw new CgatsError(numberOfFields.line, `NUMBER_OF_FIELDS says ${numberOfFields.n} but the data format names ${fields.length}`, 'NUMBER_OF_FIELDS');
  }
  if (numberOfSets && numberOfSets.n !== sets.length) {
    throw new CgatsError(numberOfSets.line, `NUMBER_OF_SETS says ${numberOfSets.n} but the data hold ${sets.length} set${sets.length === 1 ? '' : 's'}`, 'NUMBER_OF_SETS');
  }
  if (!sets.length) throw new CgatsError(dataLine, 'there are no sets between BEGIN_DATA and END_DATA', 'BEGIN_DATA');

  // spectral fields and their wavelengths
  const spectral: { index: number; field: string; nm: number }[] = [];
  fields.forEach((f, index) => {
    const m = SPECTRAL_FIELD.exec(f);
    if (m) spectral.push({ index, field: f, nm: Number(m[1]) });
  });
  if (!spectral.length) {
    throw new CgatsError(formatLine, `no spectral fields (named like SPECTRAL_NM380 or SPEC_380) among ${fields.slice(0, 12).join(', ')}${fields.length > 12 ? ', …' : ''}`, 'BEGIN_DATA_FORMAT');
  }
  const notes: string[] = [];
  const bandsKey = findKey(headers, 'SPECTRAL_BANDS');
  if (bandsKey) {
    const bands = Number(headers[bandsKey]);
    if (!Number.isInteger(bands) || bands !== spectral.length) {
      throw new CgatsError(headerLine[bandsKey], `SPECTRAL_BANDS says ${headers[bandsKey]} but the data format has ${spectral.length} spectral field${spectral.length === 1 ? '' : 's'}`, 'SPECTRAL_BANDS');
    }
    const startKey = findKey(headers, 'SPECTRAL_START_NM');
    const endKey = findKey(headers, 'SPECTRAL_END_NM');
    const start = startKey ? Number(headers[startKey]) : NaN;
    const end = endKey ? Number(headers[endKey]) : NaN;
    if (bands > 1 && Number.isFinite(start) && Number.isFinite(end) && end > start) {
      const step = (end - start) / (bands - 1);
      const named = spectral.every((s, k) => Math.abs(s.nm - (start + k * step)) <= 0.5 + 1e-9);
      if (!named) throw new CgatsError(formatLine, `the spectral field names do not match SPECTRAL_START_NM ${fmt(start)}, SPECTRAL_END_NM ${fmt(end)} and SPECTRAL_BANDS ${bands}`, spectral[0].field);
      spectral.forEach((s, k) => (s.nm = Number((start + k * step).toFixed(6))));
      if (!Number.isInteger(step)) notes.push(`wavelengths from SPECTRAL_START_NM–SPECTRAL_END_NM in ${bands} bands (${fmt(step)} nm steps)`);
    }
  }
  const byNm = new Map<number, string>();
  for (const s of spectral) {
    const other = byNm.get(s.nm);
    if (other !== undefined) throw new CgatsError(formatLine, `wavelength ${s.nm} nm appears twice (${other} and ${s.field})`, s.field);
    byNm.set(s.nm, s.field);
  }

  // the sets
  const upper = fields.map((f) => f.toUpperCase());
  const idIndex = upper.indexOf('SAMPLE_ID');
  const nameIndex = upper.indexOf('SAMPLE_NAME');
  let largest = -Infinity;
  const raw = sets.map(({ tokens, line }, k) => {
    if (tokens.length !== fields.length) {
      throw new CgatsError(line, `the set has ${tokens.length} value${tokens.length === 1 ? '' : 's'}; the data format names ${fields.length} fields`, tokens.length < fields.length ? fields[tokens.length] : undefined);
    }
    const values = spectral.map((s) => {
      const t = tokens[s.index];
      if (t.quoted || !NUMBER.test(t.text)) throw new CgatsError(line, `"${t.text}" is not a number`, s.field);
      const v = Number(t.text);
      if (!Number.isFinite(v)) throw new CgatsError(line, `"${t.text}" is not a finite number`, s.field);
      if (v > largest) largest = v;
      return v;
    });
    const id = idIndex >= 0 ? tokens[idIndex].text.trim() : '';
    const nm = nameIndex >= 0 ? tokens[nameIndex].text.trim() : '';
    return { id: id || nm || String(k + 1), name: nm || id || `Sample ${k + 1}`, line, values };
  });

  // the scale
  const normKey = findKey(headers, 'SPECTRAL_NORM');
  let norm: number;
  let assumption: string;
  if (normKey) {
    norm = Number(headers[normKey]);
    if (!Number.isFinite(norm) || norm <= 0) throw new CgatsError(headerLine[normKey], `SPECTRAL_NORM must be a positive number, not "${headers[normKey]}"`, 'SPECTRAL_NORM');
    assumption =
      norm === 100 ? 'Values read as percent (÷ 100): the file says SPECTRAL_NORM 100.'
      : norm === 1 ? 'Values read as fractions (0..1): the file says SPECTRAL_NORM 1.'
      : `Values divided by ${fmt(norm)}: the file says SPECTRAL_NORM ${headers[normKey]}.`;
  } else if (largest > PERCENT_THRESHOLD) {
    norm = 100;
    assumption = `Values read as percent (÷ 100): the file gives no SPECTRAL_NORM and its largest value is ${fmt(largest)}, above ${PERCENT_THRESHOLD}.`;
  } else {
    norm = 1;
    assumption = `Values read as fractions (0..1): the file gives no SPECTRAL_NORM and no value exceeds ${PERCENT_THRESHOLD} (largest ${fmt(largest)}). If they are percent, add SPECTRAL_NORM 100 to the header.`;
  }
  if (notes.length) assumption += ` Also: ${notes.join('; ')}.`;
  if (trailing) assumption += ' The file holds more than one table; only the first was read.';

  return {
    fileType,
    headers,
    wavelengthsNm: spectral.map((s) => s.nm),
    spectralFields: spectral.map((s) => s.field),
    fields: [...fields],
    percent: norm === 100,
    assumption,
    samples: raw.map((r) => ({
      id: r.id,
      name: r.name,
      line: r.line,
      rawPairs: r.values.map((v, k) => [spectral[k].nm, v] as [number, number]),
      pairs: r.values.map((v, k) => [spectral[k].nm, v / norm] as [number, number]),
    })),
  };
}

/** The header keyword named `name`, in any case; undefined when absent. */
function findKey(headers: Record<string, string>, name: string): string | undefined {
  return Object.keys(headers).find((k) => k.toUpperCase() === name);
}

/** The sample whose id or name is `choice` (ids first, then names, then a 1-based index); undefined when none. */
export function pickCgatsSample(file: Pick<CgatsFile, 'samples'>, choice: string): CgatsSample | undefined {
  const c = choice.trim();
  return file.samples.find((s) => s.id === c) ?? file.samples.find((s) => s.name === c) ?? (/^\d+$/.test(c) ? file.samples[Number(c) - 1] : undefined);
}
