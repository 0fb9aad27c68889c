/**
 * A small bounded simplex for the metamer programs: maximise (or minimise) cᵀx subject to A·x = b and
 * 0 ≤ x ≤ 1, with few equality rows (3 for a colour's XYZ) and up to a few hundred unknowns (the grid's
 * reflectances, or a smooth basis's weights).
 *
 * Method: the revised primal simplex with bounded variables (nonbasic variables sit at 0 or at 1, and an
 * entering variable may simply flip to its other bound), in two phases: phase 1 drives artificial
 * variables out of the basis from x = 0, phase 2 optimises. The basis inverse is kept dense (m × m).
 * Entering variable by the largest reduced cost (Dantzig), switching to Bland's rule (smallest index)
 * after a run of degenerate steps so it cannot cycle. Textbook method: V. Chvátal, "Linear Programming",
 * W. H. Freeman, 1983, ch. 8 (upper-bounded variables); R. J. Vanderbei, "Linear Programming:
 * Foundations and Extensions", 5th ed., Springer, 2020, ch. 9.
 */

/** A linear program in the form this solver takes. */
export interface BoundedProgram {
  /** rows × n coefficients, row-major */
  readonly a: Float64Array;
  readonly rows: number;
  readonly n: number;
  /** right-hand side, length rows */
  readonly b: ArrayLike<number>;
}

/** The answer: the optimum and the x that reaches it (null when A·x = b has no solution in the box). */
export interface BoundedSolution {
  value: number;
  x: Float64Array;
  iterations: number;
}

const EPS = 1e-10;
const MAX_ITERATIONS = 5000;
const BLAND_AFTER_DEGENERATE = 40;

interface State {
  rows: number;
  n: number;
  a: Float64Array;
  b: Float64Array;
  /** basic variable of each row (≥ n: artificial n + row) */
  basis: Int32Array;
  /** B⁻¹, rows × rows, row-major */
  binv: Float64Array;
  /** values of the basic variables */
  xb: Float64Array;
  /** for structural variables: 0 nonbasic at lower, 1 nonbasic at upper, 2 basic */
  status: Uint8Array;
  /** artificial variables still allowed in the basis */
  artificialAlive: Uint8Array;
  iterations: number;
}

function column(s: State, j: number, out: Float64Array): void {
  const { rows, n, a, binv } = s;
  // out = B⁻¹ · A_j (A_j of an artificial is a unit vector)
  for (let i = 0; i < rows; i++) {
    let v = 0;
    if (j >= n) v = binv[i * rows + (j - n)];
    else for (let k = 0; k < rows; k++) v += binv[i * rows + k] * a[k * n + j];
    out[i] = v;
  }
}

/**
 * Runs simplex iterations maximising cost·x (cost over structurals, `artificialCost` for each artificial).
 * Returns false when the iteration limit is reached.
 */
function iterate(s: State, cost: ArrayLike<number>, artificialCost: number): boolean {
  const { rows, n, a, basis, binv, xb, status } = s;
  const y = new Float64Array(rows);
  const alpha = new Float64Array(rows);
  let degenerate = 0;
  for (; s.iterations < MAX_ITERATIONS; s.iterations++) {
    // y = c_B · B⁻¹
    y.fill(0);
    for (let i = 0; i < rows; i++) {
      const j = basis[i];
      const cb = j >= n ? artificialCost : cost[j];
      if (cb === 0) continue;
      for (let k = 0; k < rows; k++) y[k] += cb * binv[i * rows + k];
    }
    // entering variable
    const bland = degenerate >= BLAND_AFTER_DEGENERATE;
    let q = -1;
    let best = 0;
    let dir = 0;
    for (let j = 0; j < n; j++) {
      const st = status[j];
      if (st === 2) continue;
      let d = cost[j];
      for (let k = 0; k < rows; k++) d -= y[k] * a[k * n + j];
      if (st === 0 ? d > EPS : d < -EPS) {
        const mag = Math.abs(d);
        if (bland) {
          q = j;
          dir = st === 0 ? 1 : -1;
          break;
        }
        if (mag > best) {
          best = mag;
          q = j;
          dir = st === 0 ? 1 : -1;
        }
      }
    }
    if (q < 0) return true;
    column(s, q, alpha);
    // ratio test: x_B(t) = x_B − dir·t·α; the entering variable moves by dir·t within [0, 1]
    let t = 1;
    let leave = -1;
    let leaveTo = 0;
    for (let i = 0; i < rows; i++) {
      const da = dir * alpha[i];
      const j = basis[i];
      if (da > EPS) {
        const lim = Math.max(0, xb[i]) / da;
        if (lim < t - 1e-15 || (bland && leave >= 0 && lim <= t + 1e-15 && j < basis[leave])) {
          t = lim;
          leave = i;
          leaveTo = 0;
        }
      } else if (da < -EPS && j < n) {
        const lim = Math.max(0, 1 - xb[i]) / -da;
        if (lim < t - 1e-15 || (bland && leave >= 0 && lim <= t + 1e-15 && j < basis[leave])) {
          t = lim;
          leave = i;
          leaveTo = 1;
        }
      }
    }
    degenerate = t < 1e-12 ? degenerate + 1 : 0;
    for (let i = 0; i < rows; i++) xb[i] -= dir * t * alpha[i];
    const enteringValue = (status[q] === 1 ? 1 : 0) + dir * t;
    if (leave < 0) {
      status[q] = status[q] === 0 ? 1 : 0; // bound flip
      continue;
    }
    const out = basis[leave];
    if (out < n) status[out] = leaveTo;
    else s.artificialAlive[out - n] = 0;
    // pivot B⁻¹ on row `leave`
    const p = alpha[leave];
    for (let k = 0; k < rows; k++) binv[leave * rows + k] /= p;
    for (let i = 0; i < rows; i++) {
      if (i === leave) continue;
      const f = alpha[i];
      if (f === 0) continue;
      for (let k = 0; k < rows; k++) binv[i * rows + k] -= f * binv[leave * rows + k];
    }
    basis[leave] = q;
    status[q] = 2;
    xb[leave] = enteringValue;
  }
  return false;
}

