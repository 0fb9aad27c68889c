/**
 * Spectral engine figures (medians): one 33³ tone LUT for a stack, and 1,000 colour swatches through
 * one stack (resolve: table lookup + Gauss–Newton refinement; then XYZ, L*a*b*, tones). Also the
 * one-off build of the upsampling table, which the server does once and caches.
 */
import { resolveStack, resolveSwatch, simulateSwatches } from '../shared/spectral/compute';
import { buildToneLut } from '../shared/spectral/lut';
import { buildUpsampleTable } from '../shared/spectral/upsample-table';
import { random } from '../tests/unit/spectral/fixtures';
import { medianMs } from './lib';

export default async function run(record: (name: string, value: number, unit: string) => void): Promise<void> {
  let table = buildUpsampleTable();
  record('upsample_table_build_ms', await medianMs(() => (table = buildUpsampleTable()), 3), 'ms');

  const stack = resolveStack({ light: { id: 'tungsten-3200' }, filters: [{ id: 'cyan-530' }], medium: { id: 'panchromatic' } });
  record('lut_build_ms', await medianMs(() => buildToneLut(stack, table, 33), 9), 'ms');

  const rnd = random(1000);
  const hex = () => '#' + Math.floor(rnd() * 0x1000000).toString(16).padStart(6, '0');
  const sources = Array.from({ length: 1000 }, (_, i) => ({ name: `swatch ${i}`, srgb: hex() }));
  record(
    'swatches_1000_ms',
    await medianMs(() => simulateSwatches(stack, sources.map((s) => resolveSwatch(s, table))), 9),
    'ms',
  );
}
