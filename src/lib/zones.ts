import { ZONE_RANGE, zoneNumeral } from '../../shared/tone/zones';

/** The zones shown, 0..X, with their numerals (from the engine's `zoneNumeral`). */
export const ZONES: readonly { zone: number; numeral: string }[] = Array.from({ length: ZONE_RANGE[1] - ZONE_RANGE[0] + 1 }, (_, i) => {
  const zone = ZONE_RANGE[0] + i;
  return { zone, numeral: zoneNumeral(zone) };
});
