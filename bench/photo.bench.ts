/**
 * Photo renders at 24 megapixels (6000 × 4000, the demo still life rendered by the project as an
 * 8-bit sRGB JPEG, quality 92, with grain), in the same run:
 * - render_24mp_ms: the renderer through a look (tungsten, red-absorbing cyan on the lens,
 *   panchromatic): decode, the look's table built from scratch every time (the look's exposures at
 *   the upsampling table's nodes, and an empty table of every 8-bit colour that the pass fills with
 *   the engine's computation for each colour it meets), one pass, JPEG encode;
 * - greyscale_24mp_ms: sharp's own greyscale conversion of the same file to the same format with the
 *   same encoder settings (`greyscale().jpeg(RENDER_JPEG)`);
 * - render_ratio: their ratio (target ≤ 1.5);
 * - render_peak_rss_mb: peak resident memory of a fresh process doing one render (target < 1.5 GB).
 * Also, for the record: the same against a single-band greyscale JPEG (`…_bw`), a render whose look
 * table is cached (as for a look rendered before), and 16-bit PNG output.
 * Medians of interleaved runs; ratios are medians of the ratio within each pair (the machine is shared).
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { fileURLToPath } from 'node:url';
import { DEMO_SCENES, demoSceneJpeg } from '../server/db/seed-content/photos';
import { RENDER_JPEG, RENDER_PNG, buildRenderTable, renderPhoto } from '../server/services/photo-render';
import { getUpsampleTable } from '../server/services/upsample-table';
import { nodeReflectances } from '../shared/spectral/node-spectra';
import { composeLook, type LookSpectra } from '../shared/look/compose-look';
import { photoToneModel } from '../shared/photo/look-photo-model';
import { resolveFilter, resolveLight, resolveMedium } from '../shared/spectral/compute';
import type { UpsampleTable } from '../shared/spectral/upsample-table';

const WIDTH = 6000;
const HEIGHT = 4000;
const RUNS = 7;
const CHILD_FLAG = '--photo-bench-child';
const WORK = path.join(os.tmpdir(), 'grisaille-photo-bench');

/** The look of the benchmark (the demo "Panchromatic + red-absorbing cyan"). */
function benchLook(): LookSpectra {
  return {
    bareLight: resolveLight({ id: 'tungsten-3200' }),
    filters: [{ spectrum: resolveFilter({ id: 'cyan-530' }), on: 'lens' }],
    medium: resolveMedium({ id: 'panchromatic' }),
    mediumToneId: 'medium.panchromatic',
    tone: { developmentStops: 0, ratingStops: 0, printGrade: 2, printExposureStops: 0, shadowDetailStops: null, highlightRollOffStops: null, keyZone: 5 },
    key: null,
  };
}

async function tables() {
  const upsample = await getUpsampleTable(WORK);
  return { upsample, reflectances: nodeReflectances(upsample) };
}

/** One render with its table built from scratch (as for a look never rendered before). */
function render(file: string, format: 'jpeg' | 'png16', t: { upsample: UpsampleTable; reflectances: Float32Array }) {
  return renderPhoto({
    input: file,
    bitDepth: 8,
    hasProfile: false,
    format,
    table: (inputBits, outputBits) => buildRenderTable(photoToneModel(composeLook(benchLook()), t.upsample), inputBits, outputBits),
  });
}

async function image(): Promise<string> {
  fs.mkdirSync(WORK, { recursive: true });
  const file = path.join(WORK, `still-life-${WIDTH}x${HEIGHT}.jpg`);
  if (!fs.existsSync(file)) fs.writeFileSync(file, await demoSceneJpeg(DEMO_SCENES[1], WIDTH, HEIGHT));
  return file;
}

const median = (a: number[]) => [...a].sort((x, y) => x - y)[Math.floor(a.length / 2)];
const time = async (fn: () => Promise<unknown>) => {
  const t0 = performance.now();
  await fn();
  return performance.now() - t0;
};

/** Peak RSS (MB) of a fresh process that does `what` once. */
function childPeak(what: 'render' | 'greyscale', file: string): number {
  const me = fileURLToPath(import.meta.url);
  const r = spawnSync(process.execPath, ['--import', 'tsx', me, CHILD_FLAG, what, file], { encoding: 'utf8', env: { ...process.env, NODE_ENV: 'production' } });
  const line = r.stdout.trim().split('\n').pop() ?? '';
  try {
    return (JSON.parse(line) as { peakMb: number }).peakMb;
  } catch {
    throw new Error(`bench child failed: ${r.stderr || r.stdout}`);
  }
}

export default async function run(record: (name: string, value: number, unit: string) => void): Promise<void> {
  const file = await image();
  const t = await tables();
  await render(file, 'jpeg', t); // warm-up
  await sharp(file).greyscale().jpeg(RENDER_JPEG).toBuffer();
  // runs interleaved; each ratio is taken within one pair, so a busy moment on the shared machine
  // slows both sides of the same pair
  const r: number[] = [];
  const g: number[] = [];
  const bw: number[] = [];
  const ratio: number[] = [];
  const ratioBw: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    r.push(await time(() => render(file, 'jpeg', t)));
    g.push(await time(() => sharp(file).greyscale().jpeg(RENDER_JPEG).toBuffer()));
    bw.push(await time(() => sharp(file).greyscale().toColourspace('b-w').jpeg(RENDER_JPEG).toBuffer()));
    ratio.push(r[i] / g[i]);
    ratioBw.push(r[i] / bw[i]);
  }
  record('render_24mp_ms', median(r), 'ms');
  record('greyscale_24mp_ms', median(g), 'ms');
  record('render_ratio', median(ratio), 'x');
  record('greyscale_bw_24mp_ms', median(bw), 'ms');
  record('render_ratio_bw', median(ratioBw), 'x');
  // the same look again: its table comes from the server's cache
  const cached = await buildRenderTable(photoToneModel(composeLook(benchLook()), t.upsample), 8, 8);
  const warm: number[] = [];
  for (let i = 0; i < 3; i++) warm.push(await time(() => renderPhoto({ input: file, bitDepth: 8, hasProfile: false, format: 'jpeg', table: () => cached })));
  record('render_24mp_cached_table_ms', median(warm), 'ms');
  const r16: number[] = [];
  const g16: number[] = [];
  for (let i = 0; i < 3; i++) {
    r16.push(await time(() => render(file, 'png16', t)));
    g16.push(await time(() => sharp(file).greyscale().toColourspace('grey16').png(RENDER_PNG).toBuffer()));
  }
  record('render_png16_24mp_ms', median(r16), 'ms');
  record('greyscale_png16_24mp_ms', median(g16), 'ms');
  record('render_ratio_png16', median(r16.map((x, i) => x / g16[i])), 'x');
  record('render_peak_rss_mb', childPeak('render', file), 'MB');
  record('greyscale_peak_rss_mb', childPeak('greyscale', file), 'MB');
}

if (process.argv.includes(CHILD_FLAG)) {
  const [what, file] = process.argv.slice(process.argv.indexOf(CHILD_FLAG) + 1);
  if (what === 'render') await render(file, 'jpeg', await tables());
  else await sharp(file).greyscale().jpeg(RENDER_JPEG).toBuffer();
  // VmHWM: this process image's peak resident set (getrusage's maxrss would include the parent's, inherited through fork and exec)
  const hwm = /VmHWM:\s+(\d+) kB/.exec(fs.readFileSync('/proc/self/status', 'utf8'));
  console.log(JSON.stringify({ peakMb: hwm ? Number(hwm[1]) / 1024 : process.resourceUsage().maxRSS / 1024 }));
  process.exit(0);
}
