import { describe, expect, it } from 'vitest';
import { filterFromPairs, lightFromPairs, mediumFromPairs, reflectanceFromPairs } from '../../../shared/spectral/bases';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { GRID_NM } from '../../../shared/spectral/grid';
import { GRID_SIZE } from '../../../shared/spectral/policy';
import { makeSpectrum, multiply, resample, spectrumFromPairs, toPairs, valueAt } from '../../../shared/spectral/spectrum';
import { thrown } from './thrown';

/** Default tolerance: exact arithmetic up to rounding. */
const TOL = 1e-12;

const cover = (f: (nm: number) => number, step = 10): [number, number][] => Array.from({ length: Math.round(400 / step) + 1 }, (_, i) => [380 + i * step, f(380 + i * step)]);

const errorOf = (fn: () => unknown) => thrown(SpectralInputError, fn);

describe('reading [nm, value] pairs', () => {
  it('accepts any order and spacing and resamples onto the 551-sample grid (linear inside, constant outside)', () => {
    const s = spectrumFromPairs([[700, 0.7], [400, 0.4], [550, 0.55], [420, 0.42]]);
    expect(s.values).toHaveLength(GRID_SIZE);
    expect(valueAt(s, 350)).toBeCloseTo(0.4, 12); // held constant below 400 nm, to the grid's start
    expect(valueAt(s, 900)).toBeCloseTo(0.7, 12); // held constant above 700 nm, to the grid's end
    expect(Math.abs(valueAt(s, 485) - (0.42 + ((485 - 420) / 130) * 0.13))).toBeLessThanOrEqual(TOL);
  });

  it.each([
    ['a non-number value', [[400, 0.1], [500, 'x'], [700, 0.2]], [1, 1], /not a number/],
    ['a non-number wavelength', [[400, 0.1], [null, 0.2], [700, 0.2]], [1, 0], /wavelength is not a number/],
    ['a duplicate wavelength', [[400, 0.1], [500, 0.2], [500, 0.3], [700, 0.2]], [2, 0], /500 nm appears twice/],
    ['a negative value', [[400, 0.1], [500, -0.2], [700, 0.2]], [1, 1], /negative/],
    ['fewer than 3 points', [[400, 0.1], [700, 0.2]], [], /at least 3/],
    ['data not covering 400–700 nm', [[420, 0.1], [500, 0.2], [700, 0.2]], [], /must cover at least 400–700 nm/],
    ['a pair of the wrong length', [[400, 0.1, 3], [500, 0.2], [700, 0.2]], [0], /pair/],
  ])('refuses %s, naming it', (_what, pairs, path, message) => {
    const e = errorOf(() => spectrumFromPairs(pairs, { min: 0 }));
    expect(e.path).toEqual(path);
    expect(e.reason).toMatch(message);
  });

  it('refuses something that is not a list', () => {
    expect(errorOf(() => spectrumFromPairs('400,1')).reason).toMatch(/list/);
  });
});

