/**
 * The computation of DESIGN.md §3, and the engine's entry points for other features.
 *
 *   resolveLight(src) / resolveFilter(src) / resolveMedium(src)   sources (sources.ts) → spectra
 *   resolveLightPath({ light, filters, medium })                       sources → a prepared LightPath
 *   prepareLightPath({ light, filters, medium })                       spectra → a prepared LightPath
 *   resolveSwatch(src, table)                                      swatch source (measured, colour, skin, makeup) → { name, reflectance, estimated }
 *   filterFactor(light, filters, medium)                           → { factor, stops, opaque }
 *   simulateSwatches(lightPath, swatches)                              → { filterFactor, filterStops, opaque, white, swatches[] }
 *   simulate(request, table)                                       POST /api/simulate in one call (`spectra`: each swatch's reflectance too)
 *   reflectanceFromSrgb(hexOrRgb, table)                           (estimate.ts) estimated reflectance of a colour
 *
 * Model, for a surface ρ, light E, filters T = ΠTᵢ, medium S (all on the 350–900 nm, 1 nm working grid):
 *   XYZ: CIE 1931 2° under E, Y = 100 for the perfect white; L*a*b* against that white (the eye sees
 *     the lit scene, not the lens filters);
 *   filter factor F = ∫ E·S / ∫ E·T·S, filter stops = log2 F; opaque when stops > 10;
 *   exposure m = ∫ ρ·E·T·S / ∫ E·T·S (opened up by F; a neutral grey reads the same through any filter);
 *   integrals by the rule of policy.ts, reduced to one weight per grid sample and light path (integrate.ts);
 *   stops = log2(m / 0.18); eyeStops = log2((Y/100) / 0.18); shift = stops − eyeStops;
 *   zone = 5 + stops, clamped to 0..10 (continuous; round it for the Roman numeral).
 *   There is no key placement here: stops and zone are as metered, before any key is placed
 *   (shared/tone/zones.ts keyOffsetStops moves them).
 * Logs are floored at 20 stops below middle grey (limits.ts) so black stays finite.
 */
import { filterFromPairs, lightFromPairs, mediumFromPairs, reflectanceFromPairs } from './bases';
import { xyzToLab } from './colour';
import { SpectralInputError, within } from './errors';
import { reflectanceFromLab, reflectanceFromSrgb } from './estimate';
import { bandPass, longPass, neutralDensity, notch, shortPass, stackFilters } from './filters';
import { integrationWeights, observerWeights, tristimulusWeights } from './integrate';
import { kindOfId, libraryFilter, libraryLight, libraryMedium } from './library';
import { blackbody, cieIlluminant, daylight, lightThroughGel, whiteLed } from './lights';
import { FLOOR_STOPS, MAX_FILTER_STOPS, MIDDLE_GREY, OPAQUE_LIMIT_STOPS } from './limits';
import { eyeMedium, mediumFromModel } from './media';
import { ESTIMATE_NM, exposureRange, xyzD65 } from './metamer-range';
import { GRID_NM } from './grid';
import { GRID_SIZE } from './policy';
import { makeupOver } from './makeup';
import { skinReflectance } from './skin';
import type { FilterSource, LightSource, MediumSource, NestedSwatchSource, SwatchSource } from './sources';
import { constantSpectrum, multiply, onGrid } from './spectrum';
import type { Spectrum, Xyz } from './types';
import type { UpsampleTable } from './upsample-table';

export { reflectanceFromSrgb } from './estimate';

/** One swatch of a simulation (the JSON of POST /api/simulate, `SwatchResultView` in shared/schemas/simulate.ts). */
export interface SwatchResult {
  name: string;
  /** CIE XYZ under the light, Y = 100 for the perfect white */
  xyz: [number, number, number];
  /** CIE L*a*b* against the light's white */
  lab: [number, number, number];
  /** medium exposure m relative to white, opened up by the filter factor, linear (0.18 = middle grey) */
  exposure: number;
  /** tone on the medium, stops from middle grey: log2(m / 0.18), before any key placement */
  stops: number;
  /** tone to the eye, stops from middle grey: log2((Y/100) / 0.18) */
  eyeStops: number;
  /** stops − eyeStops, stops (+ reads lighter on the medium than it looks) */
  shift: number;
  /** zone before any key placement: 5 + stops, clamped to 0..10 (round for the Roman numeral) */
  zone: number;
  /** true when the spectrum was estimated from a colour value */
  estimated: boolean;
  /** how far the tone could move, on the scale of `stops` (when asked for; zero width for measured reflectance) */
  range?: StopsRange;
  /** the swatch's reflectance on the working grid, `[nm, ρ]` with ρ rounded to 6 decimals (when asked for with `spectra`) */
  reflectance?: [number, number][];
}

