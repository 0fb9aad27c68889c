import { Router } from 'express';
import type { AppContext } from '../../context';
import { shadeRequestSchema, type ShadeRequest } from '../../../shared/schemas/shade';
import { computeRoute } from '../route-registry';
import { runShade } from './shade.service';

/**
 * Signed-in only (docs/api-shade.md):
 *   POST /api/shade   light, filters, medium, target, near → the shade of near landing on target
 */
export function shadeRouter(ctx: AppContext): Router {
  const r = Router();
  computeRoute<ShadeRequest>(r, '/shade', shadeRequestSchema, (body) => runShade(ctx.env.dataDir, body));
  return r;
}
