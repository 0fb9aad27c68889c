/**
 * Measures the colour-value estimate and the metamer ranges against published measured reflectances
 * (data/reflectance: CIE 224 CES, CIE 13.3 TCS, NIST CQS VS, a colour checker measured by N. Ohta):
 * for every surface, its colour under D65 alone is given to the engine, and the engine's estimate and
 * ranges are compared with the surface's true exposure through built-in looks. Prints a table.
 *   npx tsx scripts/how-sure-report.ts [knotNm]
 */
import fs from 'node:fs';
import path from 'node:path';
import { interpolateAt } from '../shared/spectral/policy';
import { GRID_NM } from '../shared/spectral/grid';
import { resolveLightPath } from '../shared/spectral/compute';
import { exposureRange, xyzD65 } from '../shared/spectral/metamer-range';
import { estimateFromXyz } from '../shared/spectral/estimate';
import { getUpsampleTable } from '../server/services/upsample-table';

const dir = path.join(import.meta.dirname, '..', 'data', 'reflectance');
const surfaces: { set: string; name: string; r: Float64Array }[] = [];
for (const f of fs.readdirSync(dir)) {
  const j = JSON.parse(fs.readFileSync(path.join(dir, f), 'utf8'));
  for (const s of j.samples) surfaces.push({ set: f.replace('.json', ''), name: s.name, r: interpolateAt(j.wavelengthsNm, s.values, GRID_NM) });
}
const MEDIA = ['panchromatic', 'orthochromatic', 'blue-sensitive', 'panchromatic-extended-red', 'silicon-ir-cut'];
const FILTERS = [null, 'yellow-490', 'orange-550', 'red-590', 'deep-red-630', 'green-530', 'blue-450', 'cyan-530'];
const LIGHTS = ['d65', 'tungsten-3200'];

const table = await getUpsampleTable(path.join(import.meta.dirname, '..', 'data'));
const stats = { n: 0, inPossible: 0, inPlausible: 0, wPossible: [] as number[], wPlausible: [] as number[], err: [] as number[], fallback: 0 };
const bySet = new Map<string, { n: number; inPl: number }>();
const byFilter = new Map<string, { err: number[]; wPl: number[]; wPo: number[]; inPl: number; n: number }>();
const lg = (m: number) => Math.log2(Math.max(m, 1e-9) / 0.18);
const t0 = performance.now();
for (const light of LIGHTS) for (const medium of MEDIA) for (const filter of FILTERS) {
  const lightPath = resolveLightPath({ light: { id: light }, filters: filter ? [{ id: filter }] : [], medium: { id: medium } });
  const w = lightPath.mediumWeights;
  if (lightPath.factor.opaque) continue;
  const key = filter ?? 'none';
  const f = byFilter.get(key) ?? { err: [], wPl: [], wPo: [], inPl: 0, n: 0 };
  byFilter.set(key, f);
  for (const s of surfaces) {
    let truth = 0;
    for (let i = 0; i < w.length; i++) truth += w[i] * s.r[i];
    const xyz = xyzD65(s.r);
    const est = estimateFromXyz(xyz, table);
    let m = 0;
    for (let i = 0; i < w.length; i++) m += w[i] * est.values[i];
    const r = exposureRange(xyz, w, m);
    const tol = 1e-6;
    stats.n++;
    f.n++;
    if (truth >= r.possible[0] - tol && truth <= r.possible[1] + tol) stats.inPossible++;
    const inPl = truth >= r.plausible[0] - tol && truth <= r.plausible[1] + tol;
    if (inPl) { stats.inPlausible++; f.inPl++; }
    const bs = bySet.get(s.set) ?? { n: 0, inPl: 0 };
    bySet.set(s.set, bs);
    bs.n++;
    if (inPl) bs.inPl++;
    if (r.plausibleKnotNm < 40) stats.fallback++;
    const wpo = lg(r.possible[1]) - lg(r.possible[0]);
    const wpl = lg(r.plausible[1]) - lg(r.plausible[0]);
    stats.wPossible.push(wpo);
    stats.wPlausible.push(wpl);
    f.wPl.push(wpl);
    f.wPo.push(wpo);
    const e = Math.abs(lg(m) - lg(truth));
    stats.err.push(e);
    f.err.push(e);
  }
}
const med = (a: number[]) => [...a].sort((x, y) => x - y)[Math.floor(a.length / 2)];
const mean = (a: number[]) => a.reduce((x, y) => x + y, 0) / a.length;
const max = (a: number[]) => Math.max(...a);
console.log(`surfaces ${surfaces.length}, cases ${stats.n}, ${(performance.now() - t0).toFixed(0)} ms`);
console.log(`truth inside possible ${(100 * stats.inPossible / stats.n).toFixed(2)} %, inside plausible ${(100 * stats.inPlausible / stats.n).toFixed(2)} %, smooth fallback ${stats.fallback}`);
console.log(`width stops: possible median ${med(stats.wPossible).toFixed(3)}, plausible median ${med(stats.wPlausible).toFixed(3)}`);
console.log(`estimate error stops: mean ${mean(stats.err).toFixed(4)}, median ${med(stats.err).toFixed(4)}, max ${max(stats.err).toFixed(3)}`);
for (const [k, f] of byFilter) console.log(`  ${k.padEnd(14)} err mean ${mean(f.err).toFixed(3)} max ${max(f.err).toFixed(3)} | plausible in ${(100 * f.inPl / f.n).toFixed(1)} % width med ${med(f.wPl).toFixed(2)} | possible width med ${med(f.wPo).toFixed(2)}`);
for (const [k, v] of bySet) console.log(`  set ${k.padEnd(30)} plausible coverage ${(100 * v.inPl / v.n).toFixed(1)} % of ${v.n}`);
