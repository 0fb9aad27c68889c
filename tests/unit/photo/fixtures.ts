import type { LookSpectra } from '../../../shared/look/compose-look';
import { resolveFilter, resolveLight, resolveMedium } from '../../../shared/spectral/compute';

/** The photo tests' look (the demo's "Panchromatic + red-absorbing cyan"): tungsten, a cyan lens filter, panchromatic, grade 2. */
export function cyanPanchromaticLook(): LookSpectra {
  return {
    bareLight: resolveLight({ id: 'tungsten-3200' }),
    filters: [{ spectrum: resolveFilter({ id: 'cyan-530' }), on: 'lens' }],
    medium: resolveMedium({ id: 'panchromatic' }),
    mediumToneId: 'medium.panchromatic',
    tone: { developmentStops: 0, ratingStops: 0, printGrade: 2, printExposureStops: 0, shadowDetailStops: null, highlightRollOffStops: null, keyZone: 5 },
    key: null,
  };
}