/**
 * How sure a tone is (metamer-range.ts): the lowest and highest stops any reflectance 0..1 with the
 * swatch's colour under D65 could give (`possible`), and the same over smooth, realistic reflectances
 * (`plausible`, which also holds the estimate itself). Zero width for a measured reflectance.
 */
export interface StopsRange {
  possible: [number, number];
  plausible: [number, number];
  /** the reflectances ([nm, ρ] on the estimate's 5 nm grid, linear between) reaching the possible range's ends, when asked for */
  extremes?: { low: [number, number][]; high: [number, number][] };
}

/** A simulation of a light path and its swatches (the answer of POST /api/simulate, `SimulateResponse`). */
export interface SimulationResult {
  /** F = Σ E·S / Σ E·T·S, a multiplier */
  filterFactor: number;
  /** log2 F, stops */
  filterStops: number;
  /** true when the filters cost more than 10 stops on this medium (effectively opaque) */
  opaque: boolean;
  /** the light's white, XYZ with Y = 100 */
  white: [number, number, number];
  swatches: SwatchResult[];
}

/** What `simulate` takes: the sources of a POST /api/simulate body (validated by shared/schemas/simulate.ts). */
export interface SimulationInput {
  light: LightSource;
  filters?: readonly FilterSource[];
  medium: MediumSource;
  swatches: readonly SwatchSource[];
  /** also answer the reflectances reaching each possible range's ends */
  extremes?: boolean;
  /** also answer every swatch's reflectance on the working grid (`reflectance: [[nm, ρ], …]`) */
  spectra?: boolean;
}

function unknownId(id: string, want: string): SpectralInputError {
  const kind = kindOfId(id);
  return new SpectralInputError(kind ? `"${id}" is a built-in ${kind}, not a ${want}` : `there is no built-in ${want} "${id}"`, ['id']);
}

/** A filter source (sources.ts form) → transmittance 0..1 on the grid. Errors carry the path inside the source. */
export function resolveFilter(src: FilterSource): Spectrum {
  if (src.samples !== undefined) return within(['samples'], () => filterFromPairs(src.samples, src.basis));
  if (src.id !== undefined) {
    const item = libraryFilter(src.id);
    if (!item) throw unknownId(src.id, 'filter');
    return resolveFilter(item.definition);
  }
  if (src.longPass) return longPass(src.longPass);
  if (src.shortPass) return shortPass(src.shortPass);
  if (src.bandPass) return bandPass(src.bandPass);
  if (src.notch) return notch(src.notch);
  if (src.neutralDensity !== undefined) return neutralDensity(src.neutralDensity);
  throw new SpectralInputError('a filter needs one of samples, id, longPass, shortPass, bandPass, notch, neutralDensity');
}

/** A light source (sources.ts form) → relative power on the grid, peak 1, gels applied. */
export function resolveLight(src: LightSource): Spectrum {
  let e: Spectrum;
  if (src.cie !== undefined) e = within(['cie'], () => cieIlluminant(src.cie!));
  else if (src.daylight !== undefined) e = within(['daylight'], () => daylight(src.daylight!));
  else if (src.blackbody !== undefined) e = within(['blackbody'], () => blackbody(src.blackbody!));
  else if (src.samples !== undefined) e = within(['samples'], () => lightFromPairs(src.samples));
  else if (src.led !== undefined) e = within(['led'], () => whiteLed(src.led!));
  else if (src.id !== undefined) {
    const item = libraryLight(src.id);
    if (!item) throw unknownId(src.id, 'light');
    e = resolveLight(item.definition);
  } else throw new SpectralInputError('a light needs one of cie, daylight, blackbody, samples, id, led');
  if (src.gels?.length) {
    const gels = src.gels.map((g, i) => within(['gels', i], () => resolveFilter(g)));
    e = within(['gels'], () => lightThroughGel(e, ...gels));
  }
  return e;
}

