/**
 * Round trip of the colour estimate (LHTSS, Burns 2020, Color Research & Application 45(1), tabulated):
 * sRGB colour → estimated reflectance → XYZ under CIE D65 → sRGB, scored with culori 4.0.2's
 * CIEDE2000. Over a 16³ grid of encoded sRGB values plus primaries, secondaries and 33 greys.
 */
import { differenceCiede2000 } from 'culori';
import { describe, expect, it } from 'vitest';
import type { Rgb3 } from '../../../shared/spectral/colour';
import { reflectanceFromSrgb } from '../../../shared/spectral/estimate';
import { xyzOfReflectance } from '../../../shared/spectral/integrate';
import { cieIlluminant } from '../../../shared/spectral/lights';
import type { Spectrum } from '../../../shared/spectral/spectrum';
import { upsampleTable } from '../../unit/spectral/fixtures';

// The product's requirement for the estimate (issue "How sure is a grey?"): the round trip stays exact.
/** mean ΔE00 over the set */
const MAX_MEAN_DE00 = 0.01;
/** largest ΔE00 in the set */
const MAX_DE00 = 0.05;
/** the set must hold at least this many colours */
const MIN_COLOURS = 4000;

const N = 16;
const colours: Rgb3[] = [];
for (let r = 0; r < N; r++) for (let g = 0; g < N; g++) for (let b = 0; b < N; b++) colours.push([r / (N - 1), g / (N - 1), b / (N - 1)]);
colours.push([1, 0, 0], [0, 1, 0], [0, 0, 1], [0, 1, 1], [1, 0, 1], [1, 1, 0]);
for (let i = 0; i <= 32; i++) colours.push([i / 32, i / 32, i / 32]);

const de = differenceCiede2000();
const d65 = cieIlluminant('D65');

function score(estimate: (c: Rgb3) => Spectrum) {
  let sum = 0;
  let max = 0;
  let worst: Rgb3 = [0, 0, 0];
  for (const c of colours) {
    const r = estimate(c);
    for (const v of r.values) if (!(v >= 0 && v <= 1)) throw new Error(`reflectance outside 0..1 for ${c}`);
    const [x, y, z] = xyzOfReflectance(r, d65);
    const d = de({ mode: 'rgb', r: c[0], g: c[1], b: c[2] }, { mode: 'xyz65', x: x / 100, y: y / 100, z: z / 100 });
    sum += d;
    if (d > max) {
      max = d;
      worst = c;
    }
  }
  return { mean: sum / colours.length, max, worst };
}

describe(`upsampling round trip over ${colours.length} sRGB colours (ΔE00, culori)`, () => {
  const table = upsampleTable();

  it(`holds at least ${MIN_COLOURS} colours`, () => expect(colours.length).toBeGreaterThanOrEqual(MIN_COLOURS));

  it('every colour (the blend of the table’s node spectra, as swatches and photo pixels get it): mean < 0.01, max < 0.05', () => {
    const s = score((c) => reflectanceFromSrgb(c, table));
    console.info(`round trip, single colours: mean ΔE00 ${s.mean.toExponential(3)}, max ${s.max.toExponential(3)} at sRGB ${s.worst.map((v) => v.toFixed(3)).join(',')}`);
    expect(s.mean).toBeLessThan(MAX_MEAN_DE00);
    expect(s.max).toBeLessThan(MAX_DE00);
  });

});
