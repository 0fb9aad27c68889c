/**
 * Tone defaults per medium id: which tone model a medium uses (negative + print, sensor + display, or the
 * eye), its box speed, curve shape and its shadow-detail / highlight thresholds.
 *
 * Classic media (blue-sensitive, orthochromatic): detail threshold 4 stops under the key; modern negatives
 * (panchromatic, extended-red panchromatic): 5 stops — a fact of the trade (common practice).
 * Box speeds, curve shapes, sensor and display values are generic, typical model values chosen for
 * Grisaille (invented, not any product's data). Every normal-development curve is built to the ISO 6
 * contrast with its ISO speed equal to the box speed.
 */
import type { CurveShape } from './characteristic-curve';
import type { DisplayCurve } from './print';
import { DISPLAY_WHITE_STOPS } from './print';

/** Fact of the trade (common practice): texture on a face is lost about 4 stops under the key on classic media. */
export const CLASSIC_SHADOW_DETAIL_STOPS = 4;
/** Fact of the trade (common practice): about 5 stops on modern negatives. */
export const MODERN_SHADOW_DETAIL_STOPS = 5;
/** Zone VIII, the last textured white of the zone system (common practice): 3 stops over middle grey. */
export const NEGATIVE_HIGHLIGHT_ROLL_OFF_STOPS = 3;

export type MediumFamily = 'classic' | 'modern' | 'sensor' | 'eye';

interface Common {
  /** the medium id asked for */
  mediumId: string;
  /** false when the id is not one Grisaille knows; the modern-negative defaults are then used */
  known: boolean;
  family: MediumFamily;
  /** stops under zone V where texture is lost */
  shadowDetailStops: number;
  /** stops over zone V where highlights lose texture */
  highlightRollOffStops: number;
}
export interface NegativeToneDefaults extends Common {
  kind: 'negative';
  /** box speed (ISO arithmetic) at normal development */
  boxSpeed: number;
  /** shape of the normal-development curve (gamma is solved for the ISO 6 contrast) */
  shape: CurveShape;
}
export interface SensorToneDefaults extends Common {
  kind: 'sensor';
  /** the sensor's base exposure index */
  boxSpeed: number;
  display: DisplayCurve;
}
export interface EyeToneDefaults extends Common {
  kind: 'eye';
  boxSpeed: null;
}
export type MediumToneDefaults = NegativeToneDefaults | SensorToneDefaults | EyeToneDefaults;

/** Classic emulsion: long soft toe, early shoulder, lower maximum density (model values). */
const CLASSIC_SHAPE: CurveShape = Object.freeze({ baseFog: 0.25, dMax: 2.0, toe: 0.2, shoulder: 0.3 });
/** Modern negative: short toe, long straight line (model values). */
const MODERN_SHAPE: CurveShape = Object.freeze({ baseFog: 0.2, dMax: 2.6, toe: 0.1, shoulder: 0.25 });
/** Generic monochrome sensor: clips 5.5 stops over middle grey, display shoulder 1 stop soft (model values). */
const SENSOR_DISPLAY: DisplayCurve = Object.freeze({ headroomStops: 5.5, shoulderStops: 1 });

const classic = (boxSpeed: number) => ({
  kind: 'negative' as const,
  family: 'classic' as const,
  boxSpeed,
  shape: CLASSIC_SHAPE,
  shadowDetailStops: CLASSIC_SHADOW_DETAIL_STOPS,
  highlightRollOffStops: NEGATIVE_HIGHLIGHT_ROLL_OFF_STOPS,
});
const modern = (boxSpeed: number) => ({
  kind: 'negative' as const,
  family: 'modern' as const,
  boxSpeed,
  shape: MODERN_SHAPE,
  shadowDetailStops: MODERN_SHADOW_DETAIL_STOPS,
  highlightRollOffStops: NEGATIVE_HIGHLIGHT_ROLL_OFF_STOPS,
});

type Entry = Omit<NegativeToneDefaults, 'mediumId' | 'known'> | Omit<SensorToneDefaults, 'mediumId' | 'known'> | Omit<EyeToneDefaults, 'mediumId' | 'known'>;

/** The built-in media's tone defaults (box speeds are typical model values). */
const TABLE: Record<string, Entry> = {
  'blue-sensitive': classic(25),
  'orthochromatic': classic(80),
  panchromatic: modern(250),
  'panchromatic-extended-red': modern(200),
  // box speed of the infrared emulsion as rated under daylight without a filter (model value)
  infrared: classic(200),
  'silicon-ir-cut': {
    kind: 'sensor',
    family: 'sensor',
    boxSpeed: 800,
    display: SENSOR_DISPLAY,
    // model values: a clean sensor holds texture about 6 stops under; past +4 the display shoulder flattens it
    shadowDetailStops: 6,
    highlightRollOffStops: 4,
  },
  'eye': {
    kind: 'eye',
    family: 'eye',
    boxSpeed: null,
    // the eye is the reference: flagged only off the zone scale / past display white
    shadowDetailStops: 5,
    highlightRollOffStops: DISPLAY_WHITE_STOPS,
  },
};

/** Ids with built-in tone defaults. */
export const TONE_MEDIUM_IDS = Object.freeze(Object.keys(TABLE));

/**
 * Tone defaults for a medium id: the built-in library's ids (data/library/media.json, e.g. 'panchromatic'),
 * also accepted with a 'medium.' prefix. Unknown ids: ids starting 'silicon' get the sensor defaults,
 * anything else the modern-negative defaults at box speed 250; `known` is false for both.
 */
export function mediumToneDefaults(mediumId: string): MediumToneDefaults {
  const key = mediumId.replace(/^medium\./, '');
  const hit = TABLE[key];
  if (hit) return { ...hit, mediumId, known: true } as MediumToneDefaults;
  const fallback = key.startsWith('silicon') ? TABLE['silicon-ir-cut'] : modern(250);
  return { ...fallback, mediumId, known: false } as MediumToneDefaults;
}
