import { describe, expect, it } from 'vitest';
import { buildTonePipeline } from '../../../shared/tone/tone-pipeline';
import { TONE_MEDIUM_IDS } from '../../../shared/tone/media-tone';
import { keyOffsetStops } from '../../../shared/tone/zones';

/** Shared default tolerance for this file (relative luminance / stops). */
const TOL = 1e-6;
/** IEC 61966-2-1: 18 % relative luminance is sRGB 118 of 255. */
const SRGB8_MIDDLE_GREY = 118;

/** A neutral ramp: middle grey from 8 stops under to 6 stops over, in sixth stops. */
const RAMP = Array.from({ length: 85 }, (_, i) => 0.18 * 2 ** (-8 + i / 6));

describe('tone pipeline', () => {
  it('renders a neutral ramp monotonically for every medium, grade and development (physics)', () => {
    for (const mediumId of TONE_MEDIUM_IDS) {
      for (const printGrade of [-1, 2, 5]) {
        for (const developmentStops of [-1.5, 0, 2]) {
          const p = buildTonePipeline({ mediumId, settings: { printGrade, developmentStops } });
          const out = RAMP.map((m) => p.render(m));
          for (let i = 1; i < out.length; i++) {
            expect(out[i].printGrey).toBeGreaterThanOrEqual(out[i - 1].printGrey);
            expect(out[i].srgb8).toBeGreaterThanOrEqual(out[i - 1].srgb8);
            if (out[i].density !== null) expect(out[i].density!).toBeGreaterThan(out[i - 1].density!);
          }
          // strictly increasing through the middle of the scale (zones III..VII)
          const mid = out.filter((r) => r.zone >= 3 && r.zone <= 7);
          for (let i = 1; i < mid.length; i++) expect(mid[i].printGrey).toBeGreaterThan(mid[i - 1].printGrey);
        }
      }
    }
  });

  it('prints middle grey at zone V as sRGB 118 with the default settings', () => {
    for (const mediumId of TONE_MEDIUM_IDS) {
      const r = buildTonePipeline({ mediumId }).render(0.18);
      expect(r.zone).toBeCloseTo(5, 9);
      expect(r.numeral).toBe('V');
      expect(Math.abs(r.printGrey - 0.18)).toBeLessThan(TOL);
      expect(r.srgb8).toBe(SRGB8_MIDDLE_GREY);
    }
  });

  it('reports density for negatives only', () => {
    const neg = buildTonePipeline({ mediumId: 'medium.panchromatic' }).render(0.18);
    expect(neg.density).toBeGreaterThan(0.5);
    expect(neg.printDensity).toBeGreaterThan(0.5);
    expect(buildTonePipeline({ mediumId: 'medium.silicon-ir-cut' }).render(0.18).density).toBeNull();
  });

  it('flags lost and blown with the medium thresholds', () => {
    const classic = buildTonePipeline({ mediumId: 'medium.orthochromatic' });
    expect(classic.shadowDetailStops).toBe(4);
    expect(classic.renderStops(-4).lost).toBe(false);
    expect(classic.renderStops(-4.5).lost).toBe(true);
    expect(classic.renderStops(3.5).blown).toBe(true);
    const modern = buildTonePipeline({ mediumId: 'medium.panchromatic' });
    expect(modern.renderStops(-4.5).lost).toBe(false);
    expect(modern.renderStops(-5.5).lost).toBe(true);
    const custom = buildTonePipeline({ mediumId: 'medium.panchromatic', settings: { shadowDetailStops: 3 } });
    expect(custom.renderStops(-3.5).lost).toBe(true);
  });

  it('rating slower gives the shadows more room; pushing gains its real speed', () => {
    const rated = buildTonePipeline({ mediumId: 'medium.panchromatic', settings: { ratingStops: -1 } });
    expect(Math.abs(rated.shadowDetailStops - 6)).toBeLessThan(TOL);
    expect(rated.ratedEI).toBeCloseTo(125, 9);
    const pushed = buildTonePipeline({ mediumId: 'medium.panchromatic', settings: { developmentStops: 1 } });
    expect(pushed.shadowDetailStops).toBeGreaterThan(5);
    // a pushed print has more contrast about middle grey
    const normal = buildTonePipeline({ mediumId: 'medium.panchromatic' });
    expect(pushed.renderStops(2).printGrey - pushed.renderStops(-2).printGrey).toBeGreaterThan(
      normal.renderStops(2).printGrey - normal.renderStops(-2).printGrey,
    );
  });

  it('key placement moves every swatch by the same stops', () => {
    const offset = keyOffsetStops(0.5, 6); // a face read half a stop over grey, placed on zone VI
    const p = buildTonePipeline({ mediumId: 'medium.panchromatic', offsetStops: offset });
    expect(p.renderStops(0.5).zone).toBeCloseTo(6, 9);
    expect(p.renderStops(-1).zone).toBeCloseTo(4.5, 9);
  });

  it('gives zone marks along the curve for charts, and survives zero exposure', () => {
    const marks = buildTonePipeline({ mediumId: 'medium.panchromatic' }).zoneMarks();
    expect(marks.map((m) => m.numeral)[5]).toBe('V');
    for (let i = 1; i < marks.length; i++) expect(marks[i].density).toBeGreaterThan(marks[i - 1].density);
    const black = buildTonePipeline({ mediumId: 'medium.panchromatic' }).render(0);
    expect(Number.isFinite(black.zone)).toBe(true);
    expect(black.lost).toBe(true);
    expect(buildTonePipeline({ mediumId: 'medium.eye' }).zoneMarks()).toEqual([]);
  });
});
