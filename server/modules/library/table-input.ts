import { CurveTableError, lineOfPair, parseCurveTable } from '../../../shared/import/curve-table';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { InvalidError } from '../../errors';
import type { z } from 'zod';
import type { tableInputSchema } from '../../../shared/schemas/swatch';

type TableInput = z.infer<typeof tableInputSchema>;

/** A table read from a file or given as pairs, with the file line of each pair (null for pairs). */
export interface ReadTable {
  pairs: [number, number][];
  lines: number[] | null;
  fileName: string | null;
  headers: string[];
  decimalComma: boolean;
}

/** Parses a table input (file text or pairs); a bad file becomes a 400 naming the line, on `field`.text. */
export function readTable(input: TableInput, field: string): ReadTable {
  if (input.samples) return { pairs: input.samples.map((p) => [p[0], p[1]]), lines: null, fileName: input.fileName ?? null, headers: [], decimalComma: false };
  try {
    const t = parseCurveTable(input.text ?? '', { valueColumn: input.valueColumn });
    return { pairs: t.pairs, lines: t.lines, fileName: input.fileName ?? null, headers: t.headers, decimalComma: t.decimalComma };
  } catch (e) {
    if (e instanceof CurveTableError) throw new InvalidError(`${input.fileName ? `${input.fileName}, ` : ''}${e.message}`, `${field}.text`);
    throw e;
  }
}

/**
 * Runs an engine conversion of the table's pairs; an engine refusal (duplicate wavelength, negative
 * value, too short a range …) becomes a 400 naming the file line (or the pair's index for pairs).
 */
export function withTableErrors<T>(table: ReadTable, field: string, fn: (pairs: [number, number][]) => T): T {
  try {
    return fn(table.pairs);
  } catch (e) {
    if (!(e instanceof SpectralInputError)) throw e;
    const index = typeof e.path[0] === 'number' ? e.path[0] : null;
    if (table.lines) {
      const line = index === null ? 0 : lineOfPair({ lines: table.lines }, index);
      throw new InvalidError(`${table.fileName ? `${table.fileName}, ` : ''}${line ? `line ${line}: ` : ''}${e.reason}`, `${field}.text`);
    }
    throw new InvalidError(index === null ? e.reason : `point ${index + 1}: ${e.reason}`, index === null ? `${field}.samples` : `${field}.samples.${index}`);
  }
}
