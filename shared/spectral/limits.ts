/**
 * Names and ranges the engine accepts, shared with the source schemas (sources.ts, re-exported by
 * shared/schemas/simulate.ts) so a form and the engine refuse the same things.
 */

/** CIE illuminants available by name. D50 is made from the daylight components (see lights.ts). */
export const CIE_ILLUMINANT_NAMES = ['D65', 'D50', 'A', 'F2', 'F7', 'F11'] as const;
export type CieIlluminantName = (typeof CIE_ILLUMINANT_NAMES)[number];

/** Correlated colour temperatures the CIE daylight formula is defined for, K (CIE 015:2018). */
export const DAYLIGHT_CCT_K = { min: 4000, max: 25000 } as const;
/** Blackbody temperatures accepted, K (candle flame to clear north sky). */
export const BLACKBODY_K = { min: 1000, max: 25000 } as const;
/** A filter stack costing more than this many stops on a medium is flagged `opaque`. */
export const OPAQUE_LIMIT_STOPS = 10;
/** Filter stops are reported up to this cap (a filter that passes nothing the medium sees reads as this). */
export const MAX_FILTER_STOPS = 40;
/** Exposures and eye luminances are floored at this many stops below middle grey before taking logs. */
export const FLOOR_STOPS = -20;
/** Middle grey: reflectance / relative exposure 0.18 (zone V; common practice). */
export const MIDDLE_GREY = 0.18;
/** At most this many samples in one spectrum from the API. */
export const MAX_PAIRS = 4000;
/** At most this many swatches in one simulate request. */
export const MAX_SWATCHES = 2000;
/** At most this many filters in one lightPath. */
export const MAX_FILTERS = 12;
