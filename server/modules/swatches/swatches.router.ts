import { Router } from 'express';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { handle, productionRoute, pid, idParam, itemRoutes } from '../route-registry';
import { departmentSchema } from '../../../shared/schemas/roles';
import { swatchCreateSchema, swatchUpdateSchema } from '../../../shared/schemas/swatch';
import { SwatchesService } from './swatches.service';
import { ToneService } from '../tones/tone.service';

/** Swatches: viewers read; contributors add and edit their own department's; editors and owners any. */
export function swatchesRouter(ctx: AppContext): Router {
  const r = Router();
  const svc = new SwatchesService(ctx.ds, ctx.env.dataDir);
  const tones = new ToneService(ctx.ds, ctx.env.dataDir);

  productionRoute(r, ctx, 'get', '/swatches', 'viewer', handle(async (req, res) => {
    const d = departmentSchema.safeParse(req.query.department);
    res.json({ swatches: await svc.list(pid(req), { department: d.success ? d.data : undefined, spectra: req.query.spectra === '1' }) });
  }));
  productionRoute(r, ctx, 'post', '/swatches', 'contributor', validate(swatchCreateSchema), handle(async (req, res) => {
    res.status(201).json({ swatch: await svc.create(req.membership!, req.body) });
  }));
  productionRoute(r, ctx, 'get', '/swatches/:swatchId/tones', 'viewer', handle(async (req, res) => {
    res.json(await tones.swatchTones(pid(req), idParam(req.params.swatchId, 'Swatch')));
  }));
  itemRoutes(r, ctx, { plural: 'swatches', param: 'swatchId', key: 'swatch', what: 'Swatch', read: 'viewer', write: 'contributor', updateSchema: swatchUpdateSchema }, svc);
  return r;
}
