import { describe, expect, it } from 'vitest';
import { converter } from 'culori';
import { srgbEncode } from '../../../shared/tone/print';

/** Shared default tolerance for this file (encoded sRGB, 0..1). */
const TOL = 1e-9;
const toRgb = converter('rgb');

describe('sRGB grey encoding against culori 4.0.2 (reference library; IEC 61966-2-1)', () => {
  it('matches culori for a grey ramp of relative luminances', () => {
    for (let i = 0; i <= 100; i++) {
      const y = (i / 100) ** 2;
      const ref = toRgb({ mode: 'lrgb', r: y, g: y, b: y });
      expect(Math.abs(srgbEncode(y) - ref.r)).toBeLessThan(TOL);
    }
  });
});
