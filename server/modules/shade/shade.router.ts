import { Router } from 'express';
import type { AppContext } from '../../context';
import { requireAuth } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { shadeRequestSchema, type ShadeRequest } from '../../../shared/schemas/shade';
import { handle } from '../route-registry';
import { runShade } from './shade.service';

/**
 * Signed-in only (docs/api-shade.md):
 *   POST /api/shade   light, filters, medium, target, near → the shade of near landing on target
 */
export function shadeRouter(ctx: AppContext): Router {
  const r = Router();
  r.post(
    '/shade',
    requireAuth,
    validate(shadeRequestSchema),
    handle(async (req, res) => {
      res.json(await runShade(ctx.env.dataDir, req.body as ShadeRequest));
    }),
  );
  return r;
}
