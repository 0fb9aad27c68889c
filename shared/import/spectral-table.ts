/**
 * One spectrum from an uploaded text, whatever its form: a CGATS.17 / Argyll file (recognised by its
 * BEGIN_DATA_FORMAT and BEGIN_DATA lines; cgats.ts) gives the one sample it holds, or the sample chosen;
 * anything else is read as a wavelength/value table (curve-table.ts). Values keep the file's numbers (the
 * caller names the basis); each point keeps its line, and for CGATS its field. Used by the library's curve
 * upload and the single measured swatch, on the client for the preview and on the server before saving.
 */
import { CgatsError, looksLikeCgats, parseCgats, pickCgatsSample } from './cgats';
import { CurveTableError, parseCurveTable } from './curve-table';

export interface SpectralTable {
  /** `[nm, value]` in file order, the file's numbers */
  pairs: [number, number][];
  /** the 1-based line of each pair */
  lines: number[];
  /** the CGATS field of each pair; null for a plain table */
  fields: string[] | null;
  /** header lines (plain table) or `KEYWORD value` lines (CGATS) */
  headers: string[];
  decimalComma: boolean;
  /** for a CGATS file: its type, the sample read, how many it holds, and what its values look like */
  cgats: { fileType: string; sampleId: string; sampleName: string; sampleCount: number; samples: { id: string; name: string }[]; percent: boolean; assumption: string } | null;
}

export interface SpectralTableOptions {
  /** 0-based value column of a plain table */
  valueColumn?: number;
  /** the CGATS sample to read (its SAMPLE_ID, SAMPLE_NAME or 1-based index); needed when it holds several */
  sample?: string;
}

/** Either reader's error: `line` (1-based, 0 for the whole file) and `message` naming it. */
export type SpectralTableError = CurveTableError | CgatsError;
export const isSpectralTableError = (e: unknown): e is SpectralTableError => e instanceof CurveTableError || e instanceof CgatsError;

/** Reads one spectrum (rules above); throws CurveTableError or CgatsError naming the line. */
export function readSpectralTable(text: string, opts: SpectralTableOptions = {}): SpectralTable {
  if (!looksLikeCgats(text)) {
    const t = parseCurveTable(text, { valueColumn: opts.valueColumn });
    return { pairs: t.pairs, lines: t.lines, fields: null, headers: t.headers, decimalComma: t.decimalComma, cgats: null };
  }
  const f = parseCgats(text);
  const list = f.samples.map((s) => `${s.name}${s.id !== s.name ? ` (${s.id})` : ''}`);
  let s = f.samples[0];
  if (opts.sample) {
    const found = pickCgatsSample(f, opts.sample);
    if (!found) throw new CgatsError(0, `no sample "${opts.sample}"; the file holds ${list.slice(0, 20).join(', ')}${list.length > 20 ? ', …' : ''}`, 'sample');
    s = found;
  } else if (f.samples.length > 1) {
    throw new CgatsError(0, `the file holds ${f.samples.length} samples (${list.slice(0, 20).join(', ')}${list.length > 20 ? ', …' : ''}); one curve takes one: choose the sample`, 'sample');
  }
  return {
    pairs: s.rawPairs,
    lines: s.rawPairs.map(() => s.line),
    fields: f.spectralFields,
    headers: Object.entries(f.headers).map(([k, v]) => `${k} ${v}`),
    decimalComma: false,
    cgats: {
      fileType: f.fileType,
      sampleId: s.id,
      sampleName: s.name,
      sampleCount: f.samples.length,
      samples: f.samples.map((x) => ({ id: x.id, name: x.name })),
      percent: f.percent,
      assumption: f.assumption,
    },
  };
}

/** The samples of a CGATS text (for a chooser), or null when the text is not CGATS or cannot be read. */
export function cgatsSampleList(text: string): { id: string; name: string }[] | null {
  if (!looksLikeCgats(text)) return null;
  try {
    return parseCgats(text).samples.map((s) => ({ id: s.id, name: s.name }));
  } catch (e) {
    if (e instanceof CgatsError) return null;
    throw e;
  }
}
