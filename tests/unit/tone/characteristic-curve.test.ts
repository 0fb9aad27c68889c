import { describe, expect, it } from 'vitest';
import {
  curveThroughPoint,
  density,
  gradient,
  logHAtDensity,
  makeCurve,
  netDensity,
  sampleCurve,
  shiftCurve,
} from '../../../shared/tone/characteristic-curve';

/** Shared default tolerance for this file (density units / log units; numerical precision of the model). */
const TOL = 1e-6;

// An arbitrary test curve (model values, invented for the test).
const curve = makeCurve({ baseFog: 0.2, dMax: 2.4, gamma: 0.65, toe: 0.12, shoulder: 0.25, inertiaLogH: -2.6 });

describe('characteristic curve', () => {
  it('runs from base + fog to maximum density (physics: H&D curve limits)', () => {
    expect(density(curve, -10)).toBeCloseTo(curve.baseFog, 6);
    expect(density(curve, 5)).toBeCloseTo(curve.dMax, 3);
    expect(netDensity(curve, -40)).toBeGreaterThanOrEqual(0);
  });

  it('is strictly increasing with a continuous slope no steeper than gamma (physics: monotonic curve)', () => {
    let prevD = -Infinity;
    let prevG = gradient(curve, -6);
    for (let x = -6; x <= 2; x += 0.01) {
      const d = density(curve, x);
      const g = gradient(curve, x);
      expect(d).toBeGreaterThan(prevD);
      expect(g).toBeGreaterThan(0);
      expect(g).toBeLessThanOrEqual(curve.gamma + TOL);
      expect(Math.abs(g - prevG)).toBeLessThan(0.05); // no jump in slope between 0.01 log steps
      prevD = d;
      prevG = g;
    }
  });

  it('has an analytic gradient equal to the numeric derivative', () => {
    for (const x of [-4, -3, -2.6, -2, -1, 0, 1]) {
      const h = 1e-5;
      const numeric = (density(curve, x + h) - density(curve, x - h)) / (2 * h);
      expect(Math.abs(gradient(curve, x) - numeric)).toBeLessThan(TOL);
    }
  });

  it('reaches the straight-line slope gamma in its middle', () => {
    const mid = curve.inertiaLogH + (curve.dMax - curve.baseFog) / (2 * curve.gamma);
    expect(gradient(curve, mid)).toBeGreaterThan(0.95 * curve.gamma);
  });

  it('inverts: logHAtDensity(density(x)) = x', () => {
    for (const x of [-3.5, -2.5, -1.2, 0]) expect(Math.abs(logHAtDensity(curve, density(curve, x)) - x)).toBeLessThan(TOL);
    expect(Number.isNaN(logHAtDensity(curve, curve.dMax + 0.1))).toBe(true);
  });

  it('places a curve through a point and shifts it along log H', () => {
    const placed = curveThroughPoint(curve, 0.7, -2.5, 0.1);
    expect(Math.abs(netDensity(placed, -2.5) - 0.1)).toBeLessThan(TOL);
    const moved = shiftCurve(placed, 0.3);
    expect(Math.abs(density(moved, -2.2) - density(placed, -2.5))).toBeLessThan(TOL);
  });

  it('rejects impossible parameters', () => {
    expect(() => makeCurve({ ...curve, gamma: 0 })).toThrow(/gamma/);
    expect(() => makeCurve({ ...curve, dMax: 0.1 })).toThrow(/dMax/);
  });

  it('samples evenly for charts', () => {
    const pts = sampleCurve(curve, -4, 0, 5);
    expect(pts.map((p) => p.logH)).toEqual([-4, -3, -2, -1, 0]);
  });
});
