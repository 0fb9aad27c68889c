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
