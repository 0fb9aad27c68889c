/**
 * The shade for a zone: the surface closest to a given one that lands on a target tone through a light
 * path (POST /api/shade, docs/api-shade.md). Pure: no I/O.
 *
 * Units: tones in stops from middle grey on the scale of `stops` in compute.ts (log2(m / 0.18), before any
 * key placement); zone = 5 + stops (clamped 0..10 as in compute.ts); L*, C*ab, h_ab as CIE 1976 LCh(ab)
 * against the D65 sRGB white (culori's lch65, the white of `lab` swatches).
 *
 * Method. One scalar parameter p of the surface is moved, everything else kept:
 *   - a colour value (sRGB hex, rgb, L*a*b*): its lightness L* in 0..100 at its own hue angle h_ab; its
 *     chroma is kept, except where that colour would leave the sRGB gamut at the new L*, where it is
 *     reduced to the gamut's edge (bisection on C*); the answer is an sRGB hex;
 *   - a skin swatch `{ skin }`: its melanin volume fraction (the model's own pigment parameter), within
 *     the bounds of the skin schema (sources.ts);
 *   - a makeup swatch `{ makeup }`: the paint's lightness (as for a colour) when its colour is a hex,
 *     else its coverage within the schema's bounds (0..1).
 * The tone as a function of p, stops(p) = log2(Σ ρ_p·w / 0.18) through the light path's medium weights,
 * is sampled at SAMPLES + 1 points of its range (plus the start); the sampled curve is checked for
 * monotonicity, and of the intervals where it crosses the target the one nearest the start value is
 * bisected (to SOLVE_TOLERANCE_STOPS). When no interval crosses, the target is out of reach: the sample
 * nearest the target is refined by golden-section search and answered with `reached: false`.
 * A colour answer must be a real 8-bit sRGB hex: the 27 hexes around the solved colour are simulated and,
 * of those within QUANTISE_SLACK_STOPS of the best, the one nearest the solved colour (ΔE*ab) is answered,
 * so the answer's stops are its own hex's stops exactly.
 */
import { converter, modeLab65, modeLch65, useMode, type Lab65, type Lch65 } from 'culori/fn';
import { hexToSrgb, labToXyz, linearToSrgb, srgbToHex, srgbToLinear, srgbToXyz, xyzToLab, xyzToLinearSrgb } from './colour';
import { resolveSwatch, simulateSwatches, stopsFromGrey, type LightPath, type ResolvedSwatch, type StopsRange } from './compute';
import { SpectralInputError, within } from './errors';
import { xyzD65 } from './metamer-range';
import { GRID_SIZE } from './policy';
import { swatchSourceSchema, type SwatchSource } from './sources';
import { onGrid } from './spectrum';
import type { Lab3, Rgb3 } from './types';
import type { UpsampleTable } from './upsample-table';

useMode(modeLab65);
useMode(modeLch65);
const toLch65 = converter('lch65');

/** Samples of the parameter's range before bracketing (the curve is checked for monotonicity on them). */
export const SAMPLES = 40;
/** The continuous solution is taken when its tone is this close to the target, stops. */
export const SOLVE_TOLERANCE_STOPS = 1e-4;
/** Quantised candidates within this many stops of the best one compete on closeness of colour. */
export const QUANTISE_SLACK_STOPS = 0.01;
/** A bisection ending farther than this from the target has met a jump of the path (bridged when the knob can). */
export const JUMP_STOPS = 0.01;
/** An answer counts as reached when its own tone is within this many stops of the target (issue 12: 0.1 stop). */
export const REACHED_TOLERANCE_STOPS = 0.1;

/** A swatch source without its name: what `near` may be besides a hex string. */
export type NearSource = Omit<SwatchSource, 'name'> & { name?: string };
/** What `findShade` starts from: an sRGB hex ('#rrggbb' or '#rgb') or a swatch source without a name. */
export type ShadeNear = string | NearSource;
/** The parameter moved. */
export type ShadeChange = 'lightness' | 'melanin' | 'coverage';

