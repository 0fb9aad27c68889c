/**
 * Shared fixtures of the "how sure is a grey" reference tests (not a test file): the published measured
 * reflectances of data/reflectance, each file naming its source and licence —
 *   cie-224-ces.json               CIE 224:2017 colour evaluation samples, 99 surfaces
 *   cie-13-3-tcs.json              CIE 13.3-1995 test colour samples, 14 surfaces
 *   nist-cqs-vs.json               NIST colour quality scale samples VS1–VS15 (Davis & Ohno 2010)
 *   ohta-1997-colour-checker.json  a 24-patch chart measured by N. Ohta (1997)
 * resampled onto the working grid by the engine's policy (policy.ts) — and the built-in looks the
 * measurements go through (the looks of scripts/how-sure-report.ts, opaque ones left out).
 */
import fs from 'node:fs';
import path from 'node:path';
import { resolveLightPath, type LightPath } from '../../../shared/spectral/compute';
import { GRID_NM } from '../../../shared/spectral/grid';
import { interpolateAt } from '../../../shared/spectral/policy';

/** One measured surface on the grid. */
export interface MeasuredSurface {
  /** the data file, e.g. `cie-224-ces` */
  set: string;
  name: string;
  /** reflectance 0..1 on the working grid */
  reflectance: Float64Array;
}

const DIR = path.join(import.meta.dirname, '..', '..', '..', 'data', 'reflectance');

/** Every surface of every file in data/reflectance (152 of them), in file and table order. */
export function measuredSurfaces(): MeasuredSurface[] {
  const out: MeasuredSurface[] = [];
  for (const f of fs.readdirSync(DIR).filter((x) => x.endsWith('.json')).sort()) {
    const j = JSON.parse(fs.readFileSync(path.join(DIR, f), 'utf8')) as { wavelengthsNm: number[]; samples: { name: string; values: number[] }[] };
    for (const s of j.samples) out.push({ set: f.replace(/\.json$/, ''), name: s.name, reflectance: interpolateAt(j.wavelengthsNm, s.values, GRID_NM) });
  }
  return out;
}

/** A built-in look (library ids) and its prepared light path. */
export interface BuiltInLook {
  label: string;
  light: string;
  medium: string;
  filter: string | null;
  path: LightPath;
}

export const MEDIA = ['panchromatic', 'orthochromatic', 'blue-sensitive', 'panchromatic-extended-red', 'silicon-ir-cut'] as const;
export const FILTERS = [null, 'yellow-490', 'orange-550', 'red-590', 'deep-red-630', 'green-530', 'blue-450', 'cyan-530'] as const;
export const LIGHTS = ['d65', 'tungsten-3200'] as const;

/** A built-in look by ids. */
export function builtInLook(light: string, medium: string, filter: string | null): BuiltInLook {
  const p = resolveLightPath({ light: { id: light }, filters: filter ? [{ id: filter }] : [], medium: { id: medium } });
  return { label: `${light} / ${medium} / ${filter ?? 'no filter'}`, light, medium, filter, path: p };
}

/** Every light × medium × filter of the lists above that is not opaque (70 looks). */
export function builtInLooks(): BuiltInLook[] {
  const out: BuiltInLook[] = [];
  for (const light of LIGHTS) for (const medium of MEDIA) for (const filter of FILTERS) {
    const look = builtInLook(light, medium, filter);
    if (!look.path.factor.opaque) out.push(look);
  }
  return out;
}

/** m = Σ wᵢ·ρᵢ: the medium exposure of a grid reflectance through a light path (compute.ts's definition). */
export function exposureOf(weights: ArrayLike<number>, reflectance: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < weights.length; i++) m += weights[i] * reflectance[i];
  return m;
}

/** The median of a list (the upper one for an even count). */
export function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/**
 * The estimate Grisaille used before (W. Jakob and J. Hanika, "A Low-Dimensional Function Space for
 * Efficient Spectral Upsampling", Computer Graphics Forum 38(2), 2019): ρ = ½ + x / (2√(1 + x²)) with
 * x = c0·t² + c1·t + c2, t = (λ − 380 nm) / 400 nm, fitted to a colour's XYZ under D65 by Gauss–Newton —
 * kept here, written from the paper, only as the baseline the current estimate is measured against.
 * Returns the reflectance on the working grid, or null when the fit does not reach the colour.
 */
export function sigmoidEstimate(xyz: readonly [number, number, number], rows: readonly [Float64Array, Float64Array, Float64Array], grid: Float64Array): Float64Array | null {
  const t = Float64Array.from(grid, (nm) => (nm - 380) / 400);
  const rho = (c: number[]) => Float64Array.from(t, (ti) => {
    const x = c[0] * ti * ti + c[1] * ti + c[2];
    return 0.5 + x / (2 * Math.sqrt(1 + x * x));
  });
  const xyzOf = (r: Float64Array) => rows.map((row) => row.reduce((s, w, i) => s + w * r[i], 0));
  let c = [0, 0, 0];
  const scale = Math.max(1, xyz[1]);
  for (let it = 0; it < 200; it++) {
    const f = xyzOf(rho(c)).map((v, k) => v - xyz[k]);
    if (Math.hypot(...f) < 1e-7 * scale) return rho(c);
    const J = [0, 1, 2].map((j) => {
      const d = [...c];
      d[j] += 1e-6;
      const g = xyzOf(rho(d));
      return g.map((v, k) => (v - xyz[k] - f[k]) / 1e-6);
    }); // J[j][k] = ∂XYZ_k/∂c_j
    const m = [0, 1, 2].map((k) => [J[0][k], J[1][k], J[2][k]]);
    const det = m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) - m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) + m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0]);
    if (!Number.isFinite(det) || Math.abs(det) < 1e-300) return null;
    const solve = (col: number) => {
      const mm = m.map((row, r) => row.map((v, k) => (k === col ? -f[r] : v)));
      return (mm[0][0] * (mm[1][1] * mm[2][2] - mm[1][2] * mm[2][1]) - mm[0][1] * (mm[1][0] * mm[2][2] - mm[1][2] * mm[2][0]) + mm[0][2] * (mm[1][0] * mm[2][1] - mm[1][1] * mm[2][0])) / det;
    };
    const step = [solve(0), solve(1), solve(2)];
    let lambda = 1;
    const f0 = Math.hypot(...f);
    for (let h = 0; h < 30; h++) {
      const next = c.map((v, j) => v + lambda * step[j]);
      if (Math.hypot(...xyzOf(rho(next)).map((v, k) => v - xyz[k])) < f0) {
        c = next;
        break;
      }
      lambda /= 2;
    }
  }
  return null;
}
