/**
 * Words and figures for exposure numbers, shared by the bench, the sheet page and the PDF so they
 * read the same everywhere: units on every number (stops, EI, fc, lux, s, °), trade thirds for stops.
 * `ascii` variants avoid glyphs a subset font may lack (⅓ ⅔ →) by writing 1/3, 2/3 and ">".
 */
import { formatStops } from './ei-chain';

const group = (v: number, digits: number) =>
  new Intl.NumberFormat('en-GB', { maximumFractionDigits: digits, minimumFractionDigits: digits }).format(v);

/** Foot-candles with the unit: one decimal under 10 fc, whole numbers above ("87 fc", "4.2 fc"). */
export function formatFootcandles(fc: number): string {
  return `${group(fc, fc < 10 ? 1 : 0)} fc`;
}

/** Lux with the unit, whole numbers with thousands separators ("1,882 lux"); one decimal under 10. */
export function formatLux(lux: number): string {
  return `${group(lux, lux < 10 ? 1 : 0)} lux`;
}

/** Exposure time of a shutter: "1/48 s" under a second, else "1.5 s". */
export function formatSeconds(seconds: number): string {
  if (seconds < 1) return `1/${Number((1 / seconds).toPrecision(3))} s`;
  return `${Number(seconds.toPrecision(3))} s`;
}

/** A T-stop as the lens ring reads it: "T2.8", "T4". */
export function formatTStop(t: number): string {
  return `T${Number(t.toPrecision(3))}`;
}

/** A filter factor as a multiplier with two significant figures: "×2.0", "×13". */
export function formatFactor(f: number): string {
  return f >= 10 ? `×${f.toFixed(0)}` : `×${f.toFixed(1)}`;
}

/** Trade stops to the nearest third with a sign and unit: "−⅔ stop", "+1⅓ stops", "0 stops". */
export function formatStopsLabel(stops: number): string {
  const s = formatStops(stops);
  const n = Math.abs(Math.round(stops * 3));
  return `${s} ${n === 0 || n > 3 ? 'stops' : 'stop'}`;
}

/** Stops with two decimals and a sign, for exact figures: "−0.67 stops". */
export function formatStopsExact(stops: number): string {
  const r = Number(stops.toFixed(2));
  if (r === 0) return '0.00 stops';
  return `${r > 0 ? '+' : '−'}${Math.abs(r).toFixed(2)} stops`;
}

/** An exposure index with its unit: "EI 160". */
export function formatEI(ei: number): string {
  return `EI ${Number(ei.toPrecision(4))}`;
}

/** Replaces glyphs that subset fonts may lack (⅓ ⅔ → ≈) with plain forms (1/3, 2/3, >, ~). */
export function asciiFractions(text: string): string {
  return text
    .replace(/(\d)⅓/g, '$1 1/3')
    .replace(/(\d)⅔/g, '$1 2/3')
    .replace(/⅓/g, '1/3')
    .replace(/⅔/g, '2/3')
    .replace(/→/g, '>')
    .replace(/≈/g, '~');
}