/** The answer of `findShade` (the body of POST /api/shade is built from it). */
export interface ShadeResult {
  /** the answer's colour as sRGB hex: the answer itself for a colour; for skin and makeup their colour under D65 (clamped to the gamut), for display */
  srgb: string;
  /** the answer's own tone through the light path, stops from middle grey before key placement */
  stops: number;
  /** 5 + stops, clamped 0..10 */
  zone: number;
  /** the answer's range (compute.ts `stopsRange`; zero width for a reflectance that is not estimated) */
  range: StopsRange;
  /** the answer's tone lies within REACHED_TOLERANCE_STOPS of the target */
  reached: boolean;
  changed: ShadeChange;
  /** the changed parameter's value: L* (of the paint for makeup), melanin volume fraction, or coverage 0..1 */
  value: number;
  /** the answer as a swatch source without name: `{ srgb }` for a colour, the skin / makeup form with the parameter changed */
  source: NearSource;
  /** false when the sampled tone curve is not monotonic in the parameter (the crossing nearest the start was taken) */
  monotonic: boolean;
  /** why the target was not reached */
  message?: string;
}

/** A scalar root search: p in [lo, hi] with f(p) = target, the crossing nearest `start`. */
export interface ScalarSolution {
  p: number;
  value: number;
  reached: boolean;
  monotonic: boolean;
  /** the last bracket [a, b] of the bisection (a jump of f when |value − target| stays above the tolerance) */
  bracket?: [number, number];
}

/**
 * Solves f(p) = target on [lo, hi] (f in stops, any units of p): the start itself when it is within
 * `tolerance`; else SAMPLES + 1 samples, a monotonicity check, bisection of the crossing interval nearest
 * `start`; with no crossing, the p whose f is nearest the target (golden-section refined), `reached: false`.
 */
export function solveScalar(f: (p: number) => number, lo: number, hi: number, start: number, target: number, tolerance = SOLVE_TOLERANCE_STOPS): ScalarSolution {
  const s = Math.min(hi, Math.max(lo, start));
  const ps = Array.from({ length: SAMPLES + 1 }, (_, i) => lo + ((hi - lo) * i) / SAMPLES);
  if (!ps.includes(s)) ps.splice(ps.findIndex((p) => p > s), 0, s);
  const vs = ps.map(f);
  const d = vs.slice(1).map((v, i) => v - vs[i]);
  const monotonic = d.every((x) => x >= -1e-9) || d.every((x) => x <= 1e-9);
  const vStart = vs[ps.indexOf(s)];
  if (Math.abs(vStart - target) <= tolerance) return { p: s, value: vStart, reached: true, monotonic };

  let bracket = -1;
  let bestDistance = Infinity;
  for (let i = 0; i + 1 < ps.length; i++) {
    if ((vs[i] - target) * (vs[i + 1] - target) > 0) continue;
    const distance = s < ps[i] ? ps[i] - s : s > ps[i + 1] ? s - ps[i + 1] : 0;
    if (distance < bestDistance) [bracket, bestDistance] = [i, distance];
  }
  if (bracket >= 0) {
    let [a, b, fa] = [ps[bracket], ps[bracket + 1], vs[bracket]];
    let p = (a + b) / 2;
    let v = f(p);
    for (let k = 0; k < 60 && Math.abs(v - target) > tolerance && b - a > 1e-12 * (hi - lo); k++) {
      if ((fa - target) * (v - target) <= 0) b = p;
      else [a, fa] = [p, v];
      p = (a + b) / 2;
      v = f(p);
    }
    return { p, value: v, reached: true, monotonic, bracket: [a, b] };
  }

  const miss = vs.map((v) => Math.abs(v - target));
  let i = 0;
  for (let j = 1; j < ps.length; j++) if (miss[j] < miss[i] || (miss[j] === miss[i] && Math.abs(ps[j] - s) < Math.abs(ps[i] - s))) i = j;
  let [a, b] = [ps[Math.max(0, i - 1)], ps[Math.min(ps.length - 1, i + 1)]];
  let [p, value] = [ps[i], vs[i]];
  const g = (Math.sqrt(5) - 1) / 2;
  for (let k = 0; k < 40 && b - a > 1e-9 * (hi - lo); k++) {
    const [c, e] = [b - g * (b - a), a + g * (b - a)];
    const [vc, ve] = [f(c), f(e)];
    if (Math.abs(vc - target) <= Math.abs(ve - target)) b = e;
    else a = c;
    for (const [q, vq] of [[c, vc], [e, ve]]) if (Math.abs(vq - target) < Math.abs(value - target)) [p, value] = [q, vq];
  }
  return { p, value, reached: false, monotonic };
}

/** One movable parameter of a surface. */
interface Knob {
  changed: ShadeChange;
  /** in words, for the message: "any lightness of this hue" */
  describe: string;
  lo: number;
  hi: number;
  start: number;
  /** the surface at p (continuous) */
  at(p: number): NearSource;
  /** the surfaces that may be answered for a solved p (`wide`: a wider search), with the colour closeness is measured in */
  candidates(p: number, wide?: boolean): { source: NearSource; lab: Lab3 }[];
  /** the solved colour (L*a*b*, D65) the candidates are measured against, for a lightness knob */
  labAt?(p: number): Lab3;
  /** a knob across a jump of the tone between pa and pb (where the path itself jumps), when it has one */
  bridge?(pa: number, pb: number): Knob;
}