/** A medium source (sources.ts form) → relative sensitivity per unit energy on the grid, peak 1. */
export function resolveMedium(src: MediumSource): Spectrum {
  if (src.samples !== undefined) return within(['samples'], () => mediumFromPairs(src.samples, src.basis));
  if (src.id !== undefined) {
    const item = libraryMedium(src.id);
    if (!item) throw unknownId(src.id, 'medium');
    return 'cmf' in item.definition ? eyeMedium() : mediumFromModel(item.definition.model);
  }
  throw new SpectralInputError('a medium needs one of samples, id');
}

/** A surface ready to simulate. */
export interface ResolvedSwatch {
  name: string;
  /** reflectance 0..1 on the grid */
  reflectance: Spectrum;
  /** true when estimated from a colour value (no measured spectrum) */
  estimated: boolean;
}

/** A swatch source without its name (a makeup layer's base or paint) → reflectance and whether it was estimated. */
function resolveSurface(src: NestedSwatchSource, table: UpsampleTable | null): Omit<ResolvedSwatch, 'name'> {
  if (src.reflectance !== undefined) return { reflectance: within(['reflectance'], () => reflectanceFromPairs(src.reflectance, src.basis)), estimated: false };
  const need = () => {
    if (!table) throw new Error('resolveSwatch: a colour swatch needs the upsampling table');
    return table;
  };
  if (src.srgb !== undefined) return { reflectance: within(['srgb'], () => reflectanceFromSrgb(src.srgb!, need())), estimated: true };
  if (src.rgb !== undefined) return { reflectance: within(['rgb'], () => reflectanceFromSrgb(src.rgb!.map((v) => v / 255) as [number, number, number], need())), estimated: true };
  if (src.lab !== undefined) return { reflectance: within(['lab'], () => reflectanceFromLab(src.lab!, need())), estimated: true };
  if (src.skin !== undefined) return { reflectance: within(['skin'], () => skinReflectance(src.skin!)), estimated: false };
  if (src.makeup !== undefined) {
    const { over, colour, coverage } = src.makeup;
    const under = within(['makeup', 'over'], () => resolveSurface(over, table));
    const paint =
      typeof colour === 'string'
        ? { reflectance: within(['makeup', 'colour'], () => reflectanceFromSrgb(colour, need())), estimated: true }
        : within(['makeup', 'colour'], () => resolveSurface(colour, table));
    return { reflectance: makeupOver(under.reflectance, paint.reflectance, coverage), estimated: under.estimated || paint.estimated };
  }
  throw new SpectralInputError('a swatch needs one of reflectance, srgb, rgb, lab, skin, makeup');
}

/**
 * A swatch source → reflectance. Measured reflectance is used as given; colour values are estimated
 * with the upsampling table (required for them; pass null when only measured swatches can occur); skin is
 * the skin model's reflectance (skin.ts; not estimated); a makeup layer is Kubelka–Munk over its base
 * (makeup.ts), estimated when its paint or its base is (a `colour` hex is estimated like a colour swatch).
 */
export function resolveSwatch(src: SwatchSource, table: UpsampleTable | null): ResolvedSwatch {
  return { name: src.name, ...resolveSurface(src, table) };
}

/** A filter factor: multiplier F, stops log2 F, and whether the light path is effectively opaque. */
export interface FilterFactor {
  /** F = ∫ E·S / ∫ E·T·S (≥ 1 for passive filters), capped at 2^40 */
  factor: number;
  /** log2 F, stops, capped at 40 */
  stops: number;
  /** stops > OPAQUE_LIMIT_STOPS (10): the filter passes almost nothing this medium sees */
  opaque: boolean;
}