describe('bases', () => {
  it('filters: transmittance, percent and optical density give the same transmittance', () => {
    const t = filterFromPairs(cover(() => 0.5));
    const p = filterFromPairs(cover(() => 50), 'percent');
    const d = filterFromPairs(cover(() => Math.log10(2)), 'density');
    for (let i = 0; i < GRID_SIZE; i++) {
      expect(Math.abs(p.values[i] - t.values[i])).toBeLessThanOrEqual(TOL);
      expect(Math.abs(d.values[i] - t.values[i])).toBeLessThanOrEqual(TOL);
    }
  });
  it('filters: a transmittance above 1 is refused with advice', () => {
    expect(errorOf(() => filterFromPairs(cover(() => 50))).reason).toMatch(/basis "percent"/);
  });
  it('media: log10 and quantum bases convert to relative energy sensitivity, peak 1', () => {
    // data 380–780 nm; a medium is zero beyond its data (policy.ts)
    const log = mediumFromPairs(cover((nm) => (nm - 780) / 400), 'log10'); // rises 10× over the range
    expect(Math.max(...log.values)).toBeCloseTo(1, 12);
    expect(valueAt(log, 380)).toBeCloseTo(0.1, 12);
    expect(valueAt(log, 780)).toBeCloseTo(1, 12);
    const q = mediumFromPairs(cover(() => 0.6), 'quantum'); // flat QE → energy basis ∝ λ
    GRID_NM.forEach((nm, i) => expect(Math.abs(q.values[i] - (nm >= 380 && nm <= 780 ? nm / 780 : 0))).toBeLessThanOrEqual(TOL));
  });
  it('media are zero beyond their data; lights, filters and reflectances hold their end values (policy.ts)', () => {
    const pairs = cover((nm) => 0.2 + (nm - 380) / 1000);
    const m = mediumFromPairs(pairs);
    for (const nm of [350, 379, 781, 900]) expect(valueAt(m, nm)).toBe(0);
    expect(valueAt(m, 380)).toBeGreaterThan(0);
    const l = lightFromPairs(pairs);
    const f = filterFromPairs(pairs);
    const r = reflectanceFromPairs(pairs);
    for (const s of [l, f, r]) {
      expect(valueAt(s, 350)).toBe(valueAt(s, 380));
      expect(valueAt(s, 900)).toBe(valueAt(s, 780));
    }
  });
  it('media: log10 values may be negative; energy values may not', () => {
    expect(() => mediumFromPairs(cover(() => -1), 'log10')).not.toThrow();
    expect(errorOf(() => mediumFromPairs(cover(() => -1))).reason).toMatch(/negative/);
  });
  it('lights: scaled to a peak of 1; all-zero refused', () => {
    expect(Math.max(...lightFromPairs(cover((nm) => nm)).values)).toBe(1);
    expect(errorOf(() => lightFromPairs(cover(() => 0))).reason).toMatch(/zero everywhere/);
  });
  it('reflectance: fraction or percent', () => {
    const a = reflectanceFromPairs(cover(() => 0.3));
    const b = reflectanceFromPairs(cover(() => 30), 'percent');
    expect(Math.abs(a.values[40] - b.values[40])).toBeLessThanOrEqual(TOL);
    expect(errorOf(() => reflectanceFromPairs(cover(() => 30))).reason).toMatch(/percent/);
  });
});

describe('spectra are values', () => {
  it('operations return new spectra and leave their arguments alone', () => {
    const a = makeSpectrum(new Float64Array(GRID_SIZE).fill(0.5));
    const b = makeSpectrum(new Float64Array(GRID_SIZE).fill(0.5));
    const c = multiply(a, b);
    expect(c.values[0]).toBe(0.25);
    expect(a.values[0]).toBe(0.5);
    expect(Object.isFrozen(c)).toBe(true);
  });
  it('a grid mismatch must be resampled explicitly', () => {
    const coarse = makeSpectrum([1, 2, 3], { startNm: 380, endNm: 780, stepNm: 200 });
    const fine = makeSpectrum(new Float64Array(GRID_SIZE).fill(1));
    expect(() => multiply(fine, coarse)).toThrow(/resample/);
    const r = resample(coarse);
    expect(valueAt(r, 480)).toBeCloseTo(1.5, 12);
    expect(toPairs(r)[0]).toEqual([350, 1]); // the grid starts at 350 nm; the first value held below 380
    expect(toPairs(r)[30]).toEqual([380, 1]);
    expect(toPairs(r)[GRID_SIZE - 1]).toEqual([900, 3]);
  });
});

describe('curves whose values would overflow (issue 14: a curve that turns into nulls is refused)', () => {
  it('a log10 sensitivity curve of 400 (10^400 overflows a double) is refused with the reason, not turned into NaN', () => {
    const e = errorOf(() => mediumFromPairs(cover((nm) => 400 - (((nm - 550) / 100) ** 2)), 'log10'));
    expect(e.reason).toMatch(/too large to compute with .*log10 sensitivities lie around/);
  });

  it('an energy curve with a value beyond the double range is refused with a reason, not turned into NaN', () => {
    const e = errorOf(() => mediumFromPairs([[400, 1], [500, Infinity], [700, 1]]));
    expect(e.reason).toMatch(/not a number|too large/);
  });
});
