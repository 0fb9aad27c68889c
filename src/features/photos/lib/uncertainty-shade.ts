/**
 * The uncertainty overlay's pixels: for each preview pixel (8-bit sRGB), the width of its plausible tone
 * range through the look (stops), interpolated trilinearly in the server's table (UncertaintyStatus: size³
 * widths, index (b·size + g)·size + r, node i at the encoded value i / (size − 1)), shown as the warning
 * colour whose opacity grows with the width. Pure; run in uncertainty.worker.ts.
 */

/** Narrower than this, stops, a pixel is left clear. */
export const SHADE_FROM_STOPS = 0.25;
/** At this width, stops, and wider, the shading is fullest. */
export const SHADE_FULL_STOPS = 2;
/** Opacity of the fullest shading (the photo stays readable under it). */
export const SHADE_MAX_ALPHA = 0.72;
/** The warning colour (tailwind.config.ts warn), sRGB. */
export const WARN_RGB: readonly [number, number, number] = [0xc2, 0x41, 0x0c];

/** Opacity 0..1 of the shading for a plausible width of `stops`: clear below SHADE_FROM_STOPS, rising linearly to SHADE_MAX_ALPHA at SHADE_FULL_STOPS. */
export function shadeAlpha(stops: number): number {
  const t = (stops - SHADE_FROM_STOPS) / (SHADE_FULL_STOPS - SHADE_FROM_STOPS);
  return t <= 0 ? 0 : Math.min(1, t) * SHADE_MAX_ALPHA;
}

/**
 * Shades `rgba` (8-bit RGBA, `n` pixels) into `out` (RGBA, same size): the warning colour at the opacity of
 * each pixel's interpolated width. Answers the fraction of pixels shaded at all and the widest width, stops.
 */
export function shadeUncertainty(widths: Float32Array, size: number, rgba: Uint8ClampedArray, out: Uint8ClampedArray, n: number): { shaded: number; maxStops: number } {
  // per 8-bit code: the lower node and the fraction towards the next one
  const lo = new Int32Array(256);
  const fr = new Float32Array(256);
  for (let c = 0; c < 256; c++) {
    const x = (c / 255) * (size - 1);
    const i = Math.min(size - 2, Math.floor(x));
    lo[c] = i;
    fr[c] = x - i;
  }
  const alphaByte = new Uint8Array(1025); // opacity table over 0..4 stops in 1/256-stop steps
  for (let i = 0; i < alphaByte.length; i++) alphaByte[i] = Math.round(shadeAlpha(i / 256) * 255);
  const s1 = size;
  const s2 = size * size;
  let shaded = 0;
  let maxStops = 0;
  const [wr, wg, wb] = WARN_RGB;
  for (let p = 0, o = 0; p < n; p++, o += 4) {
    const r = rgba[o], g = rgba[o + 1], b = rgba[o + 2];
    const ir = lo[r], ig = lo[g], ib = lo[b];
    const fx = fr[r], fy = fr[g], fz = fr[b];
    const i000 = ib * s2 + ig * s1 + ir;
    const c00 = widths[i000] + (widths[i000 + 1] - widths[i000]) * fx;
    const c10 = widths[i000 + s1] + (widths[i000 + s1 + 1] - widths[i000 + s1]) * fx;
    const c01 = widths[i000 + s2] + (widths[i000 + s2 + 1] - widths[i000 + s2]) * fx;
    const c11 = widths[i000 + s2 + s1] + (widths[i000 + s2 + s1 + 1] - widths[i000 + s2 + s1]) * fx;
    const c0 = c00 + (c10 - c00) * fy;
    const c1 = c01 + (c11 - c01) * fy;
    const w = c0 + (c1 - c0) * fz;
    if (w > maxStops) maxStops = w;
    const a = alphaByte[Math.min(1024, Math.max(0, Math.round(w * 256)))];
    out[o] = wr;
    out[o + 1] = wg;
    out[o + 2] = wb;
    out[o + 3] = a;
    if (a > 0) shaded++;
  }
  return { shaded: n ? shaded / n : 0, maxStops };
}
