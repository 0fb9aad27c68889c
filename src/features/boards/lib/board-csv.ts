import Papa from 'papaparse';

/** A plain number written as text ("-1.25", "+0.50"): a spreadsheet reads it as a number, never a formula. */
const PLAIN_NUMBER = /^[-+−]?\d+(\.\d+)?$/;
/** What a spreadsheet may take for the start of a formula: =, +, - (and the minus sign), @, tab, carriage return. */
const FORMULA_START = /^[=+\-−@\t\r]/;

/**
 * A cell made safe for a spreadsheet (OWASP, "CSV Injection"): text that starts like a formula gets a
 * leading single quote, so it is shown as text and never run. Plain numbers are left as they are.
 */
export function csvCell(v: string | number | boolean): string | number | boolean {
  if (typeof v !== 'string' || PLAIN_NUMBER.test(v)) return v;
  return FORMULA_START.test(v) ? `'${v}` : v;
}

/** Rows → CSV text (papaparse quotes what needs quoting; formula-like text is escaped); numbers are written with a decimal point. */
export function toCsv(header: string[], rows: (string | number | boolean)[][]): string {
  return Papa.unparse({ fields: header.map((h) => csvCell(h) as string), data: rows.map((r) => r.map(csvCell)) }, { newline: '\r\n' });
}

/** Saves text as a file through a temporary link (the browser's own download). */
export function downloadText(fileName: string, text: string, type = 'text/csv;charset=utf-8'): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
