/**
 * Spectral engine figures (medians): the 33³ photo table of a look as the live preview builds it (the
 * look composed, the exposure of every node of the estimate's table, then 33³ nodes of stops), and
 * 1,000 colour swatches through
 * one light path (resolve: the blend of the estimate's table cell; then XYZ, L*a*b*, tones). Also the
 * one-off build of the upsampling table, which the server does once and caches.
 * How sure is a grey (metamer-range.ts): `ranges_1000_ms`, the possible and plausible ranges of 1,000
 * estimated sRGB colours through one light path (swatches resolved beforehand; target ≤ 300 ms), and
 * `uncertainty_table_ms`, one look's 33³ photo uncertainty table (shared/photo/uncertainty-table.ts; target ≤ 3 s).
 */
import { resolveFilter, resolveLight, resolveMedium, resolveLightPath, resolveSwatch, simulateSwatches } from '../shared/spectral/compute';
import { composeLook } from '../shared/look/compose-look';
import { buildPhotoLut, photoToneModel } from '../shared/photo/look-photo-model';
import { PREVIEW_LUT_SIZE } from '../shared/photo/exposure-lut';
import { nodeReflectances } from '../shared/spectral/node-spectra';
import { buildUpsampleTable } from '../shared/spectral/upsample-table';
import { fillUncertaintyTable, UNCERTAINTY_TABLE_SIZE } from '../shared/photo/uncertainty-table';
import { random } from '../tests/unit/spectral/fixtures';
import { medianMs } from './lib';

export default async function run(record: (name: string, value: number, unit: string) => void): Promise<void> {
  let table = buildUpsampleTable();
  record('upsample_table_build_ms', await medianMs(() => (table = buildUpsampleTable()), 3), 'ms');

  const lightPath = resolveLightPath({ light: { id: 'tungsten-3200' }, filters: [{ id: 'cyan-530' }], medium: { id: 'panchromatic' } });
  const spectra = {
    bareLight: resolveLight({ id: 'tungsten-3200' }),
    filters: [{ spectrum: resolveFilter({ id: 'cyan-530' }), on: 'lens' as const }],
    medium: resolveMedium({ id: 'panchromatic' }),
    mediumToneId: 'medium.panchromatic',
    tone: { developmentStops: 0, ratingStops: 0, printGrade: 2, printExposureStops: 0, shadowDetailStops: null, highlightRollOffStops: null, keyZone: 5 },
    key: null,
  };
  nodeReflectances(table); // once per table, as the server and the preview worker do on load
  record('lut_build_ms', await medianMs(() => buildPhotoLut(photoToneModel(composeLook(spectra), table), PREVIEW_LUT_SIZE), 9), 'ms');

  const rnd = random(1000);
  const hex = () => '#' + Math.floor(rnd() * 0x1000000).toString(16).padStart(6, '0');
  const sources = Array.from({ length: 1000 }, (_, i) => ({ name: `swatch ${i}`, srgb: hex() }));
  record(
    'swatches_1000_ms',
    await medianMs(() => simulateSwatches(lightPath, sources.map((s) => resolveSwatch(s, table))), 9),
    'ms',
  );

  const resolved = sources.map((s) => resolveSwatch(s, table));
  record('ranges_1000_ms', await medianMs(() => simulateSwatches(lightPath, resolved, { ranges: true }), 5), 'ms');

  const size = UNCERTAINTY_TABLE_SIZE;
  const widths = new Float32Array(size ** 3);
  record('uncertainty_table_ms', await medianMs(() => fillUncertaintyTable(widths, size, lightPath, table, 0, size ** 3), 3), 'ms');
}
