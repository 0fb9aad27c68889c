import { describe, expect, it } from 'vitest';
import { isoSeriesBetween, roundToIsoSeries } from '../../../shared/tone/iso-series';

/** ISO 6:1993 table of nominal arithmetic speeds, third-stop steps, 6 to 3200. */
const ISO_SERIES_6_TO_3200 = [
  6, 8, 10, 12, 16, 20, 25, 32, 40, 50, 64, 80, 100, 125, 160, 200, 250, 320, 400, 500, 640, 800, 1000, 1250, 1600, 2000,
  2500, 3200,
];
/** ISO 6:1993 table continued past 3200 (third steps; from memory): 4000 5000 6400 8000 10000. */
const ISO_SERIES_3200_UP = [3200, 4000, 5000, 6400, 8000, 10000];
/** ISO 6:1993 table below 6 (from memory): 1 1.2 1.6 2 2.5 3 4 5. */
const ISO_SERIES_LOW = [1, 1.2, 1.6, 2, 2.5, 3, 4, 5];

describe('ISO third-stop speed series', () => {
  it('lists the nominal values of ISO 6:1993', () => {
    expect(isoSeriesBetween(6, 3200)).toEqual(ISO_SERIES_6_TO_3200);
    expect(isoSeriesBetween(3200, 10000)).toEqual(ISO_SERIES_3200_UP);
    expect(isoSeriesBetween(1, 5)).toEqual(ISO_SERIES_LOW);
  });

  it('rounds each exact third stop 100·2^(n/3) to its label (ISO 6:1993)', () => {
    const exact = ISO_SERIES_6_TO_3200.map((_, i) => 100 * 2 ** ((i - 12) / 3));
    expect(exact.map(roundToIsoSeries)).toEqual(ISO_SERIES_6_TO_3200);
  });

  it('rounds computed EIs to the nearest third stop on the log scale', () => {
    // 250 · 2^−0.667 = 157.45 → 160; 250 · 2^−1.667 = 78.7 → 80; 250 · 2^−2.333 = 49.6 → 50 (arithmetic)
    expect(roundToIsoSeries(250 * 2 ** -0.667)).toBe(160);
    expect(roundToIsoSeries(250 * 2 ** -1.667)).toBe(80);
    expect(roundToIsoSeries(250 * 2 ** -2.334)).toBe(50);
    // the boundary between 100 and 125 sits at 100·2^(1/6) = 112.2
    expect(roundToIsoSeries(112)).toBe(100);
    expect(roundToIsoSeries(112.5)).toBe(125);
    expect(() => roundToIsoSeries(0)).toThrow(RangeError);
  });
});
