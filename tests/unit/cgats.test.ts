/**
 * The CGATS.17 / Argyll reader (shared/import/cgats.ts) on small files written here by the rules of
 * ISO 28178 / CGATS.17 as the reader's header states them; the sample names are invented. The expected
 * numbers are the ones written in each file (÷ 100 for percent).
 */
import { describe, expect, it } from 'vitest';
import { CgatsError, looksLikeCgats, parseCgats, pickCgatsSample } from '../../shared/import/cgats';
import { readSpectralTable } from '../../shared/import/spectral-table';
import { thrown } from './spectral/thrown';

/** Exact decimal reading and one division; one tolerance for this file. */
const TOL = 1e-12;

const errorOf = (text: string) => thrown(CgatsError, () => parseCgats(text));
const lines = (...l: string[]) => l.join('\n');

/** A CGATS.17 file of three fractions at 400, 500, 600, 700 nm (invented fabrics). */
const FRACTIONS = lines(
  'CGATS.17',
  'ORIGINATOR "Invented test lab"',
  'DESCRIPTOR "Fabric swatches, invented"',
  'CREATED "2026-11-30"',
  'NUMBER_OF_FIELDS 6',
  'BEGIN_DATA_FORMAT',
  'SAMPLE_ID SAMPLE_NAME SPECTRAL_NM400 SPECTRAL_NM500 SPECTRAL_NM600 SPECTRAL_NM700',
  'END_DATA_FORMAT',
  'NUMBER_OF_SETS 3',
  'BEGIN_DATA',
  '1 "Wool, moss green" 0.05 0.20 0.10 0.08',
  '2 "Velvet, deep wine" 0.04 0.03 0.12 0.30',
  '3 "Linen, undyed" 0.55 0.70 0.74 0.76',
  'END_DATA',
);