/**
 * Slack of the gamut test while reducing chroma (linear sRGB; below 0 it is scaled by Y, so black stays
 * black), then clipped: a hue slice of the gamut is not convex near its cusps (a channel can pass 1 by
 * ~0.002 inside the chroma range and come back), and the slack keeps the lightness path continuous there.
 */
export const GAMUT_SLACK = 0.005;

/**
 * Encoded sRGB 0..1 at lightness `l` on hue `h` (degrees) with chroma `c`, the chroma reduced where needed to
 * the first point (from the grey axis) where the colour leaves the gamut (with GAMUT_SLACK), then clipped.
 */
export function colourAt(l: number, c: number, h: number): Rgb3 {
  const rad = (h * Math.PI) / 180;
  const linear = (cc: number) => xyzToLinearSrgb(labToXyz([l, cc * Math.cos(rad), cc * Math.sin(rad)]));
  const floor = -GAMUT_SLACK * (labToXyz([l, 0, 0])[1] / 100); // strict at black, so L* 0 stays black
  const inGamut = (cc: number) => linear(cc).every((v) => v >= floor && v <= 1 + GAMUT_SLACK);
  let chroma = c;
  // first exit along the chroma axis: step out from grey, then bisect the step that leaves
  const steps = Math.max(1, Math.ceil(c / 2));
  for (let i = 1; i <= steps; i++) {
    if (inGamut((c * i) / steps)) continue;
    let [ok, bad] = [(c * (i - 1)) / steps, (c * i) / steps];
    for (let k = 0; k < 30; k++) {
      const mid = (ok + bad) / 2;
      if (inGamut(mid)) ok = mid;
      else bad = mid;
    }
    chroma = ok;
    break;
  }
  return linearToSrgb(linear(chroma).map((v) => Math.min(1, Math.max(0, v))) as Rgb3).map((v) => Math.min(1, Math.max(0, v))) as Rgb3;
}

const rgbLab = (rgb: Rgb3): Lab3 => xyzToLab(srgbToXyz(rgb));
const hexLab = (hex: string): Lab3 => rgbLab(hexToSrgb(hex));

/** Hue counts this many times its CIE 1976 ΔH*ab when choosing among 8-bit neighbours: the hue is what is kept. */
export const HUE_WEIGHT = 3;

/** Squared distance of two L*a*b* colours with the hue difference weighted: ΔL*² + ΔC*² + (HUE_WEIGHT·ΔH*)² (CIE 1976 ΔE*ab split). */
function colourDistance(x: Lab3, y: Lab3): number {
  const [cx, cy] = [Math.hypot(x[1], x[2]), Math.hypot(y[1], y[2])];
  const de2 = (x[0] - y[0]) ** 2 + (x[1] - y[1]) ** 2 + (x[2] - y[2]) ** 2;
  const dc2 = (cx - cy) ** 2;
  const dh2 = Math.max(0, de2 - (x[0] - y[0]) ** 2 - dc2);
  return (x[0] - y[0]) ** 2 + dc2 + HUE_WEIGHT ** 2 * dh2;
}

/** Neighbourhood radius (8-bit codes per channel) of the hexes tried around a solved colour, and the wider one used when they all miss by more than QUANTISE_SLACK_STOPS. */
const NEAR_CODES = [1, 3];

type Wrap = (colour: string | { rgb: Rgb3 }) => NearSource;