function factorFrom(sumES: number, sumETS: number): FilterFactor {
  const stops = sumETS > 0 ? Math.min(MAX_FILTER_STOPS, Math.log2(sumES / sumETS)) : MAX_FILTER_STOPS;
  return { factor: 2 ** stops, stops, opaque: stops > OPAQUE_LIMIT_STOPS };
}

const EYE = eyeMedium().values;
/** True when the medium is the CIE ȳ (the reference medium). */
function isEye(medium: Spectrum): boolean {
  const v = medium.values;
  for (let i = 0; i < GRID_SIZE; i++) if (Math.abs(v[i] - EYE[i]) > 1e-12) return false;
  return true;
}

/**
 * Integration weights of E·T·S (integrate.ts); the eye medium is integrated by the observer's own
 * rule, so its tones equal Y exactly.
 */
function exposureWeights(light: Spectrum, transmission: Spectrum, medium: Spectrum): Float64Array {
  return isEye(medium) ? observerWeights(multiply(light, transmission))[1] : integrationWeights(light, transmission, medium);
}

/** Filter factor of `filters` for `light` on `medium` (grid spectra), in stops and as a multiplier. */
export function filterFactor(light: Spectrum, filters: readonly Spectrum[], medium: Spectrum): FilterFactor {
  const l = onGrid(light);
  const m = onGrid(medium);
  const sum = (w: Float64Array) => w.reduce((a, v) => a + v, 0);
  const a = sum(exposureWeights(l, constantSpectrum(1), m));
  if (!(a > 0)) throw new SpectralInputError('the medium is not sensitive to any of this light', ['medium']);
  return factorFrom(a, sum(exposureWeights(l, stackFilters(filters.map(onGrid)), m)));
}

/** A light path prepared for many swatches: spectra plus the precomputed weights. */
export interface LightPath {
  readonly light: Spectrum;
  readonly filters: readonly Spectrum[];
  /** ΠT, 0..1 */
  readonly transmission: Spectrum;
  readonly medium: Spectrum;
  /** the light's white, XYZ with Y = 100 */
  readonly white: Xyz;
  /** k·E·x̄, k·E·ȳ, k·E·z̄ (XYZ = Σ ρ·w) */
  readonly eyeWeights: { readonly x: Float64Array; readonly y: Float64Array; readonly z: Float64Array };
  /** integration weights of E·T·S over their sum (m = Σ ρ·w); all zero when the light path is fully opaque */
  readonly mediumWeights: Float64Array;
  readonly factor: FilterFactor;
}

/** Prepares grid spectra (light peak-normalised, filters 0..1, medium energy basis) for simulation. */
export function prepareLightPath(spectra: { light: Spectrum; filters?: readonly Spectrum[]; medium: Spectrum }): LightPath {
  const light = onGrid(spectra.light);
  const filters = (spectra.filters ?? []).map(onGrid);
  const medium = onGrid(spectra.medium);
  const transmission = stackFilters(filters);
  const factor = filterFactor(light, filters, medium);
  const ets = exposureWeights(light, transmission, medium);
  const sum = ets.reduce((a, v) => a + v, 0);
  const mediumWeights = sum > 0 ? ets.map((v) => v / sum) : new Float64Array(GRID_SIZE);
  const eyeWeights = tristimulusWeights(light);
  const white: Xyz = [eyeWeights.x.reduce((a, b) => a + b, 0), 100, eyeWeights.z.reduce((a, b) => a + b, 0)];
  return Object.freeze({ light, filters, transmission, medium, white, eyeWeights, mediumWeights, factor });
}

/** Validated light, filters and medium sources (sources.ts) → a prepared LightPath. Errors carry the request path. */
export function resolveLightPath(input: { light: LightSource; filters?: readonly FilterSource[]; medium: MediumSource }): LightPath {
  const light = within(['light'], () => resolveLight(input.light));
  const filters = (input.filters ?? []).map((f, i) => within(['filters', i], () => resolveFilter(f)));
  const medium = within(['medium'], () => resolveMedium(input.medium));
  return prepareLightPath({ light, filters, medium });
}

