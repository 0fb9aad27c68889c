import { Router } from 'express';
import type { AppContext } from '../../context';
import { requireAuth } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { productionCreateSchema, productionUpdateSchema } from '../../../shared/schemas/auth';
import { handle, productionRoute } from '../route-registry';
import { ProductionsService } from './productions.service';
import { activityRecorder } from '../../services/activity/activity-recorder';

export function productionsRouter(ctx: AppContext): Router {
  const r = Router();
  const svc = new ProductionsService(ctx.ds, ctx.env.dataDir);

  r.get('/productions', requireAuth, handle(async (req, res) => void res.json({ productions: await svc.listFor(req.user!) })));
  r.post(
    '/productions',
    requireAuth,
    validate(productionCreateSchema),
    handle(async (req, res) => {
      const production = await svc.create(req.user!, req.body);
      // the first entry of its log (outside productionRoute: there is no production before this)
      await activityRecorder(ctx.ds).record({ productionId: production.id, actorId: req.user!.id, actorName: req.user!.name, action: 'created', kind: 'production', itemId: production.id, itemName: production.name, detail: '' });
      res.status(201).json({ production });
    }),
  );

  productionRoute(r, ctx, 'get', '', 'viewer', handle(async (req, res) => void res.json({ production: await svc.overview(req.membership!) })));
  productionRoute(
    r, ctx, 'patch', '', 'owner',
    validate(productionUpdateSchema),
    handle(async (req, res) => void res.json({ production: await svc.update(req.membership!, req.body) })),
  );
  productionRoute(r, ctx, 'delete', '', 'owner', handle(async (req, res) => {
    await svc.remove(req.membership!);
    res.status(204).end();
  }));
  return r;
}
