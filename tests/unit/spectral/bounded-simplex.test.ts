/**
 * The bounded simplex (shared/spectral/bounded-simplex.ts): min and max of cᵀx over A·x = b, 0 ≤ x ≤ 1.
 * Small programs whose answers are worked out by hand, then random ones checked against brute force:
 * every vertex of {A·x = b, 0 ≤ x ≤ 1} has n − rows variables at a bound and the rest solved from A
 * (the basic solutions of linear programming; Chvátal 1983, ch. 8), and the optimum of a bounded
 * feasible program is reached at one of them.
 */
import { describe, expect, it } from 'vitest';
import { boundedExtremes, type BoundedProgram } from '../../../shared/spectral/bounded-simplex';
import { random } from './fixtures';

/** Default tolerance of this file (floating point only; every answer here is exact). */
const TOL = 1e-9;

const program = (rowsOfA: number[][], b: number[]): BoundedProgram => ({ a: Float64Array.from(rowsOfA.flat()), rows: rowsOfA.length, n: rowsOfA[0].length, b });

/** A·x, to check a solution is feasible. */
function residual(p: BoundedProgram, x: ArrayLike<number>): number {
  let worst = 0;
  for (let i = 0; i < p.rows; i++) {
    let s = 0;
    for (let j = 0; j < p.n; j++) s += p.a[i * p.n + j] * x[j];
    worst = Math.max(worst, Math.abs(s - p.b[i]));
  }
  return worst;
}

function expectFeasible(p: BoundedProgram, x: Float64Array): void {
  expect(residual(p, x)).toBeLessThanOrEqual(TOL);
  for (const v of x) {
    expect(v).toBeGreaterThanOrEqual(0);
    expect(v).toBeLessThanOrEqual(1);
  }
}

describe('programs with answers known by hand', () => {
  it('a box with one sum: x₁ + x₂ + x₃ = 1.5; cᵀx = x₁ + 2x₂ + 3x₃ ranges over [2, 4]', () => {
    // min: fill the cheapest first: x₁ = 1, x₂ = 0.5 → 1 + 1 = 2; max: x₃ = 1, x₂ = 0.5 → 3 + 1 = 4
    const p = program([[1, 1, 1]], [1.5]);
    const r = boundedExtremes(p, [1, 2, 3])!;
    expect(r.min.value).toBeCloseTo(2, 12);
    expect(r.max.value).toBeCloseTo(4, 12);
    expect(Array.from(r.min.x)).toEqual([1, 0.5, 0]);
    expect(Array.from(r.max.x)).toEqual([0, 0.5, 1]);
    expectFeasible(p, r.min.x);
    expectFeasible(p, r.max.x);
  });

  it('the whole box when the equality says nothing of the objective: 0·x = 0 with c = (1, −1) gives [−1, 1]', () => {
    const p = program([[0, 0]], [0]);
    const r = boundedExtremes(p, [1, -1])!;
    expect(r.min.value).toBeCloseTo(-1, 12);
    expect(r.max.value).toBeCloseTo(1, 12);
  });

  it('an equality that fixes a variable: x₂ = 0.3 leaves x₁, x₃ free in [0, 1]', () => {
    // c = (1, 10, −1): min = 0 + 3 − 1 = 2, max = 1 + 3 + 0 = 4
    const p = program([[0, 1, 0]], [0.3]);
    const r = boundedExtremes(p, [1, 10, -1])!;
    expect(r.min.value).toBeCloseTo(2, 12);
    expect(r.max.value).toBeCloseTo(4, 12);
    expect(r.min.x[1]).toBeCloseTo(0.3, 12);
    expect(r.max.x[1]).toBeCloseTo(0.3, 12);
  });

  it('a single point: x₁ + x₂ = 2 forces both to 1 (degenerate: every basic variable sits at a bound)', () => {
    const p = program([[1, 1]], [2]);
    const r = boundedExtremes(p, [3, -5])!;
    expect(r.min.value).toBeCloseTo(-2, 12);
    expect(r.max.value).toBeCloseTo(-2, 12);
    expect(Array.from(r.max.x)).toEqual([1, 1]);
  });

  it('a degenerate vertex: x₁ + x₂ = 1 and x₁ − x₂ = 1 meet at (1, 0), on two bounds at once', () => {
    const p = program([[1, 1, 0], [1, -1, 0]], [1, 1]);
    const r = boundedExtremes(p, [1, 1, 2])!;
    expect(r.min.value).toBeCloseTo(1, 12);
    expect(r.max.value).toBeCloseTo(3, 12);
    expect(r.max.x[0]).toBeCloseTo(1, 12);
    expect(r.max.x[1]).toBeCloseTo(0, 12);
    expectFeasible(p, r.max.x);
  });

  it('redundant rows: the same equality twice, and a row that is the sum of two others', () => {
    const twice = program([[1, 1, 1], [2, 2, 2]], [1.5, 3]);
    const a = boundedExtremes(twice, [1, 2, 3])!;
    expect(a.min.value).toBeCloseTo(2, 12);
    expect(a.max.value).toBeCloseTo(4, 12);
    expectFeasible(twice, a.min.x);
    expectFeasible(twice, a.max.x);
    // x₁ + x₂ = 1, x₃ + x₄ = 1, and their sum = 2; c = (1, 0, 0, 1): min 0 (x₂ = x₃ = 1), max 2
    const summed = program([[1, 1, 0, 0], [0, 0, 1, 1], [1, 1, 1, 1]], [1, 1, 2]);
    const b = boundedExtremes(summed, [1, 0, 0, 1])!;
    expect(b.min.value).toBeCloseTo(0, 12);
    expect(b.max.value).toBeCloseTo(2, 12);
    expectFeasible(summed, b.min.x);
    expectFeasible(summed, b.max.x);
  });

  it('a negative right-hand side: −x₁ − x₂ = −0.5', () => {
    const p = program([[-1, -1]], [-0.5]);
    const r = boundedExtremes(p, [1, 0])!;
    expect(r.min.value).toBeCloseTo(0, 12);
    expect(r.max.value).toBeCloseTo(0.5, 12);
    expectFeasible(p, r.max.x);
  });

  it('infeasible programs answer null: a sum beyond the box, contradictory rows, redundant rows that disagree', () => {
    expect(boundedExtremes(program([[1, 1]], [2.5]), [1, 1])).toBeNull();
    expect(boundedExtremes(program([[1, 1]], [-0.1]), [1, 1])).toBeNull();
    expect(boundedExtremes(program([[1, 0], [1, 0]], [0.2, 0.3]), [1, 1])).toBeNull();
    expect(boundedExtremes(program([[0, 0]], [1]), [1, 1])).toBeNull();
  });
});

