/**
 * Zones: one stop a zone, zone V = middle grey (18 % reflectance at the key exposure), shown as Roman
 * numerals 0..X (the zone system, common practice). Key placement moves every swatch by the same stops.
 *
 * Three units that are easy to confuse: a medium exposure m (linear, 0.18 = middle grey); stops (log2 of
 * m / 0.18); a zone (5 + stops). Stops come in two kinds: *before* the key placement (as metered, what the
 * spectral engine reports) and *after* it (moved by keyOffsetStops); zones are always after it. Names
 * here say which (`stopsBeforeKey`, `stopsAfterKey`).
 *
 * The shadow-detail threshold and the highlight roll-off are measured in stops from zone V, i.e. from the
 * exposure a middle grey gets under the key light: a swatch below (5 − shadowDetailStops) is "lost"
 * (texture gone), one above (5 + highlightRollOffStops) is "blown".
 */
import { MIDDLE_GREY } from '../spectral/limits';

/** The zone of middle grey. */
export const MIDDLE_GREY_ZONE = 5;
/** Zone scale shown, inclusive. */
export const ZONE_RANGE: readonly [number, number] = [0, 10];

/** The zones' Roman numerals, index = zone 0..10 ('0', 'I', … 'X'): the one table (zone rulers, pickers, PDFs). */
export const ZONE_NUMERALS = Object.freeze(['0', 'I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII', 'IX', 'X'] as const);

/**
 * Stops from middle grey of a linear medium exposure or reflectance m (0.18 → 0): log2(m / 0.18).
 * −Infinity for m ≤ 0. Placement-neutral: stops before key for a metered m, after key for a placed one.
 */
export function stopsFromMiddleGrey(m: number): number {
  return m > 0 ? Math.log2(m / MIDDLE_GREY) : Number.NEGATIVE_INFINITY;
}

/** Zone (unrounded, may leave 0..10) of a tone `stopsAfterKey` stops from middle grey after key placement: 5 + stops. */
export function zoneFromStops(stopsAfterKey: number): number {
  return MIDDLE_GREY_ZONE + stopsAfterKey;
}

/** Stops from middle grey (after key placement) of a zone: zone − 5. */
export function stopsFromZone(zone: number): number {
  return zone - MIDDLE_GREY_ZONE;
}

/** Roman numeral of the nearest zone, clamped to 0..X ('0', 'I', … 'X'; '—' for NaN). */
export function zoneNumeral(zone: number): string {
  if (Number.isNaN(zone)) return '—';
  const z = Math.min(ZONE_RANGE[1], Math.max(ZONE_RANGE[0], Math.round(zone)));
  return ZONE_NUMERALS[z];
}

/**
 * Exposure change, in stops, that puts a key tone (`keyStopsBeforeKey`: its stops from middle grey as
 * metered, e.g. a face) on the zone `keyZone`: (keyZone − 5) − keyStopsBeforeKey. Adding it to any tone's
 * stops before key gives its stops after key. Placing middle grey on zone V gives 0.
 */
export function keyOffsetStops(keyStopsBeforeKey: number, keyZone: number = MIDDLE_GREY_ZONE): number {
  return stopsFromZone(keyZone) - keyStopsBeforeKey;
}

export interface ToneFlags {
  /** below the shadow-detail threshold: texture is lost */
  lost: boolean;
  /** above the highlight roll-off: texture is blown */
  blown: boolean;
}

/**
 * Lost/blown flags for a tone `stopsAfterKey` stops from middle grey (after key placement), with the
 * shadow-detail threshold and highlight roll-off both in stops from zone V (positive numbers).
 */
export function toneFlags(stopsAfterKey: number, shadowDetailStops: number, highlightRollOffStops: number): ToneFlags {
  return { lost: stopsAfterKey < -shadowDetailStops, blown: stopsAfterKey > highlightRollOffStops };
}

export interface ZonePlacement {
  /** stops from middle grey after key placement */
  stops: number;
  /** 5 + stops (after key), unrounded */
  zone: number;
  numeral: string;
  lost: boolean;
  blown: boolean;
}

/**
 * Places tones (`stopsBeforeKey`: stops from middle grey as the medium sees them, before key placement) on
 * the zone scale after moving them all by `offsetStops` (from keyOffsetStops), with lost/blown flags.
 */
export function placeOnZones(
  stopsBeforeKey: readonly number[],
  offsetStops: number,
  shadowDetailStops: number,
  highlightRollOffStops: number,
): ZonePlacement[] {
  return stopsBeforeKey.map((before) => {
    const stopsAfterKey = before + offsetStops;
    const zone = zoneFromStops(stopsAfterKey);
    return { stops: stopsAfterKey, zone, numeral: zoneNumeral(zone), ...toneFlags(stopsAfterKey, shadowDetailStops, highlightRollOffStops) };
  });
}
