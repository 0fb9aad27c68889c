/**
 * Zones: one stop a zone, zone V = middle grey (18 % reflectance at the key exposure), shown as Roman
 * numerals 0..X (the zone system, common practice). Key placement moves every swatch by the same stops.
 *
 * The shadow-detail threshold and the highlight roll-off are measured in stops from zone V, i.e. from the
 * exposure a middle grey gets under the key light: a swatch below (5 − shadowDetailStops) is "lost"
 * (texture gone), one above (5 + highlightRollOffStops) is "blown".
 */

/** Middle grey: the 18 % reflectance that lands on zone V (common practice). */
export const MIDDLE_GREY = 0.18;
/** The zone of middle grey. */
export const MIDDLE_GREY_ZONE = 5;
/** Zone scale shown, inclusive. */
export const ZONE_RANGE: readonly [number, number] = [0, 10];

const NUMERALS = ['0', 'I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII', 'IX', 'X'] as const;

/** Stops from middle grey of a linear exposure or reflectance m (0.18 → 0). −Infinity for m ≤ 0. */
export function stopsFromMiddleGrey(m: number): number {
  return m > 0 ? Math.log2(m / MIDDLE_GREY) : Number.NEGATIVE_INFINITY;
}

/** Zone (unrounded, may leave 0..10) of a tone `stops` from middle grey: 5 + stops. */
export function zoneFromStops(stops: number): number {
  return MIDDLE_GREY_ZONE + stops;
}

/** Stops from middle grey of a zone: zone − 5. */
export function stopsFromZone(zone: number): number {
  return zone - MIDDLE_GREY_ZONE;
}

/** Roman numeral of the nearest zone, clamped to 0..X ('0', 'I', … 'X'). */
export function zoneNumeral(zone: number): string {
  if (Number.isNaN(zone)) return '—';
  const z = Math.min(ZONE_RANGE[1], Math.max(ZONE_RANGE[0], Math.round(zone)));
  return NUMERALS[z];
}

/**
 * Exposure change, in stops, that puts a key tone (`keyStops` from middle grey as metered, e.g. a face)
 * on the chosen zone: (zone − 5) − keyStops. Placing middle grey on zone V gives 0.
 */
export function keyOffsetStops(keyStops: number, keyZone: number = MIDDLE_GREY_ZONE): number {
  return stopsFromZone(keyZone) - keyStops;
}

export interface ToneFlags {
  /** below the shadow-detail threshold: texture is lost */
  lost: boolean;
  /** above the highlight roll-off: texture is blown */
  blown: boolean;
}

/**
 * Lost/blown flags for a tone `stops` from middle grey (after key placement), with the shadow-detail
 * threshold and highlight roll-off both in stops from zone V (positive numbers).
 */
export function toneFlags(stops: number, shadowDetailStops: number, highlightRollOffStops: number): ToneFlags {
  return { lost: stops < -shadowDetailStops, blown: stops > highlightRollOffStops };
}

export interface ZonePlacement {
  stops: number;
  zone: number;
  numeral: string;
  lost: boolean;
  blown: boolean;
}

/**
 * Places tones (stops from middle grey as the medium sees them) on the zone scale after moving them all by
 * `offsetStops` (from keyOffsetStops), with lost/blown flags.
 */
export function placeOnZones(
  stops: readonly number[],
  offsetStops: number,
  shadowDetailStops: number,
  highlightRollOffStops: number,
): ZonePlacement[] {
  return stops.map((s0) => {
    const s = s0 + offsetStops;
    const zone = zoneFromStops(s);
    return { stops: s, zone, numeral: zoneNumeral(zone), ...toneFlags(s, shadowDetailStops, highlightRollOffStops) };
  });
}
