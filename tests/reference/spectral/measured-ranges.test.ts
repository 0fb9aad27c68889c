/**
 * How sure is a grey, against published measured reflectances (data/reflectance, sources in
 * ./measured-surfaces.ts): each surface's colour under D65 alone is given to the engine, and its true
 * exposure (the measured spectrum through the look) is compared with the engine's ranges and estimate,
 * through 70 built-in looks (lights d65 and tungsten-3200 × 5 media × no filter and 7 filters, the
 * opaque ones left out) — 10,640 cases.
 *
 *   ranges (metamer-range.ts): the truth lies in the possible range always (it is one of the reflectances
 *     ranged over) and in the plausible range in most cases; the reflectances reaching the possible
 *     range's ends have the colour, lie in 0..1 and give the ends;
 *   estimate (LHTSS, Burns 2020, tabulated; estimate.ts `estimateFromXyz`): its error in stops, against
 *     the sigmoid estimate it replaced (Jakob & Hanika 2019, re-made from the paper in
 *     measured-surfaces.ts `sigmoidEstimate`) on the same surfaces, grid and looks.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { stopsFromGrey } from '../../../shared/spectral/compute';
import { estimateFromXyz } from '../../../shared/spectral/estimate';
import { exposureRange, xyzD65, type ExposureRange } from '../../../shared/spectral/metamer-range';
import type { Xyz } from '../../../shared/spectral/types';
import { upsampleTable } from '../../unit/spectral/fixtures';
import { builtInLooks, exposureOf, measuredSurfaces, median, sigmoidEstimate, type BuiltInLook, type MeasuredSurface } from './measured-surfaces';
import { tristimulusWeights } from '../../../shared/spectral/integrate';
import { cieIlluminant } from '../../../shared/spectral/lights';
import { GRID_NM } from '../../../shared/spectral/grid';

/** Default tolerance of this file: m relative to white (floating point of the programs only). */
const TOL = 1e-6;
/** XYZ reproduced by an extreme reflectance: relative, per channel, floored at 1 (Y = 100 for white). */
const TOL_XYZ_REL = 1e-6;

/** The product's requirement (issue "How sure is a grey?"): truth inside the plausible range in at least this share of cases. */
const MIN_PLAUSIBLE_COVERAGE = 0.85;


interface Case {
  surface: MeasuredSurface;
  look: BuiltInLook;
  xyz: Xyz;
  truth: number;
  estimate: number;
  range: ExposureRange;
}

const cases: Case[] = [];
let surfaces: MeasuredSurface[] = [];
let looks: BuiltInLook[] = [];

beforeAll(() => {
  const table = upsampleTable();
  surfaces = measuredSurfaces();
  looks = builtInLooks();
  const colour = surfaces.map((s) => {
    const xyz = xyzD65(s.reflectance);
    return { xyz, estimate: estimateFromXyz(xyz, table).values };
  });
  for (const look of looks) {
    const w = look.path.mediumWeights;
    surfaces.forEach((surface, i) => {
      const { xyz, estimate } = colour[i];
      const m = exposureOf(w, estimate);
      // the engine's own call: the estimate's exposure is the fallback the plausible range also holds
      cases.push({ surface, look, xyz, truth: exposureOf(w, surface.reflectance), estimate: m, range: exposureRange(xyz, w, m) });
    });
  }
});

const inside = (v: number, [lo, hi]: [number, number]) => v >= lo - TOL * Math.max(1, Math.abs(lo)) && v <= hi + TOL * Math.max(1, Math.abs(hi));
const width = ([lo, hi]: [number, number]) => stopsFromGrey(hi) - stopsFromGrey(lo);
const pct = (a: number, n: number) => `${((100 * a) / n).toFixed(1)} %`;

