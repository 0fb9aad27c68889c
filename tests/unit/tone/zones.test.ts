import { describe, expect, it } from 'vitest';
import { MIDDLE_GREY } from '../../../shared/spectral/limits';
import { ZONE_NUMERALS, keyOffsetStops, placeOnZones, stopsFromMiddleGrey, toneFlags, zoneFromStops, zoneNumeral } from '../../../shared/tone/zones';

/** Shared default tolerance for this file (stops). */
const TOL = 1e-9;
/** Zone system (common practice): 18 % grey is zone V. */
const GREY_REFLECTANCE = 0.18;
const GREY_ZONE = 5;
/** Zone system (common practice): one stop a zone, so four stops under the key is zone I. */
const FOUR_UNDER_ZONE = 1;

describe('zones', () => {
  it('puts 18 % grey on zone V (zone system, common practice)', () => {
    expect(MIDDLE_GREY).toBe(GREY_REFLECTANCE);
    expect(Math.abs(zoneFromStops(stopsFromMiddleGrey(GREY_REFLECTANCE)) - GREY_ZONE)).toBeLessThan(TOL);
    expect(zoneNumeral(GREY_ZONE)).toBe('V');
  });

  it('puts four stops under the key on zone I (zone system, common practice)', () => {
    expect(Math.abs(zoneFromStops(stopsFromMiddleGrey(GREY_REFLECTANCE / 16)) - FOUR_UNDER_ZONE)).toBeLessThan(TOL);
    expect(zoneNumeral(zoneFromStops(-4))).toBe('I');
  });

  it('writes zones 0..X and clamps outside', () => {
    expect([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10].map(zoneNumeral).join(' ')).toBe('0 I II III IV V VI VII VIII IX X');
    expect(ZONE_NUMERALS.join(' ')).toBe('0 I II III IV V VI VII VIII IX X');
    expect(zoneNumeral(-2)).toBe('0');
    expect(zoneNumeral(12.4)).toBe('X');
    expect(zoneNumeral(6.4)).toBe('VI');
  });

  it('places a chosen swatch on a chosen zone', () => {
    // a face metered one stop over grey placed on zone VI needs no change; on zone VII it needs +1
    expect(keyOffsetStops(1, 6)).toBe(0);
    expect(keyOffsetStops(1, 7)).toBe(1);
    const placed = placeOnZones([1, -3, -5], keyOffsetStops(1, 7), 4, 3);
    expect(placed.map((p) => p.numeral)).toEqual(['VII', 'III', 'I']);
    expect(placed.map((p) => p.lost)).toEqual([false, false, false]);
  });

  it('flags lost below the shadow threshold and blown above the roll-off', () => {
    expect(toneFlags(-4, 4, 3)).toEqual({ lost: false, blown: false });
    expect(toneFlags(-4.1, 4, 3)).toEqual({ lost: true, blown: false });
    expect(toneFlags(3.2, 4, 3)).toEqual({ lost: false, blown: true });
  });
});
