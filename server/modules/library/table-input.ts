import { isSpectralTableError, readSpectralTable } from '../../../shared/import/spectral-table';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { InvalidError } from '../../errors';
import type { z } from 'zod';
import type { tableInputSchema } from '../../../shared/schemas/swatch';

type TableInput = z.infer<typeof tableInputSchema>;

/** A table read from a file or given as pairs, with the file line of each pair (null for pairs). */
export interface ReadTable {
  pairs: [number, number][];
  lines: number[] | null;
  /** the CGATS field of each pair (null for a plain table or pairs) */
  fields?: string[] | null;
  fileName: string | null;
  headers: string[];
  decimalComma: boolean;
  /** for a CGATS sample: the file type, the sample's name and what the file's values look like */
  cgats?: { fileType: string; sampleName: string; sampleCount: number; percent: boolean; assumption: string } | null;
}

/**
 * Parses a table input (file text or pairs); a bad file becomes a 400 naming the line, on `field`.text.
 * The text may be a wavelength/value table or a CGATS.17 / Argyll file (one sample, or `sample` chosen).
 */
export function readTable(input: TableInput, field: string): ReadTable {
  if (input.samples) return { pairs: input.samples.map((p) => [p[0], p[1]]), lines: null, fileName: input.fileName ?? null, headers: [], decimalComma: false };
  try {
    const t = readSpectralTable(input.text ?? '', { valueColumn: input.valueColumn, sample: input.sample });
    return { pairs: t.pairs, lines: t.lines, fields: t.fields, fileName: input.fileName ?? null, headers: t.headers, decimalComma: t.decimalComma, cgats: t.cgats };
  } catch (e) {
    if (isSpectralTableError(e)) throw new InvalidError(`${input.fileName ? `${input.fileName}, ` : ''}${e.message}`, `${field}.text`);
    throw e;
  }
}

/**
 * Runs an engine conversion of the table's pairs; an engine refusal (duplicate wavelength, negative
 * value, too short a range …) becomes a 400 naming the file line and, for CGATS, the field (or the pair's
 * index for pairs). The error's field is `errorField` (default `${field}.text`, or `.samples` for pairs).
 */
export function withTableErrors<T>(table: ReadTable, field: string, fn: (pairs: [number, number][]) => T, errorField?: string): T {
  try {
    return fn(table.pairs);
  } catch (e) {
    if (!(e instanceof SpectralInputError)) throw e;
    const index = typeof e.path[0] === 'number' ? e.path[0] : null;
    if (table.lines) {
      // a CGATS set is one line: a refusal of the whole spectrum is still that line's
      const oneLine = table.lines.length > 0 && table.lines.every((l) => l === table.lines![0]) ? table.lines[0] : 0;
      const line = index === null ? oneLine : (table.lines[index] ?? 0);
      const col = index !== null && table.fields?.[index] ? `, field ${table.fields[index]}` : '';
      throw new InvalidError(`${table.fileName ? `${table.fileName}, ` : ''}${line ? `line ${line}${col}: ` : ''}${e.reason}`, errorField ?? `${field}.text`);
    }
    throw new InvalidError(index === null ? e.reason : `point ${index + 1}: ${e.reason}`, errorField ?? (index === null ? `${field}.samples` : `${field}.samples.${index}`));
  }
}
