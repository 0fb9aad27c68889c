/**
 * The metamer programs of metamer-range.ts (solved by our bounded simplex, bounded-simplex.ts) against an
 * independent solver run inside the test: SciPy's `linprog`, method 'highs' (the HiGHS solver; Debian
 * python3-scipy 1.10.1). Each program is: min and max of cᵀx subject to A·x = b, 0 ≤ x ≤ 1, with
 *   possible:  A = the engine's D65 tristimulus weight rows carried to the estimate's grid (3 × 111,
 *              350–900 nm at 5 nm; `weightsToEstimateGrid`, the transpose of the linear interpolation that
 *              takes a reflectance there to the 1 nm working grid), x = the reflectance on the estimate's grid,
 *              c = a look's medium weights carried the same way (`estimateWeights`; m = Σ wₑ·ρₑ);
 *   plausible: A = the rows of `plausibleProgram` (those rows times the hat basis, 3 × knots), x = the knot
 *              values, c = hatᵀ·estimateWeights(w), with `hat` ESTIMATE_SIZE × knots, at each knot spacing the
 *              engine may try (60, 30, 15, 7.5 nm; `plausibleProgram`);
 * and b = a colour's XYZ under D65, for 32 colours (estimated sRGB colours including the primaries and
 * secondaries, published measured surfaces, two narrow bands outside sRGB) through 4 built-in looks, plus
 * two colours no reflectance has (both solvers must find none).
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { boundedExtremes } from '../../../shared/spectral/bounded-simplex';
import { reflectanceFromSrgb } from '../../../shared/spectral/estimate';
import { GRID_NM } from '../../../shared/spectral/grid';
import { tristimulusWeights } from '../../../shared/spectral/integrate';
import { cieIlluminant } from '../../../shared/spectral/lights';
import { estimateWeights, exposureRange, PLAUSIBLE_KNOT_NM, plausibleProgram, plausibleRange, xyzD65 } from '../../../shared/spectral/metamer-range';
import { ESTIMATE_SIZE, ESTIMATE_STEP_NM, weightsToEstimateGrid } from '../../../shared/spectral/policy';
import type { Xyz } from '../../../shared/spectral/types';
import { upsampleTable } from '../../unit/spectral/fixtures';
import { builtInLook, measuredSurfaces, type BuiltInLook } from './measured-surfaces';

/**
 * Default tolerance of this file: relative, on the optimum values (m, relative to white), against HiGHS
 * run with feasibility tolerances of 1e-10; values below M_FLOOR are compared against M_FLOOR instead.
 */
const TOL_REL = 1e-6;
const M_FLOOR = 1e-3;
/** SciPy linprog status codes (scipy.optimize.linprog documentation, SciPy 1.10): 0 optimal, 2 infeasible. */
const OPTIMAL = 0;
const INFEASIBLE = 2;
/** The knot spacings the engine tries, nm (metamer-range.ts halves PLAUSIBLE_KNOT_NM while above the estimate grid's step). */
const SPACINGS: number[] = [];
for (let k = PLAUSIBLE_KNOT_NM; k > ESTIMATE_STEP_NM; k /= 2) SPACINGS.push(k);

const SOLVER = String.raw`
import json, sys
import numpy as np
from scipy.optimize import linprog
problems = json.load(open(sys.argv[1]))
out = []
opts = {"primal_feasibility_tolerance": 1e-10, "dual_feasibility_tolerance": 1e-10}
for p in problems:
    A = np.array(p["a"], dtype=float).reshape(3, -1)
    b = np.array(p["b"], dtype=float)
    c = np.array(p["c"], dtype=float)
    lo = linprog(c, A_eq=A, b_eq=b, bounds=(0, 1), method="highs", options=opts)
    hi = linprog(-c, A_eq=A, b_eq=b, bounds=(0, 1), method="highs", options=opts)
    out.append({"status": [int(lo.status), int(hi.status)],
                "min": float(lo.fun) if lo.status == 0 else None,
                "max": float(-hi.fun) if hi.status == 0 else None})
json.dump(out, sys.stdout)
`;

interface Problem {
  a: number[];
  b: number[];
  c: number[];
}
interface Answer {
  status: [number, number];
  min: number | null;
  max: number | null;
}

const close = (ours: number, ref: number) => Math.abs(ours - ref) <= TOL_REL * Math.max(Math.abs(ref), M_FLOOR);

// The colour rows, as the engine integrates XYZ under D65 (integrate.ts), carried to the estimate's grid
const D65 = tristimulusWeights(cieIlluminant('D65'));
const EYE_ROWS = [...weightsToEstimateGrid(D65.x), ...weightsToEstimateGrid(D65.y), ...weightsToEstimateGrid(D65.z)];

