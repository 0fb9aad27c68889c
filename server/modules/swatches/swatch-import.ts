/**
 * Swatches from a spectrophotometer file (CGATS.17 text, ISO 28178; Argyll .ti3 / .sp): the upload's bytes
 * as text, the file read by the shared reader (shared/import/cgats.ts), and every sample made into a measured
 * swatch by the same path a single measured swatch takes (`measuredFromTable`: the engine's reflectance
 * reader, the D65 hex). Everything is resolved before anything is written, so a bad sample refuses the
 * whole file with a 400 naming its line and field.
 */
import { CgatsError, looksLikeCgats, parseCgats, type CgatsFile, type CgatsSample } from '../../../shared/import/cgats';
import { itemNameSchema } from '../../../shared/schemas/item';
import { cleanName } from '../../../shared/schemas/names';
import { MAX_IMPORT_SAMPLES, type SwatchImportPreview, type SwatchOrigin } from '../../../shared/schemas/swatch';
import { InvalidError } from '../../errors';
import type { ReadTable } from '../library/table-input';
import { measuredFromTable } from './measured-swatch';

/** The uploaded file as multer gives it (memory storage). */
export interface ImportUpload {
  originalname: string;
  buffer: Buffer;
}

/** A sample ready to be saved: its name and notes, and what a measured swatch stores. */
export interface ResolvedSample {
  sample: CgatsSample;
  name: string;
  notes: string;
  origin: SwatchOrigin;
  hex: string;
  reflectance: [number, number][];
}

/** The upload's text: UTF-8 (else Latin-1, as older instrument software writes); binary content is refused. */
export function uploadText(file: ImportUpload): { text: string; fileName: string } {
  const fileName = [...(cleanName(file.originalname ?? '') || 'measurements.txt')].slice(0, 200).join('');
  if (file.buffer.includes(0)) throw new InvalidError(`${fileName} is not a text file; export the measurements as CGATS.17 text (.txt, .cgats, .ti3 or .sp).`, 'file');
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
  } catch {
    text = new TextDecoder('latin1').decode(file.buffer);
  }
  if (!looksLikeCgats(text)) {
    throw new InvalidError(`${fileName} is not a CGATS.17 file: it has no BEGIN_DATA_FORMAT and BEGIN_DATA lines. A table of one spectrum (CSV) is added with "Add a swatch → Measured file".`, 'file');
  }
  return { text, fileName };
}

/** A name a swatch can take (trimmed, no control or invisible characters, at most 120 characters). */
function swatchName(s: CgatsSample): string {
  const n = [...cleanName(s.name)].slice(0, 120).join('').trim();
  return itemNameSchema.safeParse(n).success ? n : `Sample ${s.id}`.slice(0, 120);
}

/** Reads the file and resolves every sample; throws InvalidError (field `file`) naming the line and field. */
export function resolveImport(text: string, fileName: string): { file: CgatsFile; samples: ResolvedSample[] } {
  let file: CgatsFile;
  try {
    file = parseCgats(text, { maxSets: MAX_IMPORT_SAMPLES });
  } catch (e) {
    if (e instanceof CgatsError) throw new InvalidError(`${fileName}, ${e.message}`, 'file');
    throw e;
  }
  const samples = file.samples.map((sample) => {
    // the file's own numbers when they are percent or fractions (so a refusal quotes them), else ÷ SPECTRAL_NORM
    const table: ReadTable = {
      pairs: file.percent ? sample.rawPairs : sample.pairs,
      lines: sample.pairs.map(() => sample.line),
      fields: file.spectralFields,
      fileName,
      headers: [],
      decimalComma: false,
    };
    return {
      sample,
      name: swatchName(sample),
      notes: `Imported from ${fileName} (${file.fileType}), sample ${sample.id}, line ${sample.line}. ${file.assumption}`.slice(0, 4000),
      ...measuredFromTable(table, file.percent ? 'percent' : 'fraction', 'file', 'file'),
    };
  });
  return { file, samples };
}

/** The preview the interface shows before "Add N swatches". */
export function previewOf(file: CgatsFile, samples: ResolvedSample[]): SwatchImportPreview {
  const nm = file.wavelengthsNm;
  return {
    fileType: file.fileType,
    assumption: file.assumption,
    count: samples.length,
    samples: samples.map((r) => ({ name: r.name, hex: r.hex, points: nm.length, firstNm: Math.min(...nm), lastNm: Math.max(...nm), line: r.sample.line })),
  };
}
