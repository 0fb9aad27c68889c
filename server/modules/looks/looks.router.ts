import { Router } from 'express';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { handle, productionRoute, pid, idParam } from '../route-registry';
import { lookAnalyseSchema, lookCreateSchema, lookDuplicateSchema, lookUpdateSchema } from '../../../shared/schemas/look';
import { LooksService } from './looks.service';

/** Looks: viewers read and analyse; editors and owners create, change, duplicate and delete. */
export function looksRouter(ctx: AppContext): Router {
  const r = Router();
  const svc = new LooksService(ctx.ds, ctx.env.dataDir);

  productionRoute(r, ctx, 'get', '/looks', 'viewer', handle(async (req, res) => void res.json({ looks: await svc.list(pid(req)) })));
  productionRoute(r, ctx, 'post', '/looks', 'editor', validate(lookCreateSchema), handle(async (req, res) => {
    res.status(201).json({ look: await svc.create(req.membership!, req.body) });
  }));
  productionRoute(r, ctx, 'post', '/looks/analyse', 'viewer', validate(lookAnalyseSchema), handle(async (req, res) => {
    res.json(await svc.analyse(pid(req), req.body));
  }));
  productionRoute(r, ctx, 'get', '/looks/:lookId', 'viewer', handle(async (req, res) => {
    res.json({ look: await svc.get(pid(req), idParam(req.params.lookId, 'Look')) });
  }));
  productionRoute(r, ctx, 'get', '/looks/:lookId/analysis', 'viewer', handle(async (req, res) => {
    res.json({ analysis: await svc.analysis(pid(req), idParam(req.params.lookId, 'Look')) });
  }));
  productionRoute(r, ctx, 'patch', '/looks/:lookId', 'editor', validate(lookUpdateSchema), handle(async (req, res) => {
    res.json({ look: await svc.update(req.membership!, idParam(req.params.lookId, 'Look'), req.body) });
  }));
  productionRoute(r, ctx, 'post', '/looks/:lookId/duplicate', 'editor', validate(lookDuplicateSchema), handle(async (req, res) => {
    res.status(201).json({ look: await svc.duplicate(req.membership!, idParam(req.params.lookId, 'Look'), req.body.name) });
  }));
  productionRoute(r, ctx, 'delete', '/looks/:lookId', 'editor', handle(async (req, res) => {
    await svc.remove(req.membership!, idParam(req.params.lookId, 'Look'));
    res.status(204).end();
  }));
  return r;
}
