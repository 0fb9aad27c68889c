const NUMERALS = ['0', 'I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII', 'IX', 'X'];
/** Zone number 0..10 as a Roman numeral (zone 0 is written 0); out-of-range values are clamped. */
export function toRoman(zone: number): string {
  return NUMERALS[Math.max(0, Math.min(10, Math.round(zone)))];
}
