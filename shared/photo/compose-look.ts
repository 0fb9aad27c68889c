/**
 * A look's spectra → the model photos are rendered with. Composition only, the same on the server
 * (full-resolution renders) and in the browser (live preview): filters on the light are gels
 * (`lightThroughGel`), filters on the lens go into the stack (`prepareStack`), a key swatch is placed on
 * its zone (`simulateSwatches`, `keyOffsetStops`), and the medium's tone pipeline (`buildTonePipeline`)
 * turns stops into a grey.
 */
import { prepareStack, simulateSwatches, type Stack } from '../spectral/compute';
import { lightThroughGel } from '../spectral/lights';
import type { Spectrum } from '../spectral/spectrum';
import type { UpsampleTable } from '../spectral/upsample-table';
import { buildTonePipeline, type ToneSettingsLike } from '../tone/tone-pipeline';
import { keyOffsetStops } from '../tone/zones';
import { photoToneModel, type PhotoToneModel } from './look-photo-model';

/** The spectra and settings of a look, resolved (production curves, library items and inline sources alike). */
export interface PhotoLookSpectra {
  /** the lamp as chosen, before any gel; relative power on the working grid */
  bareLight: Spectrum;
  /** the stack in order, each on the lens or on the light (a gel); transmittance 0..1 */
  filters: readonly { spectrum: Spectrum; on: 'lens' | 'light' }[];
  /** relative sensitivity, energy basis */
  medium: Spectrum;
  /** the tone-defaults id of the medium (shared/tone/media-tone.ts) */
  mediumToneId: string;
  /** development, rating, print and key settings */
  tone: ToneSettingsLike & { keyZone: number };
  /** the key swatch's reflectance (0..1), or null when middle grey is the key */
  key: Spectrum | null;
}

/** A look ready for photos. */
export interface PhotoLook {
  stack: Stack;
  /** key placement, stops (0 when middle grey is placed on zone V) */
  offsetStops: number;
  model: PhotoToneModel;
}

/** The stack of a look's spectra: the light through its gels, the lens filters, the medium. */
export function photoLookStack(s: PhotoLookSpectra): Stack {
  const gels = s.filters.filter((f) => f.on === 'light').map((f) => f.spectrum);
  const lens = s.filters.filter((f) => f.on === 'lens').map((f) => f.spectrum);
  const light = gels.length ? lightThroughGel(s.bareLight, ...gels) : s.bareLight;
  return prepareStack({ light, filters: lens, medium: s.medium });
}

/**
 * Composes a look for photos. `reflectances` (node-reflectances.ts) makes it faster when many looks
 * are prepared with the same upsampling table.
 */
export function photoLook(s: PhotoLookSpectra, upsample: UpsampleTable, reflectances?: Float32Array): PhotoLook {
  const stack = photoLookStack(s);
  const keyStops = s.key ? simulateSwatches(stack, [{ name: 'key', reflectance: s.key, estimated: false }]).swatches[0].stops : 0;
  const offsetStops = keyOffsetStops(keyStops, s.tone.keyZone);
  const pipeline = buildTonePipeline({ mediumId: s.mediumToneId, settings: s.tone, offsetStops });
  return { stack, offsetStops, model: photoToneModel(stack, pipeline, upsample, reflectances) };
}

/**
 * A canonical text of everything that decides a look's render (spectra to 7 significant digits, tone
 * settings, key), so two looks with the same content share renders. Hash it for a cache key.
 */
export function photoLookFingerprint(s: PhotoLookSpectra): string {
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
