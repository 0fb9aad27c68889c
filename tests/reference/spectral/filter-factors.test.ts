/**
 * Filter factors of the built-in presets against the figures of the trade. Expected values are common
 * practice (from memory); the cyan figure is a fact of the trade (common practice).
 */
import { describe, expect, it } from 'vitest';
import { resolveLightPath } from '../../../shared/spectral/compute';
import { OPAQUE_LIMIT_STOPS } from '../../../shared/spectral/limits';

/** Default tolerance: ±½ stop (common practice quotes filter factors to the nearest half stop or so). */
const TOL_STOPS = 0.5;

// Common practice (memory): panchromatic negative in daylight
/** yellow: factor 2 */
const YELLOW_STOPS = 1;
/** orange: factor 4 */
const ORANGE_STOPS = 2;
/** red: factor 8 */
const RED_STOPS = 3;
/** neutral density 0.3 per stop (definition of optical density: log10 2 ≈ 0.301) */
const ND_03_STOPS = 0.3 / Math.log10(2);

// Fact of the trade (common practice): a red-absorbing cyan filter costs about one stop in daylight
// and about two-thirds of a stop more under tungsten, because tungsten light is mostly red.
/** cyan in daylight (D65) */
const CYAN_DAYLIGHT_STOPS = 1;
/** tolerance of the daylight figure (issue requirement) */
const TOL_CYAN_DAYLIGHT = 1 / 3;
/** further cost under 3200 K tungsten */
const CYAN_TUNGSTEN_EXTRA_STOPS = 2 / 3;
/** tolerance of the further cost (issue requirement) */
const TOL_CYAN_EXTRA = 1 / 4;

const stops = (light: string, filter: string, medium: string) =>
  resolveLightPath({ light: { id: light }, filters: [{ id: filter }], medium: { id: medium } }).factor;

describe('filter factors on the panchromatic model in daylight (common practice, ±½ stop)', () => {
  for (const light of ['d65', 'daylight-5600']) {
    it(`yellow ≈ 1, orange ≈ 2, red ≈ 3 stops under ${light}`, () => {
      expect(Math.abs(stops(light, 'yellow-490', 'panchromatic').stops - YELLOW_STOPS)).toBeLessThanOrEqual(TOL_STOPS);
      expect(Math.abs(stops(light, 'orange-550', 'panchromatic').stops - ORANGE_STOPS)).toBeLessThanOrEqual(TOL_STOPS);
      expect(Math.abs(stops(light, 'red-590', 'panchromatic').stops - RED_STOPS)).toBeLessThanOrEqual(TOL_STOPS);
    });
  }
  it('the presets rank yellow < deep yellow < orange < red < deep red', () => {
    const s = ['yellow-490', 'deep-yellow-515', 'orange-550', 'red-590', 'deep-red-630'].map((f) => stops('d65', f, 'panchromatic').stops);
    for (let i = 1; i < s.length; i++) expect(s[i]).toBeGreaterThan(s[i - 1]);
  });
  it('neutral density 0.3 costs one stop on any medium and light', () => {
    for (const m of ['panchromatic', 'orthochromatic', 'silicon-ir-cut', 'eye']) {
      expect(Math.abs(stops('tungsten-3200', 'nd-0.3', m).stops - ND_03_STOPS)).toBeLessThanOrEqual(1e-9);
    }
  });
});

describe('the red-absorbing cyan filter (fact of the trade, common practice)', () => {
  it('costs 1 ± ⅓ stop on the panchromatic model under D65', () => {
    expect(Math.abs(stops('d65', 'cyan-530', 'panchromatic').stops - CYAN_DAYLIGHT_STOPS)).toBeLessThanOrEqual(TOL_CYAN_DAYLIGHT);
  });
  it('costs a further ⅔ ± ¼ stop under 3200 K tungsten', () => {
    const extra = stops('tungsten-3200', 'cyan-530', 'panchromatic').stops - stops('d65', 'cyan-530', 'panchromatic').stops;
    expect(Math.abs(extra - CYAN_TUNGSTEN_EXTRA_STOPS)).toBeLessThanOrEqual(TOL_CYAN_EXTRA);
  });
});

describe('a red filter on the orthochromatic model (common practice: red-blind emulsions see nothing through it)', () => {
  it(`is flagged opaque (more than ${OPAQUE_LIMIT_STOPS} stops) in daylight and under tungsten`, () => {
    for (const light of ['d65', 'tungsten-3200']) {
      const f = stops(light, 'red-590', 'orthochromatic');
      expect(f.opaque).toBe(true);
      expect(f.stops).toBeGreaterThan(OPAQUE_LIMIT_STOPS);
    }
  });
  it('while on the panchromatic model it is not', () => {
    expect(stops('d65', 'red-590', 'panchromatic').opaque).toBe(false);
  });
});
