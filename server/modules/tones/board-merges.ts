/**
 * The merges of a board through one look, per swatch. A merge: two swatches whose plausible ranges on the
 * medium come within `mergeStops` of each other (`possible`), or lie within it entirely (`certain`), yet
 * more than `mergeDeltaE` apart to the eye (CIEDE2000).
 *
 * Why it is built this way: a board of n swatches has n²/2 pairs, and on a board of random colours a third of
 * them merge, so listing every pair grows quadratically in time and in JSON (110 MB for 2,000 swatches).
 * Here the swatches are swept in order of their ranges' low ends, so only pairs within the tone window are
 * ever looked at; each swatch's L*a*b* is unpacked once into typed arrays; whether a pair in the window is
 * more than the threshold apart is decided by exact bounds on CIEDE2000 (most pairs: a few multiplications),
 * else by the formula itself rewritten with one arctangent instead of culori's six trigonometric calls, and
 * by culori when it lands within a hair of the threshold, so the pairs found are those of culori on every
 * pair; and each swatch keeps only its `PARTNERS_KEPT` nearest partners (certain first) with the full counts
 * beside them, so the answer grows with n, not n².
 */
import { differenceCiede2000, modeLab65, useMode } from 'culori/fn';
import { MERGE_PARTNERS_KEPT, type SwatchMerges, type SwatchTone } from '../../../shared/schemas/board';

/** Partners kept per swatch and look: certain merges first, then nearest on the medium. */
const PARTNERS_KEPT = MERGE_PARTNERS_KEPT;

useMode(modeLab65);
/** CIEDE2000 by culori (the reference); L*a*b* values are passed as they are (mode lab65, nothing converted). */
const culoriDe = differenceCiede2000();
const asLab = (l: readonly [number, number, number]) => ({ mode: 'lab65' as const, l: l[0], a: l[1], b: l[2] });
/** CIEDE2000 of two L*a*b* values by culori. */
export const ciede2000 = (x: readonly [number, number, number], y: readonly [number, number, number]) => culoriDe(asLab(x), asLab(y));

const P25_7 = 25 ** 7;
const DEG = 180 / Math.PI;
/** Directions of the hue angles CIEDE2000's T uses, as (cos, sin) pairs. */
const C30 = Math.cos(Math.PI / 6), S30 = Math.sin(Math.PI / 6);
const C6 = Math.cos(Math.PI / 30), S6 = Math.sin(Math.PI / 30);
const C63 = Math.cos((63 * Math.PI) / 180), S63 = Math.sin((63 * Math.PI) / 180);
/** Relative band around the threshold inside which culori decides (the fast form differs by ~1e-14). */
const SETTLE_BAND = 1e-9;
const pow7 = (x: number) => {
  const x2 = x * x;
  return x2 * x2 * x2 * x;
};

/** Swatches' L*a*b* and chroma unpacked once, so a pair costs no allocation. */
interface LabArrays {
  L: Float64Array;
  A: Float64Array;
  B: Float64Array;
  C: Float64Array;
  /** the hue's direction (a/C, b/C; 0, 0 for a grey) before CIEDE2000 stretches a* */
  UA: Float64Array;
  UB: Float64Array;
  /** the threshold, squared: kept here so a call passes no float (a float argument is boxed on every call) */
  t2: number;
}

function labArrays(tones: readonly SwatchTone[], t2: number): LabArrays {
  const n = tones.length;
  const out = { L: new Float64Array(n), A: new Float64Array(n), B: new Float64Array(n), C: new Float64Array(n), UA: new Float64Array(n), UB: new Float64Array(n), t2 };
  tones.forEach((t, i) => {
    [out.L[i], out.A[i], out.B[i]] = t.lab;
    out.C[i] = Math.hypot(t.lab[1], t.lab[2]);
    if (out.C[i] > 0) [out.UA[i], out.UB[i]] = [t.lab[1] / out.C[i], t.lab[2] / out.C[i]];
  });
  return out;
}

/** Bounds of CIEDE2000's hue weighting T over every hue (sampled at 0.0001°: 0.36206…1.57247), with margin. */
const T_MIN = 0.36, T_MAX = 1.58;
/** |sin 2Δθ| of the rotation term: at most sin 60° anywhere; this far from 275° (≥ 55°, non-circular) far less. */
const SIN_NEAR = Math.sin(Math.PI / 3);
const SIN_FAR = Math.sin(2 * (Math.PI / 6) * Math.exp(-((55 / 25) ** 2)));
const COS55 = Math.cos((55 * Math.PI) / 180);
const C275 = Math.cos((275 * Math.PI) / 180), S275 = Math.sin((275 * Math.PI) / 180);
/**
 * Before a* is stretched by 1 + G (G in 0…0.5) a hue turns by at most atan 1 − atan(1/1.5) = 11.3°, so the
 * mean hue lies within 55° + 12° of 275° only if the unstretched bisector does, provided the two hues are
 * under 150° apart (|u₁ + u₂|² ≥ 2 + 2 cos 150°; else the shorter arc could flip).
 */
