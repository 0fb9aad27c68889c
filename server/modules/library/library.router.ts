import { Router } from 'express';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { handle, productionRoute, pid, itemRoutes } from '../route-registry';
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
  itemRoutes(r, ctx, { plural: 'curves', param: 'curveId', key: 'curve', what: 'Curve', read: 'viewer', write: 'editor', updateSchema: curveUpdateSchema }, svc);
  return r;
}