/** A knob over colours: p → encoded sRGB `colourOf(p)`, wrapped into a source; answers are the 8-bit hexes around the solved colour. */
function colourKnob(colourOf: (p: number) => Rgb3, range: { lo: number; hi: number; start: number }, wrap: Wrap, describe: string): Knob {
  const hexesAround = (p: number, radius: number) => {
    const rgb = colourOf(p).map((v) => Math.round(v * 255));
    const hexes = new Set<string>();
    const d = Array.from({ length: 2 * radius + 1 }, (_, i) => i - radius);
    for (const dr of d) for (const dg of d) for (const db of d) hexes.add(srgbToHex([(rgb[0] + dr) / 255, (rgb[1] + dg) / 255, (rgb[2] + db) / 255]));
    return [...hexes].map((hex) => ({ source: wrap(hex), lab: hexLab(hex) }));
  };
  return {
    changed: 'lightness',
    describe,
    ...range,
    at: (p) => wrap({ rgb: colourOf(p).map((v) => v * 255) as Rgb3 }),
    labAt: (p) => rgbLab(colourOf(p)),
    candidates: (p, wide) => hexesAround(p, wide ? NEAR_CODES[1] : NEAR_CODES[0]),
    // across a jump of the chroma clamp (same L*, same hue, two chromas): mix the two colours in linear sRGB
    bridge(pa, pb) {
      const [x, y] = [srgbToLinear(colourOf(pa)), srgbToLinear(colourOf(pb))];
      const mix = (t: number) => linearToSrgb(x.map((v, i) => v + (y[i] - v) * t) as Rgb3).map((v) => Math.min(1, Math.max(0, v))) as Rgb3;
      return { ...colourKnob(mix, { lo: 0, hi: 1, start: 0 }, wrap, describe), bridge: undefined };
    },
  };
}

/** The lightness knob of a colour: L* 0..100 at its hue, wrapped into a source by `wrap` (the colour itself, or a paint). */
function lightnessKnob(lab: Lab3, wrap: Wrap, describe: string): Knob {
  const lch = toLch65({ mode: 'lab65', l: lab[0], a: lab[1], b: lab[2] } as Lab65) as Lch65;
  const [c, h] = [lch.c ?? 0, lch.h ?? 0];
  return colourKnob((p) => colourAt(p, c, h), { lo: 0, hi: 100, start: Math.min(100, Math.max(0, lch.l)) }, wrap, describe);
}

/** Number bounds of `key` in the swatch schema's `form` (e.g. skin.melanin), read from the schema itself; `fallback` when absent. */
function schemaBounds(form: string, key: string, fallback: [number, number]): [number, number] {
  type Node = { def?: { innerType?: Node; in?: Node }; shape?: Record<string, Node>; minValue?: number | null; maxValue?: number | null };
  const bare = (n: Node | undefined): Node | undefined => {
    let x = n;
    for (let k = 0; x && k < 10 && (x.def?.innerType || x.def?.in); k++) x = x.def.innerType ?? x.def.in;
    return x;
  };
  const leaf = bare(bare((swatchSourceSchema as unknown as Node).shape?.[form])?.shape?.[key]);
  const [lo, hi] = [leaf?.minValue, leaf?.maxValue];
  return [typeof lo === 'number' && Number.isFinite(lo) ? lo : fallback[0], typeof hi === 'number' && Number.isFinite(hi) ? hi : fallback[1]];
}

const fmt = (v: number) => String(Number(v.toPrecision(3)));

/** The knob of a near surface (see the header); errors name the field inside `near`. */
function knobFor(near: ShadeNear): Knob {
  if (typeof near === 'string') return lightnessKnob(hexLab(near), (colour) => (typeof colour === 'string' ? { srgb: colour } : colour), 'any lightness of this hue');
  const form = near as Record<string, unknown>;
  if (typeof form.srgb === 'string') return knobFor(form.srgb);
  if (Array.isArray(form.rgb)) return knobFor(srgbToHex(form.rgb.map((v: number) => v / 255) as Lab3));
  if (Array.isArray(form.lab)) {
    const lab = form.lab as Lab3;
    return lightnessKnob(lab, (colour) => (typeof colour === 'string' ? { srgb: colour } : colour), 'any lightness of this hue');
  }
  if (form.skin && typeof form.skin === 'object') {
    const skin = form.skin as Record<string, unknown>;
    const [lo, hi] = schemaBounds('skin', 'melanin', [0, 1]);
    const start = typeof skin.melanin === 'number' ? skin.melanin : (lo + hi) / 2;
    const at = (p: number) => ({ skin: { ...skin, melanin: p } }) as unknown as NearSource;
    return { changed: 'melanin', describe: `any melanin in ${fmt(lo)}–${fmt(hi)}`, lo, hi, start, at, candidates: (p) => [{ source: at(p), lab: [0, 0, 0] }] };
  }
  if (form.makeup && typeof form.makeup === 'object') {
    const makeup = form.makeup as Record<string, unknown>;
    const wrap = (colour: unknown) => ({ makeup: { ...makeup, colour } }) as unknown as NearSource;
    if (typeof makeup.colour === 'string') return lightnessKnob(within(['makeup', 'colour'], () => hexLab(makeup.colour as string)), wrap, 'any lightness of this paint colour');
    const [lo, hi] = schemaBounds('makeup', 'coverage', [0, 1]);
    const start = typeof makeup.coverage === 'number' ? makeup.coverage : hi;
    const at = (p: number) => ({ makeup: { ...makeup, coverage: p } }) as unknown as NearSource;
    return { changed: 'coverage', describe: `any coverage in ${fmt(lo)}–${fmt(hi)}`, lo, hi, start, at, candidates: (p) => [{ source: at(p), lab: [0, 0, 0] }] };
  }
  if (form.reflectance !== undefined) throw new SpectralInputError('a measured reflectance has no parameter to move: give a colour, a skin or a makeup swatch', ['reflectance']);
  throw new SpectralInputError('near needs an sRGB hex or a swatch source (srgb, rgb, lab, skin, makeup)');
}

