/**
 * The characteristic (Hurter–Driffield) curve of a negative: density against log10 exposure.
 *
 * Model (Grisaille's own, smooth and strictly monotonic, slope continuous everywhere):
 *   x = log10 H (H in lux·s), u = gamma · (x − inertiaLogH)      the straight line above base + fog
 *   toe:      a = toe · softplus(u / toe)                         bends the line into base + fog
 *   shoulder: n = a − shoulder · [softplus((a − R) / shoulder) − softplus(−R / shoulder)], R = dMax − baseFog
 *   D = baseFog + n
 * so D → baseFog for small exposure, D ≈ baseFog + u on the straight line, D → dMax for large exposure.
 * `toe` and `shoulder` are softness in density units (bigger = longer, gentler bend). The inertia point is
 * where the extended straight line meets base + fog (the classic H&D construction).
 */

export interface CurveShape {
  /** density of the clear base plus fog, e.g. 0.25 */
  baseFog: number;
  /** maximum density (total, including base + fog) */
  dMax: number;
  /** toe softness, density units (> 0) */
  toe: number;
  /** shoulder softness, density units (> 0) */
  shoulder: number;
}

export interface CharacteristicCurve extends CurveShape {
  /** slope of the straight line, density per log10 exposure unit */
  gamma: number;
  /** log10 of the exposure (lux·s) where the extended straight line meets base + fog */
  inertiaLogH: number;
}

/** Search range for inversions, log10 lux·s: 1e-12 .. 1e8 lux·s covers any curve built here. */
export const LOG_H_SEARCH: readonly [number, number] = [-12, 8];

/** softplus(z) = ln(1 + e^z), computed without overflow. */
function softplus(z: number): number {
  return Math.max(z, 0) + Math.log1p(Math.exp(-Math.abs(z)));
}
/** logistic(z) = 1 / (1 + e^-z), the derivative of softplus. */
function logistic(z: number): number {
  return z >= 0 ? 1 / (1 + Math.exp(-z)) : Math.exp(z) / (1 + Math.exp(z));
}

/** Checks a curve's parameters; throws a RangeError naming the bad one. Returns the same curve. */
export function makeCurve(c: CharacteristicCurve): CharacteristicCurve {
  const bad = (k: string) => {
    throw new RangeError(`characteristic curve: ${k} out of range`);
  };
  if (!(c.baseFog >= 0)) bad('baseFog');
  if (!(c.dMax > c.baseFog)) bad('dMax');
  if (!(c.gamma > 0) || !Number.isFinite(c.gamma)) bad('gamma');
  if (!(c.toe > 0)) bad('toe');
  if (!(c.shoulder > 0)) bad('shoulder');
  if (!Number.isFinite(c.inertiaLogH)) bad('inertiaLogH');
  return Object.freeze({ ...c });
}

/** Density above base + fog (net density) at log10 exposure `logH` (lux·s). Dimensionless density. */
export function netDensity(c: CharacteristicCurve, logH: number): number {
  const range = c.dMax - c.baseFog;
  const u = c.gamma * (logH - c.inertiaLogH);
  const a = c.toe * softplus(u / c.toe);
  return a - c.shoulder * (softplus((a - range) / c.shoulder) - softplus(-range / c.shoulder));
}

/** Total density (base + fog included) at log10 exposure `logH` (lux·s). */
export function density(c: CharacteristicCurve, logH: number): number {
  return c.baseFog + netDensity(c, logH);
}

/** Local gradient dD / dlog10 H at `logH` (lux·s); analytic, continuous, > 0, at most gamma. */
export function gradient(c: CharacteristicCurve, logH: number): number {
  const range = c.dMax - c.baseFog;
  const u = c.gamma * (logH - c.inertiaLogH);
  const a = c.toe * softplus(u / c.toe);
  return c.gamma * logistic(u / c.toe) * (1 - logistic((a - range) / c.shoulder));
}

/**
 * Inverse of a monotonic increasing function by bisection: x in [lo, hi] with f(x) = target.
 * Returns NaN when the target lies outside f's range on the interval.
 */
export function solveIncreasing(f: (x: number) => number, target: number, lo = LOG_H_SEARCH[0], hi = LOG_H_SEARCH[1]): number {
  const fl = f(lo);
  const fh = f(hi);
  if (!(target >= fl && target <= fh)) return Number.NaN;
  for (let i = 0; i < 200 && hi - lo > 1e-13; i++) {
    const mid = 0.5 * (lo + hi);
    if (f(mid) < target) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** log10 exposure (lux·s) at which the curve reaches total density `d`; NaN outside (baseFog, dMax). */
export function logHAtDensity(c: CharacteristicCurve, d: number): number {
  return solveIncreasing((x) => density(c, x), d);
}

/**
 * Builds a curve from its shape and gamma, placed so that its net density is `net` at `logH` (lux·s).
 * The curve is a pure translation along log H of the inertia point, so this is exact.
 */
export function curveThroughPoint(shape: CurveShape, gamma: number, logH: number, net: number): CharacteristicCurve {
  const probe = makeCurve({ ...shape, gamma, inertiaLogH: 0 });
  const x0 = solveIncreasing((x) => netDensity(probe, x), net);
  if (!Number.isFinite(x0)) throw new RangeError('characteristic curve: net density out of the curve range');
  return makeCurve({ ...shape, gamma, inertiaLogH: logH - x0 });
}

/** The same curve moved along the log H axis by `deltaLogH` (log10 units; + = needs more exposure). */
export function shiftCurve(c: CharacteristicCurve, deltaLogH: number): CharacteristicCurve {
  return makeCurve({ ...c, inertiaLogH: c.inertiaLogH + deltaLogH });
}

export interface CurvePoint {
  /** log10 exposure, lux·s */
  logH: number;
  /** total density */
  density: number;
}

/** Samples the curve from `fromLogH` to `toLogH` (log10 lux·s) in `count` even steps, for charts. */
export function sampleCurve(c: CharacteristicCurve, fromLogH: number, toLogH: number, count = 121): CurvePoint[] {
  const n = Math.max(2, Math.floor(count));
  const out: CurvePoint[] = [];
  for (let i = 0; i < n; i++) {
    const logH = fromLogH + ((toLogH - fromLogH) * i) / (n - 1);
    out.push({ logH, density: density(c, logH) });
  }
  return out;
}
