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
 * - render_ratio_small: the same ratio on a 0.25-megapixel photo (612 × 408, the same still life drawn at
 *   that size with its grain; target ≤ 2), median of SMALL_RUNS pairs: there the fixed costs count (the
 *   look's exposures at every node of the upsampling table, and before the small-image hash a table of
 *   every colour to allocate and touch, 32 MB, against a pass of a quarter-million pixels);
 *   render_ratio_small_known_look the same for a look rendered before (its table from the cache);
 * - render_ratio_noise: the same ratio on the 24-megapixel still life with camera-like noise added
 *   (NOISE_RUNS pairs; target ≤ 2): many more colours to meet, so the per-colour computation counts;
 * - render_peak_ratio: peak memory of the 24-megapixel render over sharp's greyscale of the same file,
 *   each in a fresh process (target ≤ 1.5), and render_peak_ratio_small the same on the small photo.
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
import { composeLook } from '../shared/look/compose-look';
import { photoToneModel } from '../shared/photo/look-photo-model';
import { cyanPanchromaticLook } from '../tests/unit/photo/fixtures';
import type { UpsampleTable } from '../shared/spectral/upsample-table';

const WIDTH = 6000;
const HEIGHT = 4000;
const RUNS = 7;
/** The small photo: 0.25 megapixel, 3 : 2 like the large one. */
const SMALL_WIDTH = 612;
const SMALL_HEIGHT = 408;
const SMALL_RUNS = 21;
const NOISE_RUNS = 3;
const CHILD_FLAG = '--photo-bench-child';
const WORK = path.join(os.tmpdir(), 'grisaille-photo-bench');

/** The look of the benchmark (the demo "Panchromatic + red-absorbing cyan"), the photo tests' own. */
const benchLook = cyanPanchromaticLook;

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

async function image(width = WIDTH, height = HEIGHT): Promise<string> {
  fs.mkdirSync(WORK, { recursive: true });
  const file = path.join(WORK, `still-life-${width}x${height}.jpg`);
  if (!fs.existsSync(file)) fs.writeFileSync(file, await demoSceneJpeg(DEMO_SCENES[1], width, height));
  return file;
}

const median = (a: number[]) => [...a].sort((x, y) => x - y)[Math.floor(a.length / 2)];
const time = async (fn: () => Promise<unknown>) => {
  const t0 = performance.now();
  await fn();
  return performance.now() - t0;
};

/** Peak RSS (MB) of a fresh process that does `what` once, and how far above its resident set just before (the render's after its tables load). */
function childPeak(what: 'render' | 'greyscale', file: string): { peakMb: number; addedMb: number } {
  const me = fileURLToPath(import.meta.url);
  const r = spawnSync(process.execPath, ['--import', 'tsx', me, CHILD_FLAG, what, file], { encoding: 'utf8', env: { ...process.env, NODE_ENV: 'production' } });
  const line = r.stdout.trim().split('\n').pop() ?? '';
  try {
    return JSON.parse(line) as { peakMb: number; addedMb: number };
  } catch {
    throw new Error(`bench child failed: ${r.stderr || r.stdout}`);
  }
}

type Record = (name: string, value: number, unit: string) => void;

/**
 * The 24-megapixel still life with camera-like noise, written once (a fixed seed: the same file every run):
 * Gaussian, independent per channel (chroma noise, as a sensor's at high ISO gives), variance growing
 * with the signal like shot noise on a read-noise floor, σ² = 9 + v / 4 in 8-bit codes (σ 3 to 8.6 codes).
 */
async function noisyImage(): Promise<string> {
  const file = path.join(WORK, `still-life-noise-${WIDTH}x${HEIGHT}.jpg`);
  if (fs.existsSync(file)) return file;
  const { data, info } = await sharp(await image()).raw().toBuffer({ resolveWithObject: true });
  let seed = 0x2545f491;
  const uniform = () => {
    seed ^= seed << 13;
    seed ^= seed >>> 17;
    seed ^= seed << 5;
    return ((seed >>> 0) + 0.5) / 4294967296;
  };
  for (let i = 0; i < data.length; i++) {
    // Box–Muller (one of the pair used)
    const gauss = Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
    const v = data[i] + gauss * Math.sqrt(9 + data[i] / 4);
    data[i] = v < 0 ? 0 : v > 255 ? 255 : Math.round(v);
  }
  fs.writeFileSync(file, await sharp(data, { raw: { width: info.width, height: info.height, channels: info.channels } }).jpeg({ quality: 92 }).toBuffer());
  return file;
}