/** The surface of a near-form source (no name needed). */
function resolve(source: NearSource, table: UpsampleTable | null): ResolvedSwatch {
  return resolveSwatch({ ...source, name: source.name ?? 'shade' } as SwatchSource, table);
}

/** Stops of a reflectance through the light path (as simulateSwatches computes them). */
function stopsOf(lightPath: LightPath, s: ResolvedSwatch): number {
  const r = onGrid(s.reflectance).values;
  const w = lightPath.mediumWeights;
  let m = 0;
  for (let i = 0; i < GRID_SIZE; i++) m += r[i] * w[i];
  return stopsFromGrey(m);
}

/**
 * The surface closest to `near` whose tone through `lightPath` is `targetStops` (stops from middle grey,
 * before key placement; zone = 5 + stops). `table` is the upsampling table (upsample-table.ts), needed
 * for colour values. Method, units and tolerances in the header. Throws SpectralInputError (path inside
 * `near`) for a near that cannot be used.
 */
export function findShade(lightPath: LightPath, targetStops: number, near: ShadeNear, table: UpsampleTable | null): ShadeResult {
  let knob = knobFor(near);
  resolve(knob.at(knob.start), table); // a bad near fails here, with its field
  const toneOf = (k: Knob) => (p: number) => stopsOf(lightPath, resolve(k.at(p), table));
  let solution = solveScalar(toneOf(knob), knob.lo, knob.hi, knob.start, targetStops);
  if (solution.bracket && Math.abs(solution.value - targetStops) > JUMP_STOPS && knob.bridge) {
    knob = knob.bridge(...solution.bracket);
    solution = { ...solveScalar(toneOf(knob), knob.lo, knob.hi, knob.start, targetStops), monotonic: solution.monotonic };
  }
  const solvedLab = knob.labAt?.(solution.p) ?? null;

  const trial = (wide: boolean) =>
    knob.candidates(solution.p, wide).map((c) => {
      const resolved = resolve(c.source, table);
      return { ...c, resolved, stops: stopsOf(lightPath, resolved) };
    });
  let tried = trial(false);
  let best = Math.min(...tried.map((c) => Math.abs(c.stops - targetStops)));
  if (solution.reached && best > QUANTISE_SLACK_STOPS) {
    tried = trial(true);
    best = Math.min(...tried.map((c) => Math.abs(c.stops - targetStops)));
  }
  const distance = (lab: Lab3) => (solvedLab ? colourDistance(lab, solvedLab) : 0);
  const pick = tried.filter((c) => Math.abs(c.stops - targetStops) <= best + QUANTISE_SLACK_STOPS).sort((x, y) => distance(x.lab) - distance(y.lab))[0];

  const sim = simulateSwatches(lightPath, [pick.resolved], { ranges: true }).swatches[0];
  const source = pick.source;
  const form = source as Record<string, unknown>;
  const srgb = typeof form.srgb === 'string' ? form.srgb : srgbToHex(linearToSrgb(xyzToLinearSrgb(xyzD65(onGrid(pick.resolved.reflectance).values))));
  const value = knob.labAt ? pick.lab[0] : solution.p;
  const reached = solution.reached && Math.abs(sim.stops - targetStops) <= REACHED_TOLERANCE_STOPS;
  let message: string | undefined;
  if (!reached) {
    const way = sim.stops < targetStops ? 'lighter' : 'darker';
    message = solution.reached
      ? `the nearest 8-bit colour reads ${fmt(sim.stops)} stops, ${fmt(Math.abs(sim.stops - targetStops))} from the target`
      : `zone ${fmt(5 + targetStops)} (${fmt(targetStops)} stops) is ${way} than ${knob.describe} reads through this look; the closest reads zone ${fmt(5 + sim.stops)}`;
  }
  return { srgb, stops: sim.stops, zone: sim.zone, range: sim.range!, reached, changed: knob.changed, value, source, monotonic: solution.monotonic, ...(message ? { message } : {}) };
}