const COS67_SQ = Math.cos((67 * Math.PI) / 180) ** 2;
const U_SUM_SQ_MIN = 2 + 2 * Math.cos((150 * Math.PI) / 180);
/** The rotation form's least weight, 1 − |R_T|/2 with R_C ≤ 2: far from blue / anywhere. */
const LAMBDA_FAR = 1 - SIN_FAR, LAMBDA_NEAR = 1 - SIN_NEAR;

/**
 * Whether swatches i and j are more than √lab.t2 apart by CIEDE2000 (CIE 142-2001; Sharma, Wu & Dalal 2005): 1 yes,
 * 0 no, NaN when the caller should ask culori (a corner case, or within a hair of the threshold).
 *
 * In stages, each cheaper than the full formula, and each exact about its decision:
 * 1. E² = (ΔL'/S_L)² + a form x² + y² + R_T·x·y in x = ΔC'/S_C, y = ΔH'/S_H, at least (1 − |R_T|/2)(x² + y²)
 *    ≥ (1 − |R_T|/2)·|Δ(a', b)|²/S_C² (S_C ≥ S_H), where |R_T| ≤ R_C·sin 2Δθ is small unless the mean hue is
 *    near 275°: bounded below with no root (checked inline by the sweep in `findMerges`, before this is
 *    called), then with S_L, G and C̄' exact;
 * 3. without any angle: ΔH'² = |Δ(a', b)|² − ΔC'² (algebraically culori's 2√(C₁'C₂')·sin(Δh'/2), squared),
 *    S_H between its values at T's bounds, and the form x² + y² + R_T·x·y between (1 ∓ |R_T|/2)(x² + y²),
 *    where |R_T| ≤ R_C·sin 2Δθ is small unless the mean hue is near 275°;
 * 4. the whole formula, with the mean hue h̄' as the bisector of the two hue directions (culori halves the
 *    shorter arc: the same angle), so T is a polynomial in cos h̄', sin h̄' and only Δθ takes an arctangent.
 */
function apartPastFirstBound(lab: LabArrays, i: number, j: number): number {
  const { L, A, B, C, t2 } = lab;
  const dL = L[j] - L[i];
  const Lp = (L[i] + L[j]) / 2;
  const cAvg = (C[i] + C[j]) / 2;
  const ux0 = lab.UA[i] + lab.UA[j], uy0 = lab.UB[i] + lab.UB[j];
  const uu = ux0 * ux0 + uy0 * uy0, ud = ux0 * C275 + uy0 * S275;
  const lambda = uu >= U_SUM_SQ_MIN && !(ud > 0 && ud * ud > COS67_SQ * uu) ? LAMBDA_FAR : LAMBDA_NEAR;
  const Lpm50 = (Lp - 50) * (Lp - 50);
  const Sl = 1 + (0.015 * Lpm50) / Math.sqrt(20 + Lpm50);
  const l = dL / Sl;
  const l2 = l * l;
  const c7 = pow7(cAvg);
  const g1 = 1 + 0.5 * (1 - Math.sqrt(c7 / (c7 + P25_7)));
  const da = (A[j] - A[i]) * g1, db = B[j] - B[i];
  // 2. the same with S_L, G and S_C's bound exact
  const scMax = 1 + 0.045 * g1 * cAvg;
  if (l2 + (lambda * (da * da + db * db)) / (scMax * scMax) > t2 * (1 + SETTLE_BAND)) return 1;
  const a1 = A[i] * g1, b1 = B[i], a2 = A[j] * g1, b2 = B[j];
  const cp1 = Math.sqrt(a1 * a1 + b1 * b1), cp2 = Math.sqrt(a2 * a2 + b2 * b2);
  if (cp1 === 0 || cp2 === 0) return NaN;
  const ux = a1 / cp1 + a2 / cp2, uy = b1 / cp1 + b2 / cp2;
  const un = Math.sqrt(ux * ux + uy * uy);
  if (un < 1e-6) return NaN;
  const ch = ux / un, sh = uy / un; // cos, sin of h̄'
  const dC = cp2 - cp1;
  const dH2 = Math.max(0, da * da + db * db - dC * dC);
  const Cp = (cp1 + cp2) / 2;
  const Sc = 1 + 0.045 * Cp;
  const cp7 = pow7(Cp);
  const Rc = 2 * Math.sqrt(cp7 / (cp7 + P25_7));
  const c = dC / Sc;
  const c2 = c * c;
  const rtMax = Rc * (ch * C275 + sh * S275 > COS55 ? SIN_NEAR : SIN_FAR);
  const shMax = 1 + 0.015 * Cp * T_MAX, shMin = 1 + 0.015 * Cp * T_MIN;
  if (l2 + (1 - rtMax / 2) * (c2 + dH2 / (shMax * shMax)) > t2 * (1 + SETTLE_BAND)) return 1;
  if (l2 + (1 + rtMax / 2) * (c2 + dH2 / (shMin * shMin)) < t2 * (1 - SETTLE_BAND)) return 0;
  const dH = (a1 * b2 - b1 * a2 < 0 ? -1 : 1) * Math.sqrt(dH2);
  const c2h = ch * ch - sh * sh, s2h = 2 * sh * ch;
  const c3h = ch * (4 * ch * ch - 3), s3h = sh * (3 - 4 * sh * sh);
  const c4h = c2h * c2h - s2h * s2h, s4h = 2 * s2h * c2h;
  const T = 1 - 0.17 * (ch * C30 + sh * S30) + 0.24 * c2h + 0.32 * (c3h * C6 - s3h * S6) - 0.2 * (c4h * C63 + s4h * S63);
  const Sh = 1 + 0.015 * Cp * T;
  let hDeg = Math.atan2(sh, ch) * DEG;
  if (hDeg < 0) hDeg += 360;
  const z = (hDeg - 275) / 25;
  const Rt = -Math.sin(2 * (Math.PI / 6) * Math.exp(-z * z)) * Rc;
  const h = dH / Sh;
  const e2 = l2 + c2 + h * h + Rt * c * h;
  if (Math.abs(e2 - t2) <= SETTLE_BAND * t2) return NaN;
  return e2 > t2 ? 1 : 0;
}

