/**
 * The ISO arithmetic speed series in third stops (the table of nominal speeds in ISO 6:1993):
 * … 6 8 10 12 16 20 25 32 40 50 64 80 100 125 160 200 250 320 400 500 640 800 1000 1250 1600 …
 * Each value is the nominal label of 100 · 2^(n/3); ten third stops make (almost exactly) a decade,
 * so the labels repeat per decade. Rounding is done on the log scale: a computed speed takes the label
 * of the nearest third stop.
 */

/** Labels from 100 up to 800 (n = 0..9); every higher decade is these × 10^k. */
const DECADE_HUNDREDS = [100, 125, 160, 200, 250, 320, 400, 500, 640, 800] as const;
/** Labels from 10 up to 80 (n = −10..−1). */
const DECADE_TENS = [10, 12, 16, 20, 25, 32, 40, 50, 64, 80] as const;
/** Labels from 1 up to 8 (n = −20..−11); lower decades are these ÷ 10^k. */
const DECADE_UNITS = [1, 1.2, 1.6, 2, 2.5, 3, 4, 5, 6, 8] as const;

/** Third-stop index of a speed: n = 3·log2(S / 100), unrounded (100 → 0, 200 → 3). */
export function thirdStopIndex(speed: number): number {
  return 3 * Math.log2(speed / 100);
}

/** The nominal series label for integer third-stop index `n` (0 → 100, 2 → 160, −1 → 80). */
export function seriesValue(n: number): number {
  const i = Math.round(n);
  const k = Math.floor(i / 10);
  const r = i - 10 * k;
  if (k >= 0) return DECADE_HUNDREDS[r] * 10 ** k;
  if (k === -1) return DECADE_TENS[r];
  if (k === -2) return DECADE_UNITS[r];
  return Number((DECADE_UNITS[r] * 10 ** (k + 2)).toPrecision(3));
}

/** Rounds a computed speed or exposure index (arithmetic, > 0) to the nearest ISO third-stop label. */
export function roundToIsoSeries(speed: number): number {
  if (!(speed > 0) || !Number.isFinite(speed)) throw new RangeError('speed must be a positive number');
  return seriesValue(Math.round(thirdStopIndex(speed)));
}

/** Every label of the series between `min` and `max` inclusive, ascending (for pickers). */
export function isoSeriesBetween(min: number, max: number): number[] {
  const out: number[] = [];
  for (let n = Math.ceil(thirdStopIndex(min) - 0.5); n <= Math.floor(thirdStopIndex(max) + 0.5); n++) {
    const v = seriesValue(n);
    if (v >= min && v <= max) out.push(v);
  }
  return out;
}
