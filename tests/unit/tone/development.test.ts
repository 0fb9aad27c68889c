import { describe, expect, it } from 'vitest';
import { curveForIsoSpeed, isoSpeedOfCurve } from '../../../shared/tone/iso-speed';
import { DEFAULT_DEVELOPMENT_MODEL, developCurve, developmentGammaFactor, developmentSpeedStops } from '../../../shared/tone/development';
import { mediumToneDefaults } from '../../../shared/tone/media-tone';

/** Shared default tolerance for this file (stops). */
const TOL = 1e-6;

const d = mediumToneDefaults('medium.panchromatic');
if (d.kind !== 'negative') throw new Error('expected a negative');
const normal = curveForIsoSpeed(d.shape, 250);

describe('development', () => {
  it('pulling lowers gamma and pushing raises it (physics: development time sets contrast)', () => {
    expect(developCurve(normal, -1).gamma).toBeLessThan(normal.gamma);
    expect(developCurve(normal, -0.5).gamma).toBeLessThan(normal.gamma);
    expect(developCurve(normal, 1).gamma).toBeGreaterThan(normal.gamma);
    expect(developmentGammaFactor(-1)).toBeLessThan(1);
  });

  it('moves the effective speed by the model stops (push faster, pull slower)', () => {
    const base = isoSpeedOfCurve(normal).speed;
    for (const p of [-2, -0.5, 1, 2]) {
      const speed = isoSpeedOfCurve(developCurve(normal, p)).speed;
      expect(Math.abs(Math.log2(speed / base) - developmentSpeedStops(p))).toBeLessThan(TOL);
    }
    expect(developmentSpeedStops(1)).toBe(DEFAULT_DEVELOPMENT_MODEL.speedStopsPerStop);
  });

  it('a pulled negative no longer meets the ISO 6 contrast; normal development does', () => {
    expect(isoSpeedOfCurve(normal).contrastMet).toBe(true);
    expect(isoSpeedOfCurve(developCurve(normal, -1)).contrastMet).toBe(false);
  });

  it('leaves the curve alone at 0 and refuses silly values', () => {
    expect(developCurve(normal, 0)).toBe(normal);
    expect(() => developCurve(normal, 5)).toThrow(RangeError);
  });
});