/** ΔE rounded up to 0.01 (the pages show it whole): never at or under the threshold it is above. */
function hundredthsUp(x: number): number {
  const r = Math.ceil(x * 100) / 100;
  return r >= x ? r : x;
}

/** Partners of one swatch as they are collected: kept in a small sorted window of PARTNERS_KEPT. */
interface Collector {
  count: Int32Array;
  certain: Int32Array;
  kept: Uint8Array;
  partner: Int32Array;
  key: Float64Array;
  /** per swatch: the key an offer must beat (its last kept one's once the list is full, else Infinity) */
  bar: Float64Array;
}

/** Offer partner `p` (sort key `k`: certain first, then nearest on the medium) to swatch `i`'s kept list. */
function offer(c: Collector, i: number, p: number, k: number): void {
  const base = i * PARTNERS_KEPT;
  let n = c.kept[i];
  if (n === PARTNERS_KEPT) {
    if (k >= c.key[base + n - 1]) return;
    n--;
  } else c.kept[i] = n + 1;
  let at = base + n;
  while (at > base && c.key[at - 1] > k) {
    c.key[at] = c.key[at - 1];
    c.partner[at] = c.partner[at - 1];
    at--;
  }
  c.key[at] = k;
  c.partner[at] = p;
  if (c.kept[i] === PARTNERS_KEPT) c.bar[i] = c.key[base + PARTNERS_KEPT - 1];
}

/** What the sweep found: per swatch its merges (only swatches that merge), and the pair counts. */
export interface LookMerges {
  merges: SwatchMerges[];
  mergeCount: number;
  certainMergeCount: number;
}

/**
 * The merges among `tones` (see the file's doc). Per swatch that merges: `count` partners in all,
 * `certainCount` of them certain, and up to PARTNERS_KEPT partners, certain first, then nearest on the medium
 * (ties in the order found), each with its CIEDE2000 by culori. Swatches in the order of `tones`.
 */