const FLOOR = MIDDLE_GREY * 2 ** FLOOR_STOPS;
/**
 * Stops from middle grey of a linear relative value (a medium exposure m, or Y/100 for the eye):
 * log2(value / 0.18), floored at FLOOR_STOPS. As metered: no key placement here.
 */
export function stopsFromGrey(relative: number): number {
  return Math.log2(Math.max(relative, FLOOR) / MIDDLE_GREY);
}

/** What `simulateSwatches` adds on request: the range of each tone, and the reflectances at its ends. */
export interface SimulateOptions {
  ranges?: boolean;
  extremes?: boolean;
}

/**
 * The range (in stops before key placement) of a swatch's tone through `lightPath`, from its reflectance
 * and its exposure m there: zero width when measured, else the metamer programs of metamer-range.ts.
 */
export function stopsRange(lightPath: LightPath, swatch: Pick<ResolvedSwatch, 'reflectance' | 'estimated'>, m: number, extremes = false): StopsRange {
  const stops = stopsFromGrey(m);
  if (!swatch.estimated) return { possible: [stops, stops], plausible: [stops, stops] };
  const r = exposureRange(xyzD65(onGrid(swatch.reflectance).values), lightPath.mediumWeights, m, { extremes });
  const out: StopsRange = {
    possible: [stopsFromGrey(r.possible[0]), stopsFromGrey(r.possible[1])],
    plausible: [stopsFromGrey(r.plausible[0]), stopsFromGrey(r.plausible[1])],
  };
  if (r.extremes) {
    const pairs = (v: Float64Array) => Array.from(v, (x, i) => [ESTIMATE_NM[i], Math.round(x * 1e6) / 1e6] as [number, number]);
    out.extremes = { low: pairs(r.extremes.low), high: pairs(r.extremes.high) };
  }
  return out;
}

/**
 * Every swatch through `lightPath`: XYZ and L*a*b* to the eye, exposure m, stops, eye stops, shift and
 * zone (definitions in the header), and with `options.ranges` how far each tone could move. Cost per
 * swatch: four 551-sample dot products, plus four small linear programs for a range.
 */
export function simulateSwatches(lightPath: LightPath, swatches: readonly ResolvedSwatch[], options: SimulateOptions = {}): SimulationResult {
  const { x: wx, y: wy, z: wz } = lightPath.eyeWeights;
  const wm = lightPath.mediumWeights;
  const out: SwatchResult[] = swatches.map((s) => {
    const r = onGrid(s.reflectance).values;
    let X = 0;
    let Y = 0;
    let Z = 0;
    let m = 0;
    for (let i = 0; i < GRID_SIZE; i++) {
      const v = r[i];
      X += v * wx[i];
      Y += v * wy[i];
      Z += v * wz[i];
      m += v * wm[i];
    }
    const xyz: Xyz = [X, Y, Z];
    const stops = stopsFromGrey(m);
    const eyeStops = stopsFromGrey(Y / 100);
    return {
      name: s.name,
      xyz,
      lab: xyzToLab(xyz, lightPath.white),
      exposure: m,
      stops,
      eyeStops,
      shift: stops - eyeStops,
      zone: Math.min(10, Math.max(0, 5 + stops)),
      estimated: s.estimated,
      ...(options.ranges ? { range: stopsRange(lightPath, s, m, options.extremes) } : {}),
    };
  });
  return { filterFactor: lightPath.factor.factor, filterStops: lightPath.factor.stops, opaque: lightPath.factor.opaque, white: lightPath.white, swatches: out };
}

/** POST /api/simulate in one call: a validated request and the upsampling table → the answer. */
export function simulate(request: SimulationInput, table: UpsampleTable | null): SimulationResult {
  const lightPath = resolveLightPath(request);
  const swatches = request.swatches.map((s, i) => within(['swatches', i], () => resolveSwatch(s, table)));
  const result = simulateSwatches(lightPath, swatches, { ranges: true, extremes: request.extremes === true });
  if (request.spectra === true) {
    result.swatches.forEach((r, i) => {
      const v = onGrid(swatches[i].reflectance).values;
      r.reflectance = Array.from(v, (x, j) => [GRID_NM[j], Math.round(x * 1e6) / 1e6] as [number, number]);
    });
  }
  return result;
}
