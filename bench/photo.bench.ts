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
 * - render_main_stall_ms: the longest the main thread's event loop waited during one 24-megapixel render
 *   (its look composed in it), median of RUNS: how long the API could not answer (the pass runs in
 *   worker threads; before, the main thread did half of it: 115–270 ms);
 * - render_ratio_photos: the same ratio over a set of real photographs (target ≤ 1.25), the median of
 *   each photo's median ratio over PHOTO_RUNS pairs (each photo's own as render_ratio_photo_<name>);
 *   render_ratio_photo_noise the same on one of them with the camera-like noise above (target ≤ 2).
 *   Each photograph is upscaled with sharp (Lanczos, cropped to 3 : 2) to 6000 × 4000 and written as an
 *   sRGB JPEG, quality 92, once into the bench's cache folder. They come from a Debian package, fetched
 *   with `apt-get download` and unpacked with `dpkg-deb -x` into that folder (the package is not
 *   installed; the photos are not committed); where apt is not there the bench says it skipped them and
 *   why. The set (package python3-skimage 0.19.3, folder /usr/lib/python3/dist-packages/skimage/data;
 *   /usr/share/doc/python3-skimage/copyright: "Files: * … License: BSD-3-Clause", the scikit-image
 *   team; each photo's own terms as the package's skimage/data/_fetchers.py states them):
 *     astronaut.png        512 × 512, a portrait in a flight suit — public domain ("no known copyright
 *                          restrictions, released into the public domain")
 *     chelsea.png          451 × 300, a cat's face — CC0 by the photographer
 *     coffee.png           600 × 400, a cup of coffee on a wooden table — CC0 by the photographer
 *     motorcycle_left.png  741 × 500, a motorcycle in a garage (left view of a stereo pair) — BSD-3-Clause
 *                          (the copyright file's "Files: *"; the module names no other terms)
 *     rocket.jpg           640 × 427, a launch pad at dusk — public domain (released by its maker)
 *   (checked by eye: all five are photographs; the package's other colour images are drawings, a
 *   micrograph, a retina and a telescope image, left out). The noisy case is coffee.png.
 * Also, for the record: the same against a single-band greyscale JPEG (`…_bw`), a render whose look
 * table is cached (as for a look rendered before), and 16-bit PNG output.
 * Medians of interleaved runs; ratios are medians of the ratio within each pair (the machine is shared).
 * `BENCH_PHOTO_ONLY=small npm run bench -- photo` runs only the small photo's figures (quicker to iterate on).
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { fileURLToPath } from 'node:url';
import { monitorEventLoopDelay } from 'node:perf_hooks';
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
 * The 24-megapixel still life (or `from`) with camera-like noise, written once (a fixed seed: the same file every run):
 * Gaussian, independent per channel (chroma noise, as a sensor's at high ISO gives), variance growing
 * with the signal like shot noise on a read-noise floor, σ² = 9 + v / 4 in 8-bit codes (σ 3 to 8.6 codes).
 */
async function noisyImage(from?: string, name = 'still-life-noise'): Promise<string> {
  const file = path.join(WORK, `${name}-${WIDTH}x${HEIGHT}.jpg`);
  if (fs.existsSync(file)) return file;
  const { data, info } = await sharp(from ?? (await image())).raw().toBuffer({ resolveWithObject: true });
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

/** The set of real photographs (see the header for each one's licence). */
const PHOTO_PACKAGE = 'python3-skimage';
const PHOTO_DIR = 'usr/lib/python3/dist-packages/skimage/data';
const PHOTOS = ['astronaut.png', 'chelsea.png', 'coffee.png', 'motorcycle_left.png', 'rocket.jpg'];
const NOISY_PHOTO = 'coffee.png';
const PHOTO_RUNS = 3;

/** The package's files unpacked into the bench's cache folder (fetched once); a reason when apt cannot. */
function debianPhotos(): { dir: string } | { skipped: string } {
  const root = path.join(WORK, 'debian', PHOTO_PACKAGE);
  const dir = path.join(root, PHOTO_DIR);
  if (PHOTOS.every((f) => fs.existsSync(path.join(dir, f)))) return { dir };
  fs.mkdirSync(root, { recursive: true });
  const get = spawnSync('apt-get', ['download', PHOTO_PACKAGE], { cwd: root, encoding: 'utf8', timeout: 300_000 });
  if (get.error || get.status !== 0) return { skipped: `apt-get download ${PHOTO_PACKAGE} failed: ${get.error?.message ?? get.stderr.trim().split('\n').pop()}` };
  const deb = fs.readdirSync(root).find((f) => f.startsWith(`${PHOTO_PACKAGE}_`) && f.endsWith('.deb'));
  if (!deb) return { skipped: `apt-get download ${PHOTO_PACKAGE} left no .deb file` };
  const x = spawnSync('dpkg-deb', ['-x', deb, '.'], { cwd: root, encoding: 'utf8' });
  if (x.error || x.status !== 0) return { skipped: `dpkg-deb -x failed: ${x.error?.message ?? x.stderr.trim()}` };
  fs.rmSync(path.join(root, deb), { force: true });
  const missing = PHOTOS.filter((f) => !fs.existsSync(path.join(dir, f)));
  return missing.length ? { skipped: `the package holds no ${missing.join(', ')}` } : { dir };
}

/** A photograph upscaled to 24 megapixels (Lanczos, cropped to 3 : 2), as an sRGB JPEG, written once. */
async function photo24(dir: string, name: string): Promise<string> {
  const file = path.join(WORK, `photo-${path.parse(name).name}-${WIDTH}x${HEIGHT}.jpg`);
  if (!fs.existsSync(file)) {
    const jpeg = await sharp(path.join(dir, name)).flatten({ background: '#ffffff' }).resize(WIDTH, HEIGHT, { fit: 'cover', kernel: 'lanczos3' }).toColourspace('srgb').jpeg({ quality: 92 }).toBuffer();
    fs.writeFileSync(file, jpeg);
  }
  return file;
}

/** Render / sharp's greyscale of one file in interleaved pairs: the median ratio. */
async function ratioOf(file: string, runs: number, t: { upsample: UpsampleTable; reflectances: Float32Array }): Promise<number> {
  const ratios: number[] = [];
  for (let i = 0; i < runs; i++) {
    const r = await time(() => render(file, 'jpeg', t));
    const g = await time(() => sharp(file).greyscale().jpeg(RENDER_JPEG).toBuffer());
    ratios.push(r / g);
  }
  return median(ratios);
}

/** The real photographs at 24 megapixels, and one of them with noise. */
export async function photos(record: Record): Promise<void> {
  const got = debianPhotos();
  if ('skipped' in got) {
    console.log(`render_ratio_photos: SKIPPED (${got.skipped})`);
    return;
  }
  const t = await tables();
  const ratios: number[] = [];
  for (const name of PHOTOS) {
    const file = await photo24(got.dir, name);
    const ratio = await ratioOf(file, PHOTO_RUNS, t);
    record(`render_ratio_photo_${path.parse(name).name}`, ratio, 'x');
    ratios.push(ratio);
  }
  record('render_ratio_photos', median(ratios), 'x');
  const noisy = await noisyImage(await photo24(got.dir, NOISY_PHOTO), `photo-${path.parse(NOISY_PHOTO).name}-noise`);
  record('render_ratio_photo_noise', await ratioOf(noisy, PHOTO_RUNS, t), 'x');
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
  // BENCH_PHOTO_ONLY=small: only the small photo's figures (for quicker iteration; the default runs all)
  if (process.env.BENCH_PHOTO_ONLY === 'small') return;
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
  const stall: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const loop = monitorEventLoopDelay({ resolution: 1 });
    loop.enable();
    r.push(await time(() => render(file, 'jpeg', t)));
    loop.disable();
    stall.push(loop.max / 1e6);
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
  record('render_main_stall_ms', median(stall), 'ms');
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
  await photos(record);
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
