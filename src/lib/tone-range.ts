/**
 * How sure a grey is: a tone's range (shared/schemas/board.ts ToneRange, stops from middle grey after key
 * placement) read as zones and widths. Zone = 5 + stops; numerals from the engine's `zoneNumeral`.
 */
import type { ToneRange } from '../../shared/schemas/board';
import { zoneFromStops, zoneNumeral } from '../../shared/tone/zones';

/** Narrower than this, stops, a range counts as none (a measured reflectance gives exactly zero). */
export const MEASURED_WIDTH = 1e-3;
/** A plausible range at least this wide, stops, is worth measuring (the board's "measure these first"). */
export const MEASURE_FIRST_WIDTH = 0.5;
/** A plausible range at least this wide, stops, is flagged in the warning colour ("measure it"). */
export const WIDE_WIDTH = 1;

/** Width of a [lo, hi] range, stops. */
export const widthOf = (r: readonly [number, number]) => Math.max(0, r[1] - r[0]);

/** Whether a range is zero width (the spectrum is measured, the tone is as computed). */
export const isExact = (r: ToneRange) => widthOf(r.possible) < MEASURED_WIDTH && widthOf(r.plausible) < MEASURED_WIDTH;

/** The zones a range of stops spans, as numerals: [from, to]. */
export function zoneSpan(r: readonly [number, number]): [string, string] {
  return [zoneNumeral(zoneFromStops(r[0])), zoneNumeral(zoneFromStops(r[1]))];
}

/** A range of stops as zones, e.g. "III–V" (one numeral when it stays within one zone). */
export function zoneSpanWords(r: readonly [number, number]): string {
  const [lo, hi] = zoneSpan(r);
  return lo === hi ? lo : `${lo}–${hi}`;
}

/** A width in stops with its unit: "0.8 st". */
export const widthStops = (r: readonly [number, number], digits = 1) => `${widthOf(r).toFixed(digits)} st`;

/** One line for screen readers and tooltips: "could read zone III–V (1.0 st wide); any spectrum: II–VII". */
export function rangeLabel(r: ToneRange): string {
  if (isExact(r)) return 'measured spectrum: tone as computed';
  return `could read zone ${zoneSpanWords(r.plausible)} (${widthStops(r.plausible)} wide); any spectrum with this colour: zone ${zoneSpanWords(r.possible)} (${widthStops(r.possible)} wide)`;
}
