/**
 * POST /api/light-plan: lamps by intensity (or lumens and beam angle) and distance against the incident
 * level an EI, T-stop and shutter need (ISO 2720), with the key-to-fill ratio against the medium's
 * shadow-detail threshold. The numbers come from shared/tone/lamp-plan.ts; see docs/api-exposure.md.
 */
import { z } from 'zod';
import './messages';
import { nameText } from './names';
import { MODERN_SHADOW_DETAIL_STOPS } from '../tone/media-tone';
import type { KeyToFill, LampResult } from '../tone/lamp-plan';

/** At most this many lamps in one plan. */
export const MAX_PLAN_LAMPS = 24;
/** The threshold used when the request gives none: a modern negative's 5 stops (common practice, media-tone.ts). */
export const DEFAULT_PLAN_SHADOW_DETAIL_STOPS = MODERN_SHADOW_DETAIL_STOPS;
export const LAMP_ROLES = ['key', 'fill'] as const;

export const planLampSchema = z.strictObject({
  name: nameText(80, { empty: 'Give the lamp a name.' }),
  /** luminous intensity on the beam axis, cd */
  intensityCd: z.number().positive().max(1e9).optional(),
  /** luminous flux, lm (with beamAngleDeg) */
  lumens: z.number().positive().max(1e8).optional(),
  /** full beam angle, degrees (with lumens) */
  beamAngleDeg: z.number().positive().max(360).optional(),
  /** lamp to subject, m */
  distanceM: z.number().min(0.01).max(1000),
  /** angle of incidence at the subject, off the meter's axis, degrees */
  angleDeg: z.number().min(0).lt(90, 'Must be under 90° (at 90° the lamp grazes the subject and gives no light on it).').optional(),
  /** the source's largest dimension, m (for the five-times check) */
  sizeM: z.number().positive().max(100).optional(),
  role: z.enum(LAMP_ROLES).optional(),
});
export type PlanLamp = z.infer<typeof planLampSchema>;

export const lightPlanRequestSchema = z
  .strictObject({
    ei: z.number().positive().max(1_000_000),
    tStop: z.number().min(0.5).max(128),
    fps: z.number().positive().max(10_000),
    shutterAngle: z.number().positive().max(360),
    /** incident-meter constant C, lux·s (ISO 2720); default the app's 250 */
    meterConstant: z.number().positive().max(10_000).optional(),
    /** stops under the key where the medium loses shadow detail; default 5 (modern negative) */
    shadowDetailStops: z.number().min(0.5).max(12).optional(),
    lamps: z.array(planLampSchema).min(1, 'Give at least one lamp.').max(MAX_PLAN_LAMPS, `At most ${MAX_PLAN_LAMPS} lamps.`),
  })
  .superRefine((v, ctx) => {
    v.lamps.forEach((l, i) => {
      const at = (k: string) => ['lamps', i, k];
      if (l.intensityCd !== undefined && (l.lumens !== undefined || l.beamAngleDeg !== undefined)) {
        ctx.addIssue({ code: 'custom', path: at('intensityCd'), message: 'Give intensityCd, or lumens with beamAngleDeg, not both.' });
      } else if (l.intensityCd === undefined && l.lumens === undefined) {
        ctx.addIssue({ code: 'custom', path: at('intensityCd'), message: 'Give intensityCd (candela), or lumens with beamAngleDeg.' });
      } else if (l.intensityCd === undefined && l.beamAngleDeg === undefined) {
        ctx.addIssue({ code: 'custom', path: at('beamAngleDeg'), message: 'Give the beam angle with lumens.' });
      }
    });
    for (const role of LAMP_ROLES) {
      const idx = v.lamps.map((l, i) => (l.role === role ? i : -1)).filter((i) => i >= 0);
      if (idx.length > 1) ctx.addIssue({ code: 'custom', path: ['lamps', idx[1], 'role'], message: `Only one lamp can be the ${role}.` });
    }
  });
export type LightPlanRequest = z.infer<typeof lightPlanRequestSchema>;
export type LightPlanRequestInput = z.input<typeof lightPlanRequestSchema>;

/** One lamp of the answer (the engine's result, shared/tone/lamp-plan.ts). */
export type LightPlanLampAnswer = LampResult;

export interface LightPlanResponse {
  ei: number;
  tStop: number;
  fps: number;
  shutterAngle: number;
  /** exposure time, s: shutter angle / (360 · fps) */
  exposureSeconds: number;
  meterConstant: number;
  meterNote: string;
  /** incident level the EI and T-stop need (ISO 2720) */
  neededLux: number;
  neededFc: number;
  lamps: LightPlanLampAnswer[];
  totalLux: number;
  totalFc: number;
  /** log2(total / needed); + is more light than needed */
  stopsVsNeeded: number;
  shadowDetailStops: number;
  keyToFill: (KeyToFill & { text: string }) | null;
  /** the model behind the figures, in plain words */
  model: readonly string[];
  /** what to check on this plan (too close for a point source, the cone model in use, very bright) */
  warnings: string[];
  cautions: readonly { title: string; text: string }[];
}
