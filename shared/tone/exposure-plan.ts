/**
 * A look's exposure plan: the EI chain (box speed → rating → filter) and the incident light the set
 * needs at the effective EI (ISO 2720), beside the same look without its filter, so the cost of the
 * filter in light is plain. Used by the bench (live, in the browser) and the exposure sheet (server).
 * Light levels are worked out at the EI label of the ISO third-stop series (what the meter is set to).
 */
import { eiChain, type EiChain } from './ei-chain';
import { DEFAULT_INCIDENT_C, describeLightCost, lightCost, lightLevel, type LightLevel } from './light-level';
import { TONE_MEDIUM_IDS } from './media-tone';

/** T-stops a sheet lists light levels for (the full-stop series from T1.4 to T8, common practice). */
export const COMMON_T_STOPS: readonly number[] = Object.freeze([1.4, 2, 2.8, 4, 5.6, 8]);

export interface CameraSettings {
  /** T-stop */
  tStop: number;
  /** frames per second */
  fps: number;
  /** shutter angle, degrees */
  shutterAngle: number;
  /** incident-meter constant C, lux·s (default 250, ISO 2720 flat receptor) */
  calibrationConstant?: number;
}

export interface ExposurePlanInput extends CameraSettings {
  /** box speed, ISO arithmetic */
  boxSpeed: number;
  /** development / rating adjustment, stops (− = rated slower) */
  ratingStops: number;
  /** filter factor for the chosen light and medium, stops of light lost */
  filterStops: number;
}

export interface ExposurePlan {
  chain: EiChain;
  /** light needed at the effective EI (with the filter) */
  light: LightLevel;
  /** light needed at the unfiltered EI (box + rating, no filter) */
  unfilteredLight: LightLevel;
  /** how much more light the filtered look needs than the unfiltered one */
  cost: { ratio: number; stops: number; text: string };
}

/**
 * The EI chain and light levels of a look. EIs are ISO series labels; lux and foot-candles as in
 * lightLevel (E = C·N²/(t·S), ISO 2720); the cost ratio is unfilteredEI / effectiveEI (light ∝ 1/EI).
 */
export function exposurePlan(input: ExposurePlanInput): ExposurePlan {
  const chain = eiChain({ boxSpeed: input.boxSpeed, ratingStops: input.ratingStops, filterStops: input.filterStops });
  const camera = {
    tStop: input.tStop,
    fps: input.fps,
    shutterAngle: input.shutterAngle,
    calibrationConstant: input.calibrationConstant ?? DEFAULT_INCIDENT_C,
  };
  const light = lightLevel({ ei: chain.effectiveEI, ...camera });
  const unfilteredLight = lightLevel({ ei: chain.unfilteredEI, ...camera });
  const c = lightCost(chain.effectiveEI, chain.unfilteredEI);
  return { chain, light, unfilteredLight, cost: { ...c, text: describeLightCost(c.ratio) } };
}

export interface LightLevelRow {
  tStop: number;
  lux: number;
  footcandles: number;
}

/** Incident light (lux, fc) at exposure index `ei` for each T-stop in `tStops`, same frame rate, shutter and C. */
export function lightLevelTable(ei: number, camera: Omit<CameraSettings, 'tStop'>, tStops: readonly number[] = COMMON_T_STOPS): LightLevelRow[] {
  return tStops.map((tStop) => {
    const l = lightLevel({ ei, tStop, fps: camera.fps, shutterAngle: camera.shutterAngle, calibrationConstant: camera.calibrationConstant });
    return { tStop, lux: l.lux, footcandles: l.footcandles };
  });
}

/**
 * The tone model's id for a look's medium reference (the same rule as the board tones on the server):
 * built-in media by their library id (shared/tone/media-tone knows them, with or without a "medium."
 * prefix); production curves are "curve.<id>" and inline samples "custom", which take the tone model's
 * fallback (modern negative).
 */
export function toneMediumIdOfRef(ref: { curveId?: number; source?: { id?: string } }): string {
  const id = ref.source?.id;
  if (id === undefined) return ref.curveId !== undefined ? `curve.${ref.curveId}` : 'custom';
  if (TONE_MEDIUM_IDS.includes(id)) return id;
  if (TONE_MEDIUM_IDS.includes(`medium.${id}`)) return `medium.${id}`;
  return id;
}