// Colours: estimated sRGB (primaries and secondaries are the most saturated), measured surfaces, narrow bands
const colours: { label: string; xyz: Xyz }[] = [];
const SRGB = ['#ff0000', '#00ff00', '#0000ff', '#ffff00', '#00ffff', '#ff00ff', '#b01c2e', '#808080', '#2e6b3a', '#d9a066', '#1f3a93', '#f2e6d0'];
const PICKED: Record<string, string[]> = {
  'nist-cqs-vs': ['VS1', 'VS3', 'VS5', 'VS7', 'VS9', 'VS11', 'VS13'],
  'cie-13-3-tcs': ['TCS09', 'TCS10', 'TCS12', 'TCS13'],
  'ohta-1997-colour-checker': ['dark skin', 'foliage', 'orange', 'cyan', 'black 2 (1.5 D)'],
  'cie-224-ces': ['CES05', 'CES40'],
};
const band = (centreNm: number, fwhmNm: number) => Float64Array.from(GRID_NM, (nm) => 0.02 + 0.9 * Math.exp(-0.5 * ((nm - centreNm) / (fwhmNm / 2.355)) ** 2));
/** Two colours no reflectance 0..1 has: a pure Y with no X or Z, and an X above the perfect white's. */
const IMPOSSIBLE: { label: string; xyz: Xyz }[] = [
  { label: 'Y without X, Z', xyz: [0, 50, 0] },
  { label: 'X above white', xyz: [120, 100, 100] },
];

const LOOKS: BuiltInLook[] = [
  builtInLook('d65', 'panchromatic', null),
  builtInLook('tungsten-3200', 'orthochromatic', 'yellow-490'),
  builtInLook('daylight-5600', 'panchromatic', 'red-590'),
  builtInLook('d65', 'panchromatic-extended-red', 'deep-red-630'),
];

const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'grisaille-linprog-'));
afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

/** Solves every problem with SciPy in one python3 process. */
function linprog(problems: Problem[]): Answer[] {
  const input = path.join(tmp, `problems-${problems.length}.json`);
  const script = path.join(tmp, 'solve.py');
  fs.writeFileSync(input, JSON.stringify(problems));
  fs.writeFileSync(script, SOLVER);
  const text = execFileSync('/usr/bin/python3', [script, input], { encoding: 'utf8', maxBuffer: 64 << 20 });
  return JSON.parse(text) as Answer[];
}

interface Case {
  colour: string;
  look: BuiltInLook;
  xyz: Xyz;
  weights: Float64Array;
  /** index of the possible program's answer */
  possible: number;
  /** index of each spacing's plausible program's answer */
  plausible: number[];
}

const cases: Case[] = [];
let answers: Answer[] = [];

beforeAll(() => {
  const table = upsampleTable();
  for (const hex of SRGB) colours.push({ label: `sRGB ${hex} (estimated)`, xyz: xyzD65(reflectanceFromSrgb(hex, table).values) });
  for (const s of measuredSurfaces()) if (PICKED[s.set]?.includes(s.name)) colours.push({ label: `${s.set} ${s.name}`, xyz: xyzD65(s.reflectance) });
  colours.push({ label: 'band 520 nm, 20 nm wide', xyz: xyzD65(band(520, 20)) }, { label: 'band 610 nm, 15 nm wide', xyz: xyzD65(band(610, 15)) });

  const problems: Problem[] = [];
  const programs = SPACINGS.map((k) => plausibleProgram(k));
  for (const colour of [...colours, ...IMPOSSIBLE]) {
    for (const look of LOOKS) {
      const w = look.path.mediumWeights;
      const we = estimateWeights(w); // the exposure of ρₑ on the estimate's grid is weᵀρₑ
      expect(we).toHaveLength(ESTIMATE_SIZE);
      const c: Case = { colour: colour.label, look, xyz: colour.xyz, weights: w, possible: problems.length, plausible: [] };
      problems.push({ a: EYE_ROWS, b: [...colour.xyz], c: [...we] });
      for (const p of programs) {
        // c = hatᵀ·wₑ: the exposure of the reflectance hat·k is wₑᵀ(hat·k)
        expect(p.hat).toHaveLength(ESTIMATE_SIZE * p.knots);
        const cw = new Array<number>(p.knots).fill(0);
        for (let i = 0; i < ESTIMATE_SIZE; i++) for (let k = 0; k < p.knots; k++) cw[k] += we[i] * p.hat[i * p.knots + k];
        c.plausible.push(problems.length);
        problems.push({ a: [...p.rows], b: [...colour.xyz], c: cw });
      }
      cases.push(c);
    }
  }
  answers = linprog(problems);
});

