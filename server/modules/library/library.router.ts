import { Router } from 'express';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { handle, productionRoute, pid, idParam } from '../route-registry';
import { curveCreateSchema, curveUpdateSchema } from '../../../shared/schemas/curve';
import { LibraryService } from './library.service';

/** The production's own library of curves: viewers read; editors and owners add, rename and delete. */
export function libraryRouter(ctx: AppContext): Router {
  const r = Router();
  const svc = new LibraryService(ctx.ds);

  productionRoute(r, ctx, 'get', '/curves', 'viewer', handle(async (req, res) => void res.json({ curves: await svc.list(pid(req)) })));
  productionRoute(r, ctx, 'post', '/curves', 'editor', validate(curveCreateSchema), handle(async (req, res) => {
    res.status(201).json({ curve: await svc.create(req.membership!, req.body) });
  }));
  productionRoute(r, ctx, 'get', '/curves/:curveId', 'viewer', handle(async (req, res) => {
    res.json({ curve: await svc.get(pid(req), idParam(req.params.curveId, 'Curve')) });
  }));
  productionRoute(r, ctx, 'patch', '/curves/:curveId', 'editor', validate(curveUpdateSchema), handle(async (req, res) => {
    res.json({ curve: await svc.update(req.membership!, idParam(req.params.curveId, 'Curve'), req.body) });
  }));
  productionRoute(r, ctx, 'delete', '/curves/:curveId', 'editor', handle(async (req, res) => {
    await svc.remove(req.membership!, idParam(req.params.curveId, 'Curve'));
    res.status(204).end();
  }));
  return r;
}