describe('ranges against measured surfaces', () => {
  it('uses all 152 surfaces of the four sets through 70 looks', () => {
    expect(surfaces).toHaveLength(152);
    expect(new Set(surfaces.map((s) => s.set))).toEqual(new Set(['cie-224-ces', 'cie-13-3-tcs', 'nist-cqs-vs', 'ohta-1997-colour-checker']));
    expect(looks).toHaveLength(70);
  });

  it('the truth lies inside the possible range in every case, and inside the plausible range in at least 85 %', () => {
    const outsidePossible = cases.filter((c) => !inside(c.truth, c.range.possible));
    expect(outsidePossible.map((c) => `${c.surface.set} ${c.surface.name} through ${c.look.label}`)).toEqual([]);
    const inPlausible = cases.filter((c) => inside(c.truth, c.range.plausible)).length;
    const n = cases.length;
    console.info(`truth inside possible ${pct(n - outsidePossible.length, n)}, inside plausible ${pct(inPlausible, n)} of ${n} cases`);
    console.info(`median width, stops: possible ${median(cases.map((c) => width(c.range.possible))).toFixed(3)}, plausible ${median(cases.map((c) => width(c.range.plausible))).toFixed(3)}`);
    for (const set of new Set(surfaces.map((s) => s.set))) {
      const of = cases.filter((c) => c.surface.set === set);
      console.info(`  ${set.padEnd(26)} plausible coverage ${pct(of.filter((c) => inside(c.truth, c.range.plausible)).length, of.length)} of ${of.length}, median plausible width ${median(of.map((c) => width(c.range.plausible))).toFixed(3)} stops`);
    }
    expect(inPlausible / n).toBeGreaterThanOrEqual(MIN_PLAUSIBLE_COVERAGE);
  });

  it('the plausible range lies inside the possible range and holds the estimate', () => {
    for (const c of cases) {
      const what = `${c.surface.name} through ${c.look.label}`;
      expect(c.range.plausible[0], what).toBeGreaterThanOrEqual(c.range.possible[0]);
      expect(c.range.plausible[1], what).toBeLessThanOrEqual(c.range.possible[1]);
      expect(inside(c.estimate, c.range.plausible), what).toBe(true);
    }
  });

  it("the reflectances at the possible range's ends have the colour, lie in 0..1 and give the ends", () => {
    let worstXyz = 0;
    const bad: string[] = [];
    for (const c of cases) {
      const what = `${c.surface.set} ${c.surface.name} through ${c.look.label}`;
      // the truth as the fallback: it is feasible, so the ends are the programs' own optima
      const r = exposureRange(c.xyz, c.look.path.mediumWeights, c.truth, { extremes: true });
      if (!r.extremes) {
        bad.push(`${what}: no extremes`);
        continue;
      }
      const ends: [string, Float64Array, number][] = [['low', r.extremes.low, r.possible[0]], ['high', r.extremes.high, r.possible[1]]];
      for (const [end, rho, value] of ends) {
        if (rho.some((v) => !(v >= 0 && v <= 1))) bad.push(`${what}: ${end} reflectance outside 0..1`);
        const xyz = xyzD65(rho);
        for (let k = 0; k < 3; k++) {
          const rel = Math.abs(xyz[k] - c.xyz[k]) / Math.max(1, Math.abs(c.xyz[k]));
          worstXyz = Math.max(worstXyz, rel);
          if (rel > TOL_XYZ_REL) bad.push(`${what}: ${end} reflectance's XYZ channel ${k} off by ${rel} (relative)`);
        }
        const m = exposureOf(c.look.path.mediumWeights, rho);
        if (Math.abs(m - value) > TOL * Math.max(1, value)) bad.push(`${what}: ${end} reflectance gives m ${m}, the range's end is ${value}`);
      }
    }
    console.info(`extremes: largest relative XYZ difference from the colour ${worstXyz.toExponential(2)}`);
    expect(bad).toEqual([]);
  });
});

describe('the estimate against measured surfaces', () => {
  it('errs less than the sigmoid estimate it replaced, on average and at worst', () => {
    const errors = cases.map((c) => Math.abs(stopsFromGrey(c.estimate) - stopsFromGrey(c.truth)));
    const mean = errors.reduce((a, b) => a + b, 0) / errors.length;
    const worst = Math.max(...errors);
    const at = cases[errors.indexOf(worst)];
    console.info(`estimate error, stops: mean ${mean.toFixed(4)}, median ${median(errors).toFixed(4)}, worst ${worst.toFixed(3)} (${at.surface.set} ${at.surface.name} through ${at.look.label})`);
    // the baseline: the sigmoid of a quadratic fitted to each surface's colour, through the same looks
    const d65 = tristimulusWeights(cieIlluminant('D65'));
    const baseline = new Map(surfaces.map((s) => [s, sigmoidEstimate(xyzD65(s.reflectance), [d65.x, d65.y, d65.z], GRID_NM)]));
    const before = cases.map((c) => {
      const e = baseline.get(c.surface);
      return e ? Math.abs(stopsFromGrey(exposureOf(c.look.path.mediumWeights, e)) - stopsFromGrey(c.truth)) : Infinity;
    });
    const beforeMean = before.reduce((a, b) => a + b, 0) / before.length;
    const beforeWorst = Math.max(...before);
    console.info(`sigmoid baseline, stops: mean ${beforeMean.toFixed(4)}, worst ${beforeWorst.toFixed(3)}`);
    expect(mean).toBeLessThan(beforeMean);
    expect(worst).toBeLessThan(beforeWorst);
  });
});