describe('good files', () => {
  it('reads fractions, quoted names with spaces, headers and line numbers', () => {
    const f = parseCgats(FRACTIONS);
    expect(f.fileType).toBe('CGATS.17');
    expect(f.headers).toMatchObject({ ORIGINATOR: 'Invented test lab', DESCRIPTOR: 'Fabric swatches, invented', CREATED: '2026-11-30', NUMBER_OF_SETS: '3' });
    expect(f.wavelengthsNm).toEqual([400, 500, 600, 700]);
    expect(f.percent).toBe(false);
    expect(f.assumption).toMatch(/fractions.*no SPECTRAL_NORM/);
    expect(f.samples.map((s) => [s.id, s.name, s.line])).toEqual([['1', 'Wool, moss green', 11], ['2', 'Velvet, deep wine', 12], ['3', 'Linen, undyed', 13]]);
    expect(f.samples[1].pairs).toEqual([[400, 0.04], [500, 0.03], [600, 0.12], [700, 0.3]]);
    expect(looksLikeCgats(FRACTIONS)).toBe(true);
    expect(looksLikeCgats('400,0.1\n500,0.2\n600,0.3')).toBe(false);
  });

  it('reads percent when SPECTRAL_NORM says 100, and says so', () => {
    const f = parseCgats(lines('CGATS.17', 'KEYWORD "SPECTRAL_NORM"', 'SPECTRAL_NORM "100"', 'BEGIN_DATA_FORMAT', 'SAMPLE_NAME SPEC_400 SPEC_550 SPEC_700', 'END_DATA_FORMAT', 'BEGIN_DATA', 'Dark_serge 0.9 1.2 1.4', 'END_DATA'));
    expect(f.percent).toBe(true);
    expect(f.assumption).toMatch(/percent.*SPECTRAL_NORM 100/);
    expect(Math.abs(f.samples[0].pairs[1][1] - 0.012)).toBeLessThan(TOL);
    expect(f.samples[0].rawPairs[1][1]).toBe(1.2);
  });

  it('reads percent when a value exceeds 1.5 and no norm is given, and says so', () => {
    const f = parseCgats(lines('CGATS.17', 'BEGIN_DATA_FORMAT', 'SAMPLE_ID SPECTRAL_NM380 SPECTRAL_NM480 SPECTRAL_NM580 SPECTRAL_NM780', 'END_DATA_FORMAT', 'BEGIN_DATA', 'A1 12.5 20 41.25 60', 'A2 1 1.2 1.4 1.1', 'END_DATA'));
    expect(f.percent).toBe(true);
    expect(f.assumption).toMatch(/percent.*largest value is 60, above 1\.5/);
    expect(Math.abs(f.samples[0].pairs[2][1] - 0.4125)).toBeLessThan(TOL);
    expect(Math.abs(f.samples[1].pairs[0][1] - 0.01)).toBeLessThan(TOL);
    expect(f.samples[1].name).toBe('A2'); // the id stands in for a missing name
  });

  it('reads an Argyll .sp file (one spectrum, non-integer steps from the band keywords)', () => {
    const sp = lines(
      'SPECT',
      '',
      'DESCRIPTOR "Argyll spectral reflectance data"',
      'ORIGINATOR "Argyll CMS"',
      'CREATED "Mon Nov 30 10:00:00 2026"',
      'KEYWORD "SPECTRAL_BANDS"',
      'SPECTRAL_BANDS "4"',
      'KEYWORD "SPECTRAL_START_NM"',
      'SPECTRAL_START_NM "380.000000"',
      'KEYWORD "SPECTRAL_END_NM"',
      'SPECTRAL_END_NM "730.000000"',
      'KEYWORD "SPECTRAL_NORM"',
      'SPECTRAL_NORM "100.000000"',
      '',
      'NUMBER_OF_FIELDS 4',
      'BEGIN_DATA_FORMAT',
      'SPEC_380 SPEC_497 SPEC_613 SPEC_730 ',
      'END_DATA_FORMAT',
      '',
      'NUMBER_OF_SETS 1',
      'BEGIN_DATA',
      '10.000000 20.000000 30.000000 40.000000 ',
      'END_DATA',
    );
    const f = parseCgats(sp);
    expect(f.fileType).toBe('SPECT');
    expect(f.samples).toHaveLength(1);
    expect(f.samples[0]).toMatchObject({ id: '1', name: 'Sample 1', line: 22 });
    const STEP_NM = 350 / 3; // (730 − 380) / (4 − 1)
    expect(Math.abs(f.wavelengthsNm[1] - (380 + STEP_NM))).toBeLessThan(1e-6);
    expect(f.percent).toBe(true);
    expect(f.assumption).toMatch(/SPECTRAL_START_NM/);
  });

  it('reads an Argyll .ti3 shape (many sets, colorimetric fields beside the spectral ones, comments)', () => {
    const ti3 = lines(
      'CTI3   # a comment after the type',
      '',
      'DESCRIPTOR "Argyll Calibration Target chart information 3"',
      'ORIGINATOR "Argyll target"',
      'KEYWORD "DEVICE_CLASS"',
      'DEVICE_CLASS "OUTPUT"',
      'KEYWORD "SPECTRAL_BANDS"',
      'SPECTRAL_BANDS "3"',
      'KEYWORD "SPECTRAL_START_NM"',
      'SPECTRAL_START_NM "400.000000"',
      'KEYWORD "SPECTRAL_END_NM"',
      'SPECTRAL_END_NM "700.000000"',
      'KEYWORD "SPECTRAL_NORM"',
      'SPECTRAL_NORM "1.000000"',
      '# the fields',
      'NUMBER_OF_FIELDS 7',
      'BEGIN_DATA_FORMAT',
      'SAMPLE_ID XYZ_X XYZ_Y XYZ_Z SPEC_400 SPEC_550 SPEC_700',
      'END_DATA_FORMAT',
      'NUMBER_OF_SETS 2',
      'BEGIN_DATA',
      '1 20.1 21.0 22.2 0.2 0.21 0.22',
      '# a comment between sets',
      '2 50.0 48.0 10.0 0.05 0.5 0.6 # trailing comment',
      'END_DATA',
      '',
      'CAL    ',
      'BEGIN_DATA_FORMAT',
      'RGB_I RGB_R',
      'END_DATA_FORMAT',
      'BEGIN_DATA',
      '0 0',
      'END_DATA',
    );
    const f = parseCgats(ti3);
    expect(f.fileType).toBe('CTI3');
    expect(f.headers.DEVICE_CLASS).toBe('OUTPUT');
    expect(f.wavelengthsNm).toEqual([400, 550, 700]);
    expect(f.samples.map((s) => s.line)).toEqual([22, 24]);
    expect(f.samples[1].pairs).toEqual([[400, 0.05], [550, 0.5], [700, 0.6]]);
    expect(f.percent).toBe(false);
    expect(f.assumption).toMatch(/SPECTRAL_NORM 1\b.*only the first/);
  });

  it('reads decimal wavelengths, CRLF line ends and a byte-order mark, and picks a sample', () => {
    const f = parseCgats('\uFEFFCGATS.17\r\nBEGIN_DATA_FORMAT\r\nSAMPLE_NAME SPECTRAL_NM380.5 SPECTRAL_NM550 SPECTRAL_NM700.25\r\nEND_DATA_FORMAT\r\nBEGIN_DATA\r\n"Felt, slate" 0.1 0.2 0.3\r\n"Satin, ivory" 0.7 0.8 0.9\r\nEND_DATA\r\n');
    expect(f.wavelengthsNm).toEqual([380.5, 550, 700.25]);
    expect(pickCgatsSample(f, 'Satin, ivory')?.line).toBe(7);
    expect(pickCgatsSample(f, '1')?.name).toBe('Felt, slate');
  });

  it('gives one sample to the curve reader, and asks which when there are several', () => {
    const one = readSpectralTable(lines('CGATS.17', 'BEGIN_DATA_FORMAT', 'SPEC_400 SPEC_550 SPEC_700', 'END_DATA_FORMAT', 'BEGIN_DATA', '50 60 70', 'END_DATA'));
    expect(one.pairs).toEqual([[400, 50], [550, 60], [700, 70]]); // the file's numbers: the user names the basis
    expect(one.lines).toEqual([6, 6, 6]);
    expect(one.cgats?.percent).toBe(true);
    const e = thrown(CgatsError, () => readSpectralTable(FRACTIONS));
    expect(e.message).toMatch(/3 samples.*Wool, moss green.*choose/);
    expect(readSpectralTable(FRACTIONS, { sample: 'Linen, undyed' }).pairs[0]).toEqual([400, 0.55]);
  });
});