/**
 * Phase 1: a basic feasible point of A·x = b, 0 ≤ x ≤ 1, from x = 0 with one artificial variable per row.
 * Returns null when there is none (the colour is outside what reflectances 0..1 can make).
 */
export function feasibleStart(p: BoundedProgram): State | null {
  const { rows, n } = p;
  const a = Float64Array.from(p.a);
  const b = Float64Array.from(p.b);
  // rows with b < 0 are negated so the artificials start non-negative
  for (let i = 0; i < rows; i++) {
    if (b[i] < 0) {
      b[i] = -b[i];
      for (let j = 0; j < n; j++) a[i * n + j] = -a[i * n + j];
    }
  }
  const s: State = {
    rows,
    n,
    a,
    b,
    basis: Int32Array.from({ length: rows }, (_, i) => n + i),
    binv: new Float64Array(rows * rows),
    xb: Float64Array.from(b),
    status: new Uint8Array(n),
    artificialAlive: new Uint8Array(rows).fill(1),
    iterations: 0,
  };
  for (let i = 0; i < rows; i++) s.binv[i * rows + i] = 1;
  const zero = new Float64Array(n);
  if (!iterate(s, zero, -1)) return null;
  const scale = Math.max(1, ...Array.from(b, Math.abs));
  let infeasibility = 0;
  for (let i = 0; i < rows; i++) if (s.basis[i] >= n) infeasibility += Math.abs(s.xb[i]);
  if (infeasibility > 1e-9 * scale) return null;
  // artificials left in the basis at zero: pivot them out where a structural can take their place
  const alpha = new Float64Array(rows);
  for (let i = 0; i < rows; i++) {
    if (s.basis[i] < n) continue;
    for (let j = 0; j < n; j++) {
      if (s.status[j] === 2) continue;
      column(s, j, alpha);
      if (Math.abs(alpha[i]) > 1e-9) {
        const pv = alpha[i];
        for (let k = 0; k < rows; k++) s.binv[i * rows + k] /= pv;
        for (let r = 0; r < rows; r++) {
          if (r === i || alpha[r] === 0) continue;
          for (let k = 0; k < rows; k++) s.binv[r * rows + k] -= alpha[r] * s.binv[i * rows + k];
        }
        // x_j stays at its bound value; the basic values are unchanged (the artificial was at 0)
        s.xb[i] = s.status[j] === 1 ? 1 : 0;
        s.basis[i] = j;
        s.status[j] = 2;
        break;
      }
    }
  }
  return s;
}

function copyState(s: State): State {
  return { ...s, basis: Int32Array.from(s.basis), binv: Float64Array.from(s.binv), xb: Float64Array.from(s.xb), status: Uint8Array.from(s.status), artificialAlive: Uint8Array.from(s.artificialAlive), iterations: 0 };
}

function solutionOf(s: State, c: ArrayLike<number>): BoundedSolution {
  const x = new Float64Array(s.n);
  for (let j = 0; j < s.n; j++) if (s.status[j] === 1) x[j] = 1;
  for (let i = 0; i < s.rows; i++) if (s.basis[i] < s.n) x[s.basis[i]] = Math.min(1, Math.max(0, s.xb[i]));
  let value = 0;
  for (let j = 0; j < s.n; j++) value += c[j] * x[j];
  return { value, x, iterations: s.iterations };
}

/**
 * The least and greatest of cᵀx over A·x = b, 0 ≤ x ≤ 1, with the x reaching each; null when the set
 * is empty. Artificial variables that stayed basic at zero (redundant rows) are held at zero.
 */
export function boundedExtremes(p: BoundedProgram, c: ArrayLike<number>): { min: BoundedSolution; max: BoundedSolution } | null {
  const start = feasibleStart(p);
  if (!start) return null;
  const neg = Float64Array.from(c, (v) => -v);
  const hi = copyState(start);
  const lo = copyState(start);
  // a basic artificial (redundant row) gets a prohibitive cost so it stays at zero
  iterate(hi, c, -1e6);
  iterate(lo, neg, -1e6);
  const max = solutionOf(hi, c);
  const min = solutionOf(lo, c);
  return { min, max };
}
