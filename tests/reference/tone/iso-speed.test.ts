import { describe, expect, it } from 'vitest';
import { curveForIsoSpeed, isoSpeed, isoSpeedOfCurve } from '../../../shared/tone/iso-speed';
import { curveThroughPoint, density, netDensity } from '../../../shared/tone/characteristic-curve';
import { mediumToneDefaults } from '../../../shared/tone/media-tone';

/** Shared default tolerance for this file (relative, on speeds and densities). */
const TOL = 1e-6;

// ISO 6:1993 (black-and-white pictorial negative film, speed determination):
/** ISO 6:1993: speed point M is 0.10 above base + fog. */
const ISO6_NET_DENSITY_M = 0.1;
/** ISO 6:1993: N lies 1.30 log-exposure units beyond M … */
const ISO6_LOG_INTERVAL = 1.3;
/** ISO 6:1993: … and 0.80 higher in density under the standard development. */
const ISO6_RISE = 0.8;
/** ISO 6:1993: S = 0.8 / Hm; with Hm = 0.0032 lux·s the speed is 250. */
const HM_LUX_SECONDS = 0.0032;
const EXPECTED_SPEED = 250;

const logHm = Math.log10(HM_LUX_SECONDS);
const BASE_FOG = 0.22; // invented for the test

/**
 * A hand-built tabulated curve, independent of Grisaille's model: (log10 H, net density) points joined by
 * straight lines, drawn through M (logHm, 0.10) and N (logHm + 1.30, 0.90) with a toe and a shoulder.
 */
const TABLE: [number, number][] = [
  [logHm - 2, 0],
  [logHm - 1, 0.01],
  [logHm - 0.5, 0.04],
  [logHm, 0.1],
  [logHm + 0.4, 0.3],
  [logHm + 0.9, 0.62],
  [logHm + 1.3, 0.9],
  [logHm + 2.2, 1.5],
  [logHm + 3.2, 1.8],
];
function tabulated(x: number): number {
  if (x <= TABLE[0][0]) return BASE_FOG + TABLE[0][1];
  for (let i = 1; i < TABLE.length; i++) {
    const [x1, y1] = TABLE[i];
    const [x0, y0] = TABLE[i - 1];
    if (x <= x1) return BASE_FOG + y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
  }
  return BASE_FOG + TABLE[TABLE.length - 1][1];
}

describe('ISO 6:1993 speed, S = 0.8 / Hm', () => {
  it('a hand-built curve through M and N with Hm = 0.0032 lux·s has speed 250 (ISO 6:1993)', () => {
    const r = isoSpeed(tabulated, BASE_FOG);
    expect(Math.abs(r.hmLuxSeconds / HM_LUX_SECONDS - 1)).toBeLessThan(TOL);
    expect(Math.abs(r.densityRise - ISO6_RISE)).toBeLessThan(TOL);
    expect(r.contrastMet).toBe(true);
    expect(Math.abs(r.speed / EXPECTED_SPEED - 1)).toBeLessThan(TOL);
    expect(r.nominalSpeed).toBe(EXPECTED_SPEED);
  });

  it('a modelled curve built to that contrast with Hm = 0.0032 lux·s has speed 250 (ISO 6:1993)', () => {
    const d = mediumToneDefaults('medium.panchromatic');
    if (d.kind !== 'negative') throw new Error('expected a negative');
    // build it here by search on gamma, independently of curveForIsoSpeed: the curve through M whose rise to N is 0.80
    let lo = 0.1;
    let hi = 5;
    for (let i = 0; i < 100; i++) {
      const g = (lo + hi) / 2;
      const c = curveThroughPoint(d.shape, g, logHm, ISO6_NET_DENSITY_M);
      if (netDensity(c, logHm + ISO6_LOG_INTERVAL) - ISO6_NET_DENSITY_M < ISO6_RISE) lo = g;
      else hi = g;
    }
    const curve = curveThroughPoint(d.shape, (lo + hi) / 2, logHm, ISO6_NET_DENSITY_M);
    expect(Math.abs(density(curve, logHm + ISO6_LOG_INTERVAL) - density(curve, logHm) - ISO6_RISE)).toBeLessThan(TOL);
    const r = isoSpeedOfCurve(curve);
    expect(r.contrastMet).toBe(true);
    expect(Math.abs(r.speed / EXPECTED_SPEED - 1)).toBeLessThan(TOL);
    expect(r.nominalSpeed).toBe(EXPECTED_SPEED);
    // and the library's own builder agrees
    const built = curveForIsoSpeed(d.shape, EXPECTED_SPEED);
    expect(Math.abs(built.gamma / curve.gamma - 1)).toBeLessThan(TOL);
    expect(Math.abs(isoSpeedOfCurve(built).hmLuxSeconds / HM_LUX_SECONDS - 1)).toBeLessThan(TOL);
  });

  it('the same model curve, sampled every 0.01 log H and read back as a table, still gives 250', () => {
    const d = mediumToneDefaults('medium.orthochromatic');
    if (d.kind !== 'negative') throw new Error('expected a negative');
    const curve = curveForIsoSpeed(d.shape, EXPECTED_SPEED);
    const xs = Array.from({ length: 801 }, (_, i) => -6 + i * 0.01);
    const ys = xs.map((x) => density(curve, x));
    const sampled = (x: number) => {
      const i = Math.min(xs.length - 2, Math.max(0, Math.floor((x - xs[0]) / 0.01)));
      return ys[i] + ((ys[i + 1] - ys[i]) * (x - xs[i])) / 0.01;
    };
    const r = isoSpeed(sampled, curve.baseFog);
    expect(r.nominalSpeed).toBe(EXPECTED_SPEED);
    // linear interpolation of a smooth curve: within 0.1 % (reason for the looser tolerance)
    expect(Math.abs(r.speed / EXPECTED_SPEED - 1)).toBeLessThan(1e-3);
  });

  it('a curve developed off the ISO contrast is reported as not meeting it (ISO 6:1993, 0.80 ± 0.05)', () => {
    const d = mediumToneDefaults('medium.panchromatic');
    if (d.kind !== 'negative') throw new Error('expected a negative');
    const steep = curveThroughPoint(d.shape, 1.2 * curveForIsoSpeed(d.shape, 250).gamma, logHm, ISO6_NET_DENSITY_M);
    const r = isoSpeedOfCurve(steep);
    expect(r.densityRise).toBeGreaterThan(ISO6_RISE + 0.05);
    expect(r.contrastMet).toBe(false);
  });
});
