import { Router } from 'express';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { handle, productionRoute, pid, idParam } from '../route-registry';
import { lookAnalyseSchema, lookCreateSchema, lookDuplicateSchema, lookUpdateSchema } from '../../../shared/schemas/look';
import { LooksService } from './looks.service';
import { lightBudgetRequestSchema } from '../../../shared/schemas/look';
import { monitorTableQuerySchema } from '../../../shared/look/monitor-table';
import { zodToInvalid } from '../../middleware/validate';

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
  // before any /looks/:lookId route, so "light-budget" is not read as an id
  productionRoute(r, ctx, 'post', '/looks/light-budget', 'viewer', validate(lightBudgetRequestSchema), handle(async (req, res) => {
    res.json(await svc.lightBudget(pid(req), req.body));
  }));
  productionRoute(r, ctx, 'get', '/looks/:lookId', 'viewer', handle(async (req, res) => {
    res.json({ look: await svc.get(pid(req), idParam(req.params.lookId, 'Look')) });
  }));
  // a monitoring table of the look (cube or CLF), as a download; docs/api-monitoring.md
  productionRoute(r, ctx, 'get', '/looks/:lookId/lut', 'viewer', handle(async (req, res) => {
    const q = monitorTableQuerySchema.safeParse(req.query);
    if (!q.success) throw zodToInvalid(q.error);
    const lut = await svc.monitorTable(pid(req), idParam(req.params.lookId, 'Look'), q.data);
    res.setHeader('Content-Type', lut.contentType);
    res.setHeader('Content-Disposition', `attachment; filename="${lut.fileName}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(lut.body);
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
