/**
 * Writing CGATS.17 text for tests (ISO 28178's layout, as shared/import/cgats.ts reads it): header lines, the
 * data format naming SAMPLE_ID, SAMPLE_NAME and one SPECTRAL_NM field per wavelength, and one set per line.
 */

/** An invented fabric's reflectance in percent at `nm`: a smooth bump of `height` at `peak` nm over a floor. */
export function inventedFabric(nm: readonly number[], floor: number, height: number, peak: number, width = 60): string[] {
  return nm.map((w) => (floor + height * Math.exp(-(((w - peak) / width) ** 2))).toFixed(2));
}

/** A CGATS.17 file: `header` lines first, then the data format and the sets `[id, name, values]`. */
export function cgatsText(header: readonly string[], nm: readonly number[], sets: readonly [string, string, readonly string[]][]): string {
  return [
    'CGATS.17',
    ...header,
    `NUMBER_OF_FIELDS ${2 + nm.length}`,
    'BEGIN_DATA_FORMAT',
    `SAMPLE_ID SAMPLE_NAME ${nm.map((w) => `SPECTRAL_NM${w}`).join(' ')}`,
    'END_DATA_FORMAT',
    `NUMBER_OF_SETS ${sets.length}`,
    'BEGIN_DATA',
    ...sets.map(([id, name, values]) => `${id} "${name}" ${values.join(' ')}`),
    'END_DATA',
  ].join('\n');
}
