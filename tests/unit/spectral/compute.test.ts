import { describe, expect, it } from 'vitest';
import { filterFactor, prepareLightPath, resolveLightPath, resolveSwatch, simulate, simulateSwatches, stopsFromGrey, type SimulationInput } from '../../../shared/spectral/compute';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { longPass, neutralDensity } from '../../../shared/spectral/filters';
import { cieIlluminant } from '../../../shared/spectral/lights';
import { FLOOR_STOPS, MAX_FILTER_STOPS } from '../../../shared/spectral/limits';
import { eyeMedium } from '../../../shared/spectral/media';
import { flat, upsampleTable } from './fixtures';
import { thrown } from './thrown';

/** Default tolerance of this file. */
const TOL = 1e-9;

const errorOf = (fn: () => unknown) => thrown(SpectralInputError, fn);

const req = (r: Partial<SimulationInput>): SimulationInput => ({ light: { cie: 'D65' }, filters: [], medium: { id: 'panchromatic' }, swatches: [], ...r });

describe('the computation', () => {
  it('gives XYZ with Y = 100 for white, L* = 100, and the tones of DESIGN.md §3', () => {
    const lightPath = prepareLightPath({ light: cieIlluminant('D65'), medium: eyeMedium() });
    const [w, g] = simulateSwatches(lightPath, [
      { name: 'white', reflectance: flat(1), estimated: false },
      { name: 'grey', reflectance: flat(0.18), estimated: false },
    ]).swatches;
    expect(Math.abs(w.xyz[1] - 100)).toBeLessThanOrEqual(TOL);
    expect(Math.abs(w.lab[0] - 100)).toBeLessThanOrEqual(1e-6);
    expect(Math.abs(w.lab[1]) + Math.abs(w.lab[2])).toBeLessThanOrEqual(1e-6);
    expect(Math.abs(g.exposure - 0.18)).toBeLessThanOrEqual(TOL);
    expect(Math.abs(g.stops)).toBeLessThanOrEqual(TOL);
    expect(Math.abs(w.stops - Math.log2(1 / 0.18))).toBeLessThanOrEqual(TOL);
    expect(Math.abs(g.zone - 5)).toBeLessThanOrEqual(TOL);
  });
  it('factor = 2^stops; an ND 0.9 costs 3 stops (to rounding of 0.3 per stop)', () => {
    const f = filterFactor(cieIlluminant('A'), [neutralDensity(0.9)], eyeMedium());
    expect(Math.abs(f.factor - 2 ** f.stops)).toBeLessThanOrEqual(TOL);
    expect(Math.abs(f.factor - 10 ** 0.9)).toBeLessThanOrEqual(1e-6);
    expect(f.opaque).toBe(false);
  });
  it('caps a filter that passes nothing the medium sees, and flags it opaque', () => {
    const s = prepareLightPath({ light: cieIlluminant('D65'), filters: [neutralDensity(10), neutralDensity(10)], medium: eyeMedium() });
    expect(s.factor.stops).toBe(MAX_FILTER_STOPS);
    expect(s.factor.opaque).toBe(true);
  });
  it('floors black at FLOOR_STOPS and clamps zones to 0..10', () => {
    const lightPath = prepareLightPath({ light: cieIlluminant('D65'), medium: eyeMedium() });
    const [b] = simulateSwatches(lightPath, [{ name: 'black', reflectance: flat(0), estimated: false }]).swatches;
    expect(b.stops).toBe(FLOOR_STOPS);
    expect(b.zone).toBe(0);
    expect(stopsFromGrey(0.36)).toBeCloseTo(1, 12);
  });
  it('a filter moves colours but not neutrals: red through a red filter reads lighter', () => {
    const table = upsampleTable();
    const r = simulate(req({ filters: [{ id: 'red-590' }], swatches: [{ name: 'lips', srgb: '#b01c2e' }, { name: 'grey', reflectance: [[380, 0.18], [780, 0.18], [580, 0.18]] }] }), table);
    expect(r.swatches[0].shift).toBeGreaterThan(1);
    expect(r.swatches[0].estimated).toBe(true);
    expect(Math.abs(r.swatches[1].shift)).toBeLessThanOrEqual(TOL);
    expect(r.swatches[1].estimated).toBe(false);
  });
  it('rgb and lab swatches estimate the same spectrum as the hex', () => {
    const table = upsampleTable();
    const a = resolveSwatch({ name: 'a', srgb: '#336699' }, table).reflectance.values;
    const b = resolveSwatch({ name: 'b', rgb: [0x33, 0x66, 0x99] }, table).reflectance.values;
    for (let i = 0; i < a.length; i++) expect(Math.abs(a[i] - b[i])).toBeLessThanOrEqual(1e-12);
  });
});

describe('resolution errors name the field', () => {
  it.each([
    [{ light: { id: 'nope' } }, 'light.id', /no built-in light "nope"/],
    [{ light: { id: 'red-590' } }, 'light.id', /built-in filter, not a light/],
    [{ medium: { id: 'd65' } }, 'medium.id', /built-in light, not a medium/],
    [{ filters: [{ id: 'red-590' }, { id: 'panchromatic' }] }, 'filters.1.id', /built-in medium, not a filter/],
    [{ light: { daylight: 3000 } }, 'light.daylight', /4000–25000 K/],
    [{ light: { cie: 'D65', gels: [{ samples: [[400, 2], [700, 1], [550, 1]] }] } }, 'light.gels.0.samples.0.1', /above 1/],
    [{ swatches: [{ name: 'x', lab: [50, 150, 0] }] }, 'swatches.0.lab', /outside the sRGB gamut/],
    [{ swatches: [{ name: 'x', reflectance: [[400, 0.1], [450, 0.1]] }] }, 'swatches.0.reflectance', /at least 3/],
  ] as [Partial<SimulationInput>, string, RegExp][])('%j → %s', (partial, field, message) => {
    const e = errorOf(() => simulate(req(partial), upsampleTable()));
    expect(e.field).toBe(field);
    expect(e.reason).toMatch(message);
  });
  it('a medium blind to the light is refused on medium', () => {
    const e = errorOf(() => resolveLightPath({ light: { samples: [[380, 1], [400, 1], [450, 0], [780, 0]] }, medium: { samples: [[380, 0], [600, 0], [650, 1], [780, 1]] } }));
    expect(e.field).toBe('medium');
  });
  it('filters can be parametric', () => {
    const s = resolveLightPath({ light: { cie: 'D65' }, filters: [{ longPass: { cutOnNm: 550 } }], medium: { id: 'panchromatic' } });
    expect(s.filters[0].values[40]).toBeCloseTo(longPass({ cutOnNm: 550 }).values[40], 12);
  });
});
