/**
 * Prints how sure the engine's greys are, against published measured reflectances (data/reflectance):
 * every surface's colour under D65 alone is given to the engine, and its estimate and ranges are compared
 * with the surface's true exposure through the 70 built-in looks of the reference test
 * (tests/reference/spectral/measured-ranges.test.ts checks the same figures). The README quotes them.
 *   npx tsx scripts/how-sure-report.ts
 */
import path from 'node:path';
import { estimateFromXyz } from '../shared/spectral/estimate';
import { exposureRange, PLAUSIBLE_KNOT_NM, xyzD65 } from '../shared/spectral/metamer-range';
import { getUpsampleTable } from '../server/services/upsample-table';
import { builtInLooks, exposureOf, measuredSurfaces, median } from '../tests/reference/spectral/measured-surfaces';

const table = await getUpsampleTable(path.join(import.meta.dirname, '..', 'data'));
const surfaces = measuredSurfaces();
const looks = builtInLooks();
const colours = surfaces.map((s) => {
  const xyz = xyzD65(s.reflectance);
  return { xyz, estimate: estimateFromXyz(xyz, table).values };
});
const lg = (m: number) => Math.log2(Math.max(m, 1e-9) / 0.18);
const mean = (a: number[]) => a.reduce((x, y) => x + y, 0) / a.length;
const t0 = performance.now();
const all = { inPossible: 0, inPlausible: 0, n: 0, err: [] as number[], wPossible: [] as number[], wPlausible: [] as number[] };
const byFilter = new Map<string, typeof all>();
const bySet = new Map<string, { n: number; inPlausible: number }>();
for (const look of looks) {
  const w = look.path.mediumWeights;
  const f = byFilter.get(look.filter ?? 'none') ?? { inPossible: 0, inPlausible: 0, n: 0, err: [], wPossible: [], wPlausible: [] };
  byFilter.set(look.filter ?? 'none', f);
  surfaces.forEach((s, i) => {
    const truth = exposureOf(w, s.reflectance);
    const m = exposureOf(w, colours[i].estimate);
    const r = exposureRange(colours[i].xyz, w, m);
    const inPossible = truth >= r.possible[0] - 1e-6 && truth <= r.possible[1] + 1e-6;
    const inPlausible = truth >= r.plausible[0] - 1e-6 && truth <= r.plausible[1] + 1e-6;
    const set = bySet.get(s.set) ?? { n: 0, inPlausible: 0 };
    bySet.set(s.set, set);
    set.n++;
    set.inPlausible += Number(inPlausible);
    for (const t of [all, f]) {
      t.n++;
      t.inPossible += Number(inPossible);
      t.inPlausible += Number(inPlausible);
      t.err.push(Math.abs(lg(m) - lg(truth)));
      t.wPossible.push(lg(r.possible[1]) - lg(r.possible[0]));
      t.wPlausible.push(lg(r.plausible[1]) - lg(r.plausible[0]));
    }
  });
}
const pct = (a: number, n: number) => `${((100 * a) / n).toFixed(1)} %`;
console.log(`${surfaces.length} surfaces × ${looks.length} looks = ${all.n} cases, plausible knots ${PLAUSIBLE_KNOT_NM} nm, ${(performance.now() - t0).toFixed(0)} ms`);
console.log(`truth inside: possible ${pct(all.inPossible, all.n)}, plausible ${pct(all.inPlausible, all.n)}`);
console.log(`median width, stops: possible ${median(all.wPossible).toFixed(2)}, plausible ${median(all.wPlausible).toFixed(2)}`);
console.log(`estimate error, stops: mean ${mean(all.err).toFixed(3)}, median ${median(all.err).toFixed(3)}, worst ${Math.max(...all.err).toFixed(2)}`);
for (const [k, f] of byFilter) {
  console.log(`  ${k.padEnd(13)} error mean ${mean(f.err).toFixed(3)} worst ${Math.max(...f.err).toFixed(2)} | plausible holds ${pct(f.inPlausible, f.n)}, median width ${median(f.wPlausible).toFixed(2)} (possible ${median(f.wPossible).toFixed(2)})`);
}
for (const [k, v] of bySet) console.log(`  ${k.padEnd(30)} plausible holds ${pct(v.inPlausible, v.n)} of ${v.n}`);
