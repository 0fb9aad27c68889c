import { describe, expect, it } from 'vitest';
import { CurveTableError, lineOfPair, parseCurveTable } from '../../shared/import/curve-table';
import { thrown } from './spectral/thrown';

// Inputs are small tables written here; the expected numbers are the ones written in each input.
const TOL = 1e-12; // exact decimal reading; one shared tolerance for this file

const errorOf = (text: string) => thrown(CurveTableError, () => parseCurveTable(text));

describe('good files', () => {
  it('reads a plain comma-separated table', () => {
    const t = parseCurveTable('380,0.10\n385,0.12\n390,0.15\n');
    expect(t.delimiter).toBe('comma');
    expect(t.pairs).toEqual([[380, 0.1], [385, 0.12], [390, 0.15]]);
    expect(t.lines).toEqual([1, 2, 3]);
    expect(t.decimalComma).toBe(false);
  });

  it('reads a tab-separated table with Windows line ends and a byte-order mark', () => {
    const t = parseCurveTable('\uFEFF400\t12.5\r\n410\t13\r\n420\t14.25\r\n');
    expect(t.delimiter).toBe('tab');
    expect(t.pairs[2][1]).toBeCloseTo(14.25, 12);
  });

  it('reads whitespace-separated columns', () => {
    const t = parseCurveTable('  400   0.5\n  410   0.6\n  420   0.7');
    expect(t.delimiter).toBe('space');
    expect(t.pairs).toEqual([[400, 0.5], [410, 0.6], [420, 0.7]]);
  });

  it('reads exponents and a chosen value column', () => {
    const t = parseCurveTable('400,1,2.5e-3\n410,1,3E-2\n420,1,1e0', { valueColumn: 2 });
    expect(Math.abs(t.pairs[0][1] - 0.0025)).toBeLessThan(TOL);
    expect(t.pairs[2][1]).toBe(1);
  });
});

describe('decimal commas', () => {
  it('accepts decimal commas in a semicolon file', () => {
    const t = parseCurveTable('380;0,10\n385;0,125\n390,5;0,15');
    expect(t.delimiter).toBe('semicolon');
    expect(t.decimalComma).toBe(true);
    expect(t.pairs[1][1]).toBeCloseTo(0.125, 12);
    expect(t.pairs[2][0]).toBeCloseTo(390.5, 12);
  });

  it('accepts decimal commas in a tab file', () => {
    const t = parseCurveTable('380\t87,5\n390\t88,0\n400\t90');
    expect(t.pairs.map((p) => p[1])).toEqual([87.5, 88, 90]);
  });

  it('accepts a quoted decimal comma in a comma file', () => {
    const t = parseCurveTable('380,"0,10"\n385,"0,12"\n390,"0,15"');
    expect(t.decimalComma).toBe(true);
    expect(t.pairs[0][1]).toBeCloseTo(0.1, 12);
  });

  it('explains an unquoted decimal comma in a comma file', () => {
    const e = errorOf('380,0,10\n385,0,12');
    expect(e.line).toBe(1);
    expect(e.message).toMatch(/decimal commas in a comma-separated file/);
  });
});

describe('header rows and comments', () => {
  it('keeps header rows before the data and skips comments and blank lines', () => {
    const text = 'Sample: lip colour no. 3 (invented)\nwavelength (nm);reflectance (%)\n\n# measured at 10 nm\n400;8,0\n410;8,5\n\n420;9,0\n';
    const t = parseCurveTable(text);
    expect(t.headers).toEqual(['Sample: lip colour no. 3 (invented)', 'wavelength (nm);reflectance (%)']);
    expect(t.pairs).toEqual([[400, 8], [410, 8.5], [420, 9]]);
    expect(t.lines).toEqual([5, 6, 8]);
    expect(lineOfPair(t, 2)).toBe(8);
  });
});

describe('bad files name the line and the problem', () => {
  it('an empty file', () => {
    expect(errorOf('  \n\n').message).toBe('the file is empty');
  });

  it('a file with headers only', () => {
    expect(errorOf('nm,value\nfoo,bar\n').message).toMatch(/no data lines/);
  });

  it('a line with an empty value', () => {
    const e = errorOf('nm;T\n400;0,5\n410;\n420;0,7');
    expect(e.line).toBe(3);
    expect(e.message).toBe('line 3: there is no value after 410 nm');
  });

  it('a line with only one column', () => {
    const e = errorOf('400,0.5\n410\n420,0.7');
    expect(e.line).toBe(2);
    expect(e.message).toMatch(/^line 2: there is no value after 410 nm/);
  });

  it('a malformed value', () => {
    const e = errorOf('400,0.5\n410,0.6x\n420,0.7');
    expect(e.message).toBe('line 2: the value "0.6x" at 410 nm is not a number');
  });

  it('a malformed wavelength after the data started', () => {
    const e = errorOf('400,0.5\n410,0.6\nend,0.7');
    expect(e.message).toBe('line 3: the wavelength "end" is not a number');
  });

  it('a missing wavelength', () => {
    const e = errorOf('400;0,5\n;0,6\n420;0,7');
    expect(e.line).toBe(2);
    expect(e.message).toMatch(/wavelength is missing/);
  });

  it('an unclosed quote', () => {
    const e = errorOf('400,"0.5\n410,0.6');
    expect(e).toBeInstanceOf(CurveTableError);
  });

  it('wavelengths given in micrometres', () => {
    expect(errorOf('0.40,0.5\n0.41,0.6\n0.42,0.7').message).toMatch(/micrometres/);
  });
});