/** Solves the square system M·y = r by Gaussian elimination with partial pivoting; null when singular. */
function solve(m: number[][], r: number[]): number[] | null {
  const k = r.length;
  const a = m.map((row, i) => [...row, r[i]]);
  for (let c = 0; c < k; c++) {
    let p = c;
    for (let i = c + 1; i < k; i++) if (Math.abs(a[i][c]) > Math.abs(a[p][c])) p = i;
    if (Math.abs(a[p][c]) < 1e-12) return null;
    [a[c], a[p]] = [a[p], a[c]];
    for (let i = 0; i < k; i++) {
      if (i === c) continue;
      const f = a[i][c] / a[c][c];
      for (let j = c; j <= k; j++) a[i][j] -= f * a[c][j];
    }
  }
  return a.map((row, i) => row[k] / row[i]);
}

/** Brute force: min and max of cᵀx over every vertex (n − rows variables at 0 or 1, the others solved); null when none. */
function bruteForce(p: BoundedProgram, c: number[]): { min: number; max: number } | null {
  const { rows, n } = p;
  let min = Infinity;
  let max = -Infinity;
  const subsets = (from: number, k: number): number[][] => (k === 0 ? [[]] : from >= n ? [] : [...subsets(from + 1, k - 1).map((s) => [from, ...s]), ...subsets(from + 1, k)]);
  for (const basic of subsets(0, rows)) {
    const fixed = [...Array(n).keys()].filter((j) => !basic.includes(j));
    for (let mask = 0; mask < 1 << fixed.length; mask++) {
      const x = new Array<number>(n).fill(0);
      fixed.forEach((j, t) => (x[j] = (mask >> t) & 1));
      const rhs = Array.from({ length: rows }, (_, i) => p.b[i] - fixed.reduce((s, j) => s + p.a[i * n + j] * x[j], 0));
      const y = solve(Array.from({ length: rows }, (_, i) => basic.map((j) => p.a[i * n + j])), rhs);
      if (!y || y.some((v) => v < -1e-9 || v > 1 + 1e-9)) continue;
      basic.forEach((j, t) => (x[j] = y[t]));
      const v = x.reduce((s, xj, j) => s + c[j] * xj, 0);
      min = Math.min(min, v);
      max = Math.max(max, v);
    }
  }
  return min <= max ? { min, max } : null;
}

describe('random programs against brute force over the vertices', () => {
  it('agrees on 300 programs of 1–3 rows and 2–6 unknowns, feasible and not', () => {
    const rnd = random(20260101);
    let feasible = 0;
    let infeasible = 0;
    for (let t = 0; t < 300; t++) {
      const rows = 1 + Math.floor(rnd() * 3);
      const n = rows + 1 + Math.floor(rnd() * (6 - rows));
      const a = Float64Array.from({ length: rows * n }, () => (rnd() < 0.15 ? 0 : 2 * rnd() - 1));
      // two in three from a point inside the box (feasible), else any right-hand side (often infeasible)
      const inside = t % 3 !== 2;
      const x0 = Array.from({ length: n }, () => (rnd() < 0.3 ? Math.round(rnd()) : rnd()));
      const b = Array.from({ length: rows }, (_, i) => (inside ? x0.reduce((s, v, j) => s + a[i * n + j] * v, 0) : 3 * (2 * rnd() - 1)));
      const c = Array.from({ length: n }, () => 2 * rnd() - 1);
      const p: BoundedProgram = { a, rows, n, b };
      const want = bruteForce(p, c);
      const got = boundedExtremes(p, c);
      const what = `program ${t}: ${rows} × ${n}`;
      if (!want) {
        expect(got, what).toBeNull();
        infeasible++;
        continue;
      }
      feasible++;
      expect(got, what).not.toBeNull();
      expect(Math.abs(got!.min.value - want.min), what).toBeLessThanOrEqual(1e-7);
      expect(Math.abs(got!.max.value - want.max), what).toBeLessThanOrEqual(1e-7);
      expect(residual(p, got!.min.x), what).toBeLessThanOrEqual(1e-7);
      expect(residual(p, got!.max.x), what).toBeLessThanOrEqual(1e-7);
    }
    expect(feasible).toBeGreaterThan(150);
    expect(infeasible).toBeGreaterThan(10);
  });
});