describe('errors name the line and field', () => {
  it('a file without BEGIN_DATA_FORMAT', () => {
    const e = errorOf(lines('CGATS.17', 'ORIGINATOR "x"', 'BEGIN_DATA', '1 2 3', 'END_DATA'));
    expect(e.line).toBe(3);
    expect(e.field).toBe('BEGIN_DATA_FORMAT');
    expect(errorOf(lines('CGATS.17', 'ORIGINATOR "x"')).message).toMatch(/BEGIN_DATA_FORMAT is missing/);
  });

  it('a first line that does not name the file type', () => {
    expect(errorOf(lines('ORIGINATOR "x"', 'BEGIN_DATA_FORMAT')).line).toBe(1);
  });

  it('a set with the wrong number of values', () => {
    const e = errorOf(FRACTIONS.replace('2 "Velvet, deep wine" 0.04 0.03 0.12 0.30', '2 "Velvet, deep wine" 0.04 0.03 0.12'));
    expect(e.line).toBe(12);
    expect(e.field).toBe('SPECTRAL_NM700');
    expect(e.message).toMatch(/^line 12, field SPECTRAL_NM700: the set has 5 values; the data format names 6 fields/);
  });

  it('an unquoted name with a space reads as one value too many', () => {
    expect(errorOf(FRACTIONS.replace('"Linen, undyed"', 'Linen undyed')).line).toBe(13);
  });

  it('a non-number in a spectral field', () => {
    const e = errorOf(FRACTIONS.replace('0.10 0.08', '0.1O 0.08'));
    expect([e.line, e.field]).toEqual([11, 'SPECTRAL_NM600']);
    expect(e.message).toMatch(/"0\.1O" is not a number/);
  });

  it('NUMBER_OF_SETS or NUMBER_OF_FIELDS disagreeing', () => {
    const sets = errorOf(FRACTIONS.replace('NUMBER_OF_SETS 3', 'NUMBER_OF_SETS 4'));
    expect([sets.line, sets.field]).toEqual([9, 'NUMBER_OF_SETS']);
    const fields = errorOf(FRACTIONS.replace('NUMBER_OF_FIELDS 6', 'NUMBER_OF_FIELDS 5'));
    expect([fields.line, fields.field]).toEqual([5, 'NUMBER_OF_FIELDS']);
  });

  it('no spectral fields', () => {
    const e = errorOf(lines('CGATS.17', 'BEGIN_DATA_FORMAT', 'SAMPLE_ID LAB_L LAB_A LAB_B', 'END_DATA_FORMAT', 'BEGIN_DATA', '1 50 0 0', 'END_DATA'));
    expect(e.line).toBe(2);
    expect(e.message).toMatch(/no spectral fields.*LAB_L/);
  });

  it('duplicate wavelengths and duplicate fields', () => {
    const nm = errorOf(lines('CGATS.17', 'BEGIN_DATA_FORMAT', 'SPECTRAL_NM400 SPEC_400 SPECTRAL_NM500', 'END_DATA_FORMAT', 'BEGIN_DATA', '0.1 0.1 0.2', 'END_DATA'));
    expect([nm.line, nm.field]).toEqual([2, 'SPEC_400']);
    expect(nm.message).toMatch(/400 nm appears twice/);
    expect(errorOf(lines('CGATS.17', 'BEGIN_DATA_FORMAT', 'SPEC_400 SPEC_400', 'END_DATA_FORMAT', 'BEGIN_DATA', '1 2', 'END_DATA')).message).toMatch(/named twice/);
  });

  it('missing END_DATA_FORMAT, END_DATA, BEGIN_DATA and an unclosed quote', () => {
    expect(errorOf(lines('CGATS.17', 'BEGIN_DATA_FORMAT', 'SPEC_400 SPEC_500', 'BEGIN_DATA', '1 2', 'END_DATA')).field).toBe('END_DATA_FORMAT');
    const end = errorOf(lines('CGATS.17', 'BEGIN_DATA_FORMAT', 'SPEC_400 SPEC_500', 'END_DATA_FORMAT', 'BEGIN_DATA', '1 2'));
    expect([end.line, end.field]).toEqual([6, 'END_DATA']);
    expect(errorOf(lines('CGATS.17', 'BEGIN_DATA_FORMAT', 'SPEC_400', 'END_DATA_FORMAT')).field).toBe('BEGIN_DATA');
    expect(errorOf(lines('CGATS.17', 'DESCRIPTOR "open', 'BEGIN_DATA_FORMAT')).line).toBe(2);
  });

  it('SPECTRAL_BANDS disagreeing with the spectral fields, and a bad SPECTRAL_NORM', () => {
    const bands = errorOf(lines('SPECT', 'SPECTRAL_BANDS "5"', 'BEGIN_DATA_FORMAT', 'SPEC_400 SPEC_500', 'END_DATA_FORMAT', 'BEGIN_DATA', '1 2', 'END_DATA'));
    expect([bands.line, bands.field]).toEqual([2, 'SPECTRAL_BANDS']);
    const norm = errorOf(lines('SPECT', 'SPECTRAL_NORM "zero"', 'BEGIN_DATA_FORMAT', 'SPEC_400 SPEC_500', 'END_DATA_FORMAT', 'BEGIN_DATA', '1 2', 'END_DATA'));
    expect([norm.line, norm.field]).toEqual([2, 'SPECTRAL_NORM']);
  });

  it('an empty file and a file of only comments', () => {
    expect(errorOf('').line).toBe(0);
    expect(errorOf('# nothing\n\n').message).toMatch(/only comments/);
  });
});
