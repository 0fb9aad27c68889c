import { z } from 'zod';
import { DEVELOPMENT_STOPS_RANGE } from '../tone/development';
import { GRADE_RANGE } from '../tone/print';
import { ZONE_RANGE } from '../tone/zones';
import { DEFAULT_INCIDENT_C } from '../tone/light-level';

/** The camera a look's light levels assume until it says otherwise: T2.8, 24 fps, 180° (common practice). */
export const DEFAULT_CAMERA = Object.freeze({ tStop: 2.8, fps: 24, shutterAngle: 180 });

/**
 * Tone settings a look stores: development, EI rating, print, key placement and thresholds.
 * `keySwatchId` null = the key is middle grey; else that swatch is placed on `keyZone`.
 * Thresholds null = the medium's default (classic 4 stops, modern 5; see shared/tone/media-tone).
 * The camera fields (box speed, T-stop, fps, shutter angle, meter constant) feed the EI chain and the
 * light level of the bench and the exposure sheet.
 */
export const toneSettingsSchema = z.object({
  /** push (+) / pull (−), stops */
  developmentStops: z.number().min(DEVELOPMENT_STOPS_RANGE[0]).max(DEVELOPMENT_STOPS_RANGE[1]).default(0),
  /** rating adjustment from box speed, stops (− = rated slower) */
  ratingStops: z.number().min(-6).max(6).default(0),
  /** print contrast grade, −1 ("00") .. 5; 2 is normal */
  printGrade: z.number().min(GRADE_RANGE[0]).max(GRADE_RANGE[1]).default(2),
  /** print (or display) exposure, stops (+ = darker) */
  printExposureStops: z.number().min(-6).max(6).default(0),
  /** the swatch used as key, or null for middle grey */
  keySwatchId: z.number().int().positive().nullable().default(null),
  /** the zone the key is placed on, 0..10 (5 = zone V) */
  keyZone: z.number().min(ZONE_RANGE[0]).max(ZONE_RANGE[1]).default(5),
  /** stops under zone V where texture is lost; null = the medium's default */
  shadowDetailStops: z.number().min(0.5).max(12).nullable().default(null),
  /** stops over zone V where highlights lose texture; null = the medium's default */
  highlightRollOffStops: z.number().min(0.5).max(12).nullable().default(null),
  /** box speed (ISO arithmetic) the EI chain starts from; null = the medium's own */
  boxSpeed: z.number().positive().max(100_000).nullable().default(null),
  /** camera T-stop the light level is worked out for */
  tStop: z.number().min(0.5).max(128).default(DEFAULT_CAMERA.tStop),
  /** frames per second */
  fps: z.number().positive().max(10_000).default(DEFAULT_CAMERA.fps),
  /** shutter angle, degrees (exposure time = angle / (360 · fps)) */
  shutterAngle: z.number().positive().max(360).default(DEFAULT_CAMERA.shutterAngle),
  /** incident-meter calibration constant C, lux·s (ISO 2720; 250 for a flat receptor) */
  calibrationConstant: z.number().positive().max(10_000).default(DEFAULT_INCIDENT_C),
});
export type ToneSettings = z.infer<typeof toneSettingsSchema>;
export type ToneSettingsInput = z.input<typeof toneSettingsSchema>;

const LIGHT_FIELDS = ['tStop', 'fps', 'shutterAngle'] as const;

/**
 * POST /api/exposure. Two parts, either or both:
 * - the EI chain: boxSpeed (+ ratingStops, filterStops);
 * - the light level: tStop, fps, shutterAngle (+ calibrationConstant), at `ei`, or at the chain's
 *   effective EI when boxSpeed is given (then `ei` must be left out).
 */
export const exposureRequestSchema = z
  .object({
    boxSpeed: z.number().positive().max(100_000).optional(),
    ratingStops: z.number().min(-6).max(6).optional(),
    filterStops: z.number().min(-6).max(16).optional(),
    ei: z.number().positive().max(1_000_000).optional(),
    tStop: z.number().min(0.5).max(128).optional(),
    fps: z.number().positive().max(10_000).optional(),
    shutterAngle: z.number().positive().max(360).optional(),
    calibrationConstant: z.number().positive().max(10_000).optional(),
  })
  .superRefine((v, ctx) => {
    const chain = v.boxSpeed !== undefined;
    const light = LIGHT_FIELDS.some((k) => v[k] !== undefined) || v.ei !== undefined || v.calibrationConstant !== undefined;
    if (!chain && !light) {
      ctx.addIssue({ code: 'custom', path: ['boxSpeed'], message: 'Give boxSpeed for the exposure-index chain, or ei, tStop, fps and shutterAngle for the light level.' });
      return;
    }
    if (!chain && (v.ratingStops !== undefined || v.filterStops !== undefined)) {
      ctx.addIssue({ code: 'custom', path: ['boxSpeed'], message: 'Required with ratingStops or filterStops.' });
      return;
    }
    if (!light) return;
    for (const k of LIGHT_FIELDS) {
      if (v[k] === undefined) {
        ctx.addIssue({ code: 'custom', path: [k], message: 'Required for the light level (tStop, fps and shutterAngle go together).' });
        return;
      }
    }
    if (chain && v.ei !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['ei'], message: 'Leave ei out when boxSpeed is given: the light level uses the chain’s effective EI.' });
    } else if (!chain && v.ei === undefined) {
      ctx.addIssue({ code: 'custom', path: ['ei'], message: 'Required for the light level (or give boxSpeed to use the chain’s effective EI).' });
    }
  });
export type ExposureRequest = z.infer<typeof exposureRequestSchema>;

export const eiChainStepSchema = z.object({
  step: z.enum(['box', 'rating', 'filter']),
  label: z.string(),
  /** change of EI at this step, stops (− = slower) */
  stops: z.number(),
  /** the change as a trade label to the nearest third, e.g. "−⅔" */
  stopsLabel: z.string(),
  totalStops: z.number(),
  exactEI: z.number(),
  /** on the ISO third-stop series */
  ei: z.number(),
});
export type EiChainStepAnswer = z.infer<typeof eiChainStepSchema>;

export const lightCostSchema = z.object({
  /** the EI of the look without the filter (box speed + rating) */
  referenceEI: z.number(),
  /** how many times the light of the unfiltered look this one needs */
  ratio: z.number(),
  stops: z.number(),
  text: z.string(),
});

/** Response of POST /api/exposure: chain fields when boxSpeed was given, light fields when tStop was. */
export const exposureResponseSchema = z.object({
  boxSpeed: z.number().optional(),
  steps: z.array(eiChainStepSchema).optional(),
  totalStops: z.number().optional(),
  unfilteredEI: z.number().optional(),
  effectiveEI: z.number().optional(),
  ei: z.number().optional(),
  eiSource: z.enum(['request', 'chain']).optional(),
  tStop: z.number().optional(),
  fps: z.number().optional(),
  shutterAngle: z.number().optional(),
  exposureSeconds: z.number().optional(),
  calibrationConstant: z.number().optional(),
  calibrationNote: z.string().optional(),
  lux: z.number().optional(),
  footcandles: z.number().optional(),
  lightCost: lightCostSchema.optional(),
});
export type ExposureResponse = z.infer<typeof exposureResponseSchema>;
