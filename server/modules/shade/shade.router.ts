import { Router } from 'express';
import type { AppContext } from '../../context';
import { shadeRequestSchema, type ShadeRequest } from '../../../shared/schemas/shade';
import { computeRoute } from '../route-registry';
import { runShade, shadeWork } from './shade.service';
import { shadeJob } from './shade-answer';

/**
 * Signed-in only (docs/api-shade.md):
 *   POST /api/shade   light, filters, medium, target, near → the shade of near landing on target (compute pool; fair use per user)
 */
export function shadeRouter(ctx: AppContext): Router {
  const r = Router();
  ctx.compute.preload(shadeJob);
  computeRoute<ShadeRequest>(r, '/shade', shadeRequestSchema, (body) => runShade(ctx.compute, ctx.env.dataDir, body), { fairUse: { limiter: ctx.fairUse, work: shadeWork } });
  return r;
}