describe('metamer programs vs SciPy linprog (HiGHS)', () => {
  it('has 30+ colours through 4 built-in looks, none opaque', () => {
    expect(colours.length).toBeGreaterThanOrEqual(30);
    for (const l of LOOKS) expect(l.path.factor.opaque, l.label).toBe(false);
    expect(answers).toHaveLength(cases.length * (1 + SPACINGS.length));
  });

  it('possible range: the least and greatest exposure agree with HiGHS (boundedExtremes and exposureRange)', () => {
    let worst = 0;
    for (const c of cases.filter((x) => colours.some((k) => k.label === x.colour))) {
      const ref = answers[c.possible];
      const what = `${c.colour} through ${c.look.label}`;
      expect(ref.status, what).toEqual([OPTIMAL, OPTIMAL]);
      const ours = boundedExtremes({ a: Float64Array.from(EYE_ROWS), rows: 3, n: ESTIMATE_SIZE, b: c.xyz }, estimateWeights(c.weights));
      expect(ours, what).not.toBeNull();
      expect(close(ours!.min.value, ref.min!), `${what}: min ${ours!.min.value} vs ${ref.min}`).toBe(true);
      expect(close(ours!.max.value, ref.max!), `${what}: max ${ours!.max.value} vs ${ref.max}`).toBe(true);
      const r = exposureRange(c.xyz, c.weights, (ref.min! + ref.max!) / 2);
      expect(close(r.possible[0], ref.min!), `${what}: exposureRange low`).toBe(true);
      expect(close(r.possible[1], ref.max!), `${what}: exposureRange high`).toBe(true);
      worst = Math.max(worst, Math.abs(ours!.min.value - ref.min!), Math.abs(ours!.max.value - ref.max!));
    }
    console.info(`possible programs: ${cases.length - IMPOSSIBLE.length * LOOKS.length} colour × look pairs, largest difference from HiGHS ${worst.toExponential(2)} (m)`);
  });

  it('plausible range: the spacing the engine answers with is the coarsest HiGHS finds feasible, and the values agree', () => {
    let worst = 0;
    const finer = new Map<string, number>();
    for (const c of cases.filter((x) => colours.some((k) => k.label === x.colour))) {
      const what = `${c.colour} through ${c.look.label}`;
      const ours = plausibleRange(c.xyz, c.weights);
      expect(ours, what).not.toBeNull();
      const feasible = c.plausible.map((i) => answers[i].status[0] === OPTIMAL);
      const first = feasible.indexOf(true);
      for (const i of c.plausible) expect([OPTIMAL, INFEASIBLE], what).toContain(answers[i].status[0]);
      if (first < 0) {
        // no smooth reflectance at any spacing: the engine answers the estimate's grid itself, the possible range
        expect(ours!.knotNm, what).toBe(ESTIMATE_STEP_NM);
        const ref = answers[c.possible];
        expect(close(ours!.range[0], ref.min!) && close(ours!.range[1], ref.max!), what).toBe(true);
      } else {
        expect(ours!.knotNm, what).toBe(SPACINGS[first]);
        const ref = answers[c.plausible[first]];
        expect(close(ours!.range[0], ref.min!), `${what}: min ${ours!.range[0]} vs ${ref.min}`).toBe(true);
        expect(close(ours!.range[1], ref.max!), `${what}: max ${ours!.range[1]} vs ${ref.max}`).toBe(true);
        worst = Math.max(worst, Math.abs(ours!.range[0] - ref.min!), Math.abs(ours!.range[1] - ref.max!));
      }
      if (ours!.knotNm !== PLAUSIBLE_KNOT_NM) finer.set(c.colour, ours!.knotNm);
    }
    console.info(`plausible programs: largest difference from HiGHS ${worst.toExponential(2)} (m); colours needing a finer spacing than ${PLAUSIBLE_KNOT_NM} nm: ${[...finer].map(([k, v]) => `${k} (${v} nm)`).join(', ') || 'none'}`);
  });

  it('a colour no reflectance 0..1 has: both solvers find no solution', () => {
    for (const c of cases.filter((x) => IMPOSSIBLE.some((k) => k.label === x.colour))) {
      expect(answers[c.possible].status, c.colour).toEqual([INFEASIBLE, INFEASIBLE]);
      expect(boundedExtremes({ a: Float64Array.from(EYE_ROWS), rows: 3, n: ESTIMATE_SIZE, b: c.xyz }, estimateWeights(c.weights)), c.colour).toBeNull();
      expect(plausibleRange(c.xyz, c.weights), c.colour).toBeNull();
    }
  });
});
