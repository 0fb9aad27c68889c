import { useMemo } from 'react';
import type { ToneSettings } from '../../../../shared/schemas/exposure';
import { exposurePlan, type ExposurePlan } from '../../../../shared/tone/exposure-plan';
import { mediumToneDefaults } from '../../../../shared/tone/media-tone';

export interface ExposurePlanState {
  /** the box speed the chain starts from (the look's, else the medium's); null for the eye */
  boxSpeed: number | null;
  /** null when the medium has no exposure index (the eye) or a value is out of range */
  plan: ExposurePlan | null;
}

/**
 * The EI chain and light level of a look, computed in the browser with shared/tone on every change
 * (no round trip), from the tone model's medium id, the look's tone settings and a filter factor in stops.
 */
export function useExposurePlan(mediumId: string, tone: ToneSettings, filterStops: number): ExposurePlanState {
  const { ratingStops, tStop, fps, shutterAngle, calibrationConstant } = tone;
  const boxSpeed = tone.boxSpeed ?? mediumToneDefaults(mediumId).boxSpeed;
  return useMemo(() => {
    if (boxSpeed === null) return { boxSpeed, plan: null };
    try {
      return { boxSpeed, plan: exposurePlan({ boxSpeed, ratingStops, filterStops, tStop, fps, shutterAngle, calibrationConstant }) };
    } catch {
      return { boxSpeed, plan: null };
    }
  }, [boxSpeed, ratingStops, filterStops, tStop, fps, shutterAngle, calibrationConstant]);
}
