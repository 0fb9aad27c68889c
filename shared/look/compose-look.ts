/**
 * THE composition of a look, written once: boards, swatches, exposure sheets, photos (server renders and
 * the browser's live preview) and the engine's endpoints all turn a look into tones through here.
 *
 *   light path   the lamp through the gels (filters on the light, which the eye sees too), the lens
 *                filters, the medium (`prepareLightPath`); the filter factor counts every filter, gels and
 *                lens, against the bare lamp;
 *   key          a key swatch is placed on its zone (`keyOffsetStops`), else middle grey on zone V;
 *   tone         the medium's tone pipeline (characteristic curve, development, print or display) with
 *                that offset, tabulated along stops (tone-curve-table.ts);
 *   grey         every output grey goes through the same fixed-point rounding (`codeOfStops`), so a
 *                swatch on a board and a pixel of the same colour in a photo get the same code.
 */
import { filterFactor, prepareLightPath, simulateSwatches, type FilterFactor, type LightPath } from '../spectral/compute';
import { lightThroughGel } from '../spectral/lights';
import type { Spectrum } from '../spectral/spectrum';
import { buildTonePipeline, type TonePipeline, type ToneSettingsLike } from '../tone/tone-pipeline';
import { keyOffsetStops } from '../tone/zones';
import type { SwatchTone, ToneRange } from '../schemas/board';
import { codeOfStops, outputCodes, toneCurveTable, type OutputBits, type ToneCurveTable } from './tone-curve-table';

/** Where a filter sits: on the lens (only the camera sees it) or on the light (a gel: the eye sees it too). */
export type FilterPlace = 'lens' | 'light';

/** The spectra and settings of a look, resolved (production curves, library items and inline sources alike). */
export interface LookSpectra {
  /** the lamp as chosen, before any gel; relative power on the working grid */
  bareLight: Spectrum;
  /** the filters in order, each on the lens or on the light (a gel); transmittance 0..1 */
  filters: readonly { spectrum: Spectrum; on: FilterPlace }[];
  /** relative sensitivity, energy basis */
  medium: Spectrum;
  /** the tone-defaults id of the medium (shared/tone/media-tone.ts) */
  mediumToneId: string;
  /** development, rating, print and key settings; a box speed set on the look overrides the medium's */
  tone: ToneSettingsLike & { keyZone: number; boxSpeed?: number | null };
  /** the key swatch's reflectance (0..1), or null when middle grey is the key */
  key: Spectrum | null;
}

/** A look composed: its light path, filter factor, key placement and tone. */
export interface ComposedLook {
  readonly spectra: LookSpectra;
  /** the light the scene is lit by: the lamp through the gels (peak 1) */
  readonly light: Spectrum;
  /** gelled light, lens filters, medium, with the precomputed weights */
  readonly path: LightPath;
  /** every filter (gels and lens) against the bare lamp, on the medium */
  readonly factor: FilterFactor;
  /** key placement, stops added to every tone (0 when middle grey is placed on zone V) */
  readonly offsetStops: number;
  readonly pipeline: TonePipeline;
  /** the pipeline tabulated along stops before key placement */
  readonly toneTable: ToneCurveTable;
  /** fixed-point stops → output code at 8 or 16 bits (made on first use, then kept) */
  codes(bits: OutputBits): Uint8Array | Uint16Array;
}

/** The light path of a look's spectra: the light through its gels, the lens filters, the medium; and the factor of all filters. */
export function lookLightPath(s: Pick<LookSpectra, 'bareLight' | 'filters' | 'medium'>): { light: Spectrum; path: LightPath; factor: FilterFactor } {
  const gels = s.filters.filter((f) => f.on === 'light').map((f) => f.spectrum);
  const lens = s.filters.filter((f) => f.on === 'lens').map((f) => f.spectrum);
  const light = gels.length ? lightThroughGel(s.bareLight, ...gels) : s.bareLight;
  const factor = filterFactor(s.bareLight, s.filters.map((f) => f.spectrum), s.medium);
  return { light, path: prepareLightPath({ light, filters: lens, medium: s.medium }), factor };
}

/** Medium stops (from middle grey, before key placement) of a reflectance through a light path. */
export function stopsThrough(path: LightPath, reflectance: Spectrum): number {
  return simulateSwatches(path, [{ name: 'key', reflectance, estimated: false }]).swatches[0].stops;
}

/**
 * Composes a look (see the header). Pass the look's light path when it was already built from the same
 * spectra (`lookLightPath`), so it is built once. Throws SpectralInputError when the medium sees none of
 * the light.
 */
export function composeLook(s: LookSpectra, built?: ReturnType<typeof lookLightPath>): ComposedLook {
  const { light, path, factor } = built ?? lookLightPath(s);
  const offsetStops = keyOffsetStops(s.key ? stopsThrough(path, s.key) : 0, s.tone.keyZone);
  const pipeline = buildTonePipeline({ mediumId: s.mediumToneId, settings: s.tone, offsetStops, boxSpeed: s.tone.boxSpeed ?? undefined });
  const toneTable = toneCurveTable(pipeline);
  const made: Partial<Record<OutputBits, Uint8Array | Uint16Array>> = {};
  const codes = (bits: OutputBits) => (made[bits] ??= outputCodes(toneTable, bits));
  return { spectra: s, light, path, factor, offsetStops, pipeline, toneTable, codes };
}

/** Where one surface lands through a composed look (a board's swatch tone without its id and L*a*b*). */
export type LookTone = Omit<SwatchTone, 'swatchId' | 'lab'>;

/**
 * A surface's tone through a look from its medium and eye stops before key placement (the engine's
 * `simulateSwatches` gives both), and the range of its stops before key placement when it is estimated.
 */
export function toneThrough(look: ComposedLook, stopsBeforeKey: number, eyeStopsBeforeKey: number, rangeBeforeKey?: ToneRange): LookTone {
  const t = look.pipeline.renderStops(stopsBeforeKey);
  const eyeStops = eyeStopsBeforeKey + look.offsetStops;
  const shift = (r: [number, number]): [number, number] => [r[0] + look.offsetStops, r[1] + look.offsetStops];
  return {
    stops: t.stops,
    eyeStops,
    shift: t.stops - eyeStops,
    zone: t.zone,
    numeral: t.numeral,
    grey: codeOfStops(look.codes(8), stopsBeforeKey),
    lost: t.lost,
    blown: t.blown,
    range: rangeBeforeKey ? { possible: shift(rangeBeforeKey.possible), plausible: shift(rangeBeforeKey.plausible) } : { possible: [t.stops, t.stops], plausible: [t.stops, t.stops] },
  };
}

/**
 * A canonical text of everything that decides a look's render (spectra to 7 significant digits, tone
 * settings, key), so two looks with the same content share renders. Hash it for a cache key.
 */
export function lookFingerprint(s: LookSpectra): string {
  const v = (sp: Spectrum) => Array.from(sp.values, (x) => Number(x.toPrecision(7)));
  const { keySwatchId: _ignored, ...tone } = s.tone as ToneSettingsLike & { keyZone: number; keySwatchId?: unknown };
  return JSON.stringify({
    light: v(s.bareLight),
    filters: s.filters.map((f) => [f.on, v(f.spectrum)]),
    medium: v(s.medium),
    mediumToneId: s.mediumToneId,
    tone: Object.keys(tone).sort().map((k) => [k, (tone as Record<string, unknown>)[k]]),
    key: s.key ? v(s.key) : null,
  });
}
