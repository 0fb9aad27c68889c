import Papa from 'papaparse';

/** Rows → CSV text (papaparse quotes what needs quoting); numbers are written with a decimal point. */
export function toCsv(header: string[], rows: (string | number | boolean)[][]): string {
  return Papa.unparse({ fields: header, data: rows }, { newline: '\r\n' });
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
