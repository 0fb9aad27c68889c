import { describe, expect, it } from 'vitest';
import { density } from '../../../shared/tone/characteristic-curve';
import {
  DEFAULT_PAPER_SHAPE,
  displayGrey,
  gradeRange,
  paperCurve,
  paperRange,
  printGrey,
  srgbDecode,
  srgbEncode,
  timePrint,
  to8bit,
} from '../../../shared/tone/print';

/** Shared default tolerance for this file (relative luminance / log units). */
const TOL = 1e-6;
/** IEC 61966-2-1: an 18 % relative luminance encodes to sRGB 118 of 255 (0.4613 · 255 = 117.6). */
const SRGB8_OF_18_PERCENT = 118;

describe('print and display', () => {
  it('harder grades have a shorter range and a steeper paper', () => {
    for (let g = -1; g < 5; g++) {
      expect(gradeRange(g + 1)).toBeLessThan(gradeRange(g));
      expect(paperCurve(g + 1).gamma).toBeGreaterThan(paperCurve(g).gamma);
    }
    expect(Math.abs(paperRange(paperCurve(2)) - gradeRange(2))).toBeLessThan(TOL);
    expect(() => gradeRange(7)).toThrow(RangeError);
  });

  it('times the print so the grey negative density prints at 18 % of paper white', () => {
    const p = timePrint(paperCurve(2), 0.95);
    expect(Math.abs(printGrey(p, 0.95) - 0.18)).toBeLessThan(TOL);
    expect(to8bit(srgbEncode(printGrey(p, 0.95)))).toBe(SRGB8_OF_18_PERCENT);
  });

  it('more print exposure gives a darker print; a denser negative a lighter one', () => {
    const p0 = timePrint(paperCurve(2), 0.95);
    const p1 = timePrint(paperCurve(2), 0.95, 1);
    expect(printGrey(p1, 0.95)).toBeLessThan(printGrey(p0, 0.95));
    expect(printGrey(p0, 1.3)).toBeGreaterThan(printGrey(p0, 0.95));
    // paper white and paper black are the paper's own limits
    expect(printGrey(p0, 10)).toBeCloseTo(1, 3);
    expect(printGrey(p0, -10)).toBeCloseTo(10 ** -(DEFAULT_PAPER_SHAPE.dMax - DEFAULT_PAPER_SHAPE.baseFog), 3);
    expect(density(p0.paper, p0.printLightLog)).toBeGreaterThan(DEFAULT_PAPER_SHAPE.baseFog);
  });

  it('the display curve is monotonic, shows grey at 18 % and clips at the sensor headroom', () => {
    const curve = { headroomStops: 5.5, shoulderStops: 1 };
    expect(Math.abs(displayGrey(0, curve) - 0.18)).toBeLessThan(TOL);
    let prev = -1;
    for (let s = -10; s <= 8; s += 0.05) {
      const y = displayGrey(s, curve);
      expect(y).toBeGreaterThanOrEqual(prev);
      prev = y;
    }
    expect(displayGrey(7, curve)).toBe(displayGrey(5.5, curve));
    expect(displayGrey(-1, curve, 4)).toBeLessThan(displayGrey(-1, curve, 2));
  });

  it('sRGB encode and decode are inverse', () => {
    for (const y of [0, 0.001, 0.0031308, 0.05, 0.18, 0.5, 1]) expect(Math.abs(srgbDecode(srgbEncode(y)) - y)).toBeLessThan(TOL);
  });
});