export function findMerges(tones: readonly SwatchTone[], mergeStops: number, mergeDeltaE: number): LookMerges {
  const n = tones.length;
  const none: LookMerges = { merges: [], mergeCount: 0, certainMergeCount: 0 };
  if (n < 2 || !Number.isFinite(mergeDeltaE)) return none;
  // everything by rank in the sweep's order (low end of the plausible range), so the inner loop reads in turn
  const order = Int32Array.from(tones.keys()).sort((x, y) => tones[x].range.plausible[0] - tones[y].range.plausible[0] || tones[x].stops - tones[y].stops);
  const sorted = order.length ? Array.from(order, (i) => tones[i]) : [];
  const t2 = mergeDeltaE * mergeDeltaE;
  const lab = labArrays(sorted, t2);
  const lo = Float64Array.from(sorted, (t) => t.range.plausible[0]);
  const hi = Float64Array.from(sorted, (t) => t.range.plausible[1]);
  const stops = Float64Array.from(sorted, (t) => t.stops);
  const col: Collector = { count: new Int32Array(n), certain: new Int32Array(n), kept: new Uint8Array(n), partner: new Int32Array(n * PARTNERS_KEPT), key: new Float64Array(n * PARTNERS_KEPT), bar: new Float64Array(n).fill(Infinity) };
  // |ΔL*| beyond the threshold times the largest S_L any pair here can have settles a pair with no root at all
  const farL = lab.L.reduce((m, l) => Math.max(m, Math.abs(l - 50)), 0);
  const dLApart = mergeDeltaE * (1 + (0.015 * farL * farL) / Math.sqrt(20 + farL * farL)) * (1 + SETTLE_BAND);
  const { L, A, B, C, UA, UB } = lab;
  const settledApart = t2 * (1 + SETTLE_BAND);
  const { count, certain: certainN, bar } = col;
  let pairs = 0, certainPairs = 0;
  for (let i = 0; i < n; i++) {
    const iLo = lo[i], iHi = hi[i], iL = L[i], iStops = stops[i];
    // a pair is certain when both ranges lie within mergeStops of i's low end (lo[j] ≥ iLo in this order)
    const iMayBeCertain = iHi - iLo <= mergeStops;
    const iA = A[i], iB = B[i], iC = C[i], iUA = UA[i], iUB = UB[i];
    let iCount = 0, iCertain = 0;
    for (let j = i + 1; j < n && lo[j] - iHi <= mergeStops; j++) {
      const dL = L[j] - iL;
      if (!(dL > dLApart || dL < -dLApart)) {
        // the first stage of `apartPastFirstBound`'s doc, inline (it settles most pairs, so most pairs cost no call)
        const Lp = (iL + L[j]) / 2;
        const cAvg = (iC + C[j]) / 2;
        const ux0 = iUA + UA[j], uy0 = iUB + UB[j];
        const uu = ux0 * ux0 + uy0 * uy0, ud = ux0 * C275 + uy0 * S275;
        const lambda = uu >= U_SUM_SQ_MIN && !(ud > 0 && ud * ud > COS67_SQ * uu) ? LAMBDA_FAR : LAMBDA_NEAR;
        const da0 = A[j] - iA, db0 = B[j] - iB;
        const slMax = 1 + 0.015 * Math.abs(Lp - 50), scMax0 = 1 + 0.0675 * cAvg;
        // (dL/slMax)² + λ·|Δab|²/scMax0² > t², multiplied through by slMax²·scMax0² (no division; a pair within
        // rounding of the bound goes on to the exact stages, which decide it the same either way)
        const sl2 = slMax * slMax, sc2 = scMax0 * scMax0;
        if (!(dL * dL * sc2 + lambda * (da0 * da0 + db0 * db0) * sl2 > settledApart * sl2 * sc2)) {
          const fast = apartPastFirstBound(lab, i, j);
          if (Number.isNaN(fast) ? !(ciede2000(sorted[i].lab, sorted[j].lab) > mergeDeltaE) : fast === 0) continue;
        }
      }
      const certain = iMayBeCertain && hi[j] - iLo <= mergeStops;
      iCount++;
      count[j]++;
      if (certain) {
        iCertain++;
        certainN[j]++;
      }
      // certain first (key below 1e9), then nearest on the medium; most offers lose to a full list at once
      const k = (certain ? 0 : 1e9) + Math.abs(iStops - stops[j]);
      if (k < bar[i]) offer(col, i, j, k);
      if (k < bar[j]) offer(col, j, i, k);
    }
    count[i] += iCount;
    certainN[i] += iCertain;
    pairs += iCount;
    certainPairs += iCertain;
  }
  if (!pairs) return none;
  const rank = new Int32Array(n);
  order.forEach((i, r) => (rank[i] = r));
  const merges: SwatchMerges[] = [];
  for (let t = 0; t < n; t++) {
    const i = rank[t];
    if (!col.count[i]) continue;
    const partners = [];
    for (let s = i * PARTNERS_KEPT, e = s + col.kept[i]; s < e; s++) {
      const p = col.partner[s];
      partners.push({ swatchId: sorted[p].swatchId, certain: col.key[s] < 1e9, deltaE: hundredthsUp(ciede2000(sorted[i].lab, sorted[p].lab)) });
    }
    merges.push({ swatchId: sorted[i].swatchId, count: col.count[i], certainCount: col.certain[i], partners });
  }
  return { merges, mergeCount: pairs, certainMergeCount: certainPairs };
}
