import { Router } from 'express';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { handle, pid, productionRoute } from '../route-registry';
import { activityQuerySchema, type ActivityQuery } from '../../../shared/schemas/activity';
import { ActivityService } from './activity.service';

/**
 * GET /api/productions/:productionId/activity (owners): who created, changed or deleted what, newest first;
 * `?before=<entry id>&limit=<1..200>&kind=<look|swatch|…>&actor=<user id>`; a bad value is a 400 naming it.
 */
export function activityRouter(ctx: AppContext): Router {
  const r = Router();
  const svc = new ActivityService(ctx.ds);
  productionRoute(r, ctx, 'get', '/activity', 'owner', validate(activityQuerySchema, 'query'), handle(async (req, res) => {
    res.setHeader('Cache-Control', 'private, no-store');
    res.json(await svc.list(pid(req), req.query as unknown as ActivityQuery));
  }));
  return r;
}