/** The noisy 24-megapixel photo: render and sharp's greyscale in interleaved pairs. */
export async function noise(record: Record): Promise<void> {
  const file = await noisyImage();
  const t = await tables();
  const r: number[] = [];
  const g: number[] = [];
  for (let i = 0; i < NOISE_RUNS; i++) {
    r.push(await time(() => render(file, 'jpeg', t)));
    g.push(await time(() => sharp(file).greyscale().jpeg(RENDER_JPEG).toBuffer()));
  }
  record('render_noise_24mp_ms', median(r), 'ms');
  record('greyscale_noise_24mp_ms', median(g), 'ms');
  record('render_ratio_noise', median(r.map((x, i) => x / g[i])), 'x');
}

/** The small photo: render and sharp's greyscale in interleaved pairs, and each one's peak memory. */
export async function small(record: Record): Promise<void> {
  const file = await image(SMALL_WIDTH, SMALL_HEIGHT);
  const t = await tables();
  await render(file, 'jpeg', t); // warm-up
  await sharp(file).greyscale().jpeg(RENDER_JPEG).toBuffer();
  // a look rendered before: its table from the server's cache (render-jobs.ts), with the colours it met
  const cached = await buildRenderTable(photoToneModel(composeLook(benchLook()), t.upsample), 8, 8);
  const known = () => renderPhoto({ input: file, bitDepth: 8, hasProfile: false, format: 'jpeg', table: () => cached });
  await known();
  const r: number[] = [];
  const k: number[] = [];
  const g: number[] = [];
  for (let i = 0; i < SMALL_RUNS; i++) {
    r.push(await time(() => render(file, 'jpeg', t)));
    k.push(await time(known));
    g.push(await time(() => sharp(file).greyscale().jpeg(RENDER_JPEG).toBuffer()));
  }
  record('render_small_ms', median(r), 'ms');
  record('greyscale_small_ms', median(g), 'ms');
  record('render_ratio_small', median(r.map((x, i) => x / g[i])), 'x');
  record('render_small_known_look_ms', median(k), 'ms');
  record('render_ratio_small_known_look', median(k.map((x, i) => x / g[i])), 'x');
  const peak = childPeak('render', file);
  const greyPeak = childPeak('greyscale', file);
  record('render_peak_rss_small_mb', peak.peakMb, 'MB');
  record('greyscale_peak_rss_small_mb', greyPeak.peakMb, 'MB');
  record('render_peak_ratio_small', peak.peakMb / greyPeak.peakMb, 'x');
  // the process peaks hold what a server holds anyway (the upsampling table); above it, the render's own
  record('render_added_rss_small_mb', peak.addedMb, 'MB');
  record('greyscale_added_rss_small_mb', greyPeak.addedMb, 'MB');
}

export default async function run(record: Record): Promise<void> {
  await small(record);
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
  await noise(record);
  const peak = childPeak('render', file);
  const greyPeak = childPeak('greyscale', file);
  record('render_peak_rss_mb', peak.peakMb, 'MB');
  record('greyscale_peak_rss_mb', greyPeak.peakMb, 'MB');
  record('render_peak_ratio', peak.peakMb / greyPeak.peakMb, 'x');
}

if (process.argv.includes(CHILD_FLAG)) {
  const [what, file] = process.argv.slice(process.argv.indexOf(CHILD_FLAG) + 1);
  const status = (field: 'VmHWM' | 'VmRSS') => {
    const m = new RegExp(`${field}:\\s+(\\d+) kB`).exec(fs.readFileSync('/proc/self/status', 'utf8'));
    if (m) return Number(m[1]) / 1024;
    return field === 'VmHWM' ? process.resourceUsage().maxRSS / 1024 : process.memoryUsage().rss / 1048576;
  };
  const t = what === 'render' ? await tables() : null;
  const before = status('VmRSS');
  if (t) await render(file, 'jpeg', t);
  else await sharp(file).greyscale().jpeg(RENDER_JPEG).toBuffer();
  // VmHWM: this process image's peak resident set (getrusage's maxrss would include the parent's, inherited through fork and exec)
  const peakMb = status('VmHWM');
  console.log(JSON.stringify({ peakMb, addedMb: peakMb - before }));
  process.exit(0);
}
