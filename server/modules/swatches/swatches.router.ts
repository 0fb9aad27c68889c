import { Router } from 'express';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { handle, productionRoute, pid, idParam } from '../route-registry';
import { departmentSchema } from '../../../shared/schemas/roles';
import { swatchCreateSchema, swatchUpdateSchema } from '../../../shared/schemas/swatch';
import { SwatchesService } from './swatches.service';
import { ToneService } from '../boards/tone.service';

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
  productionRoute(r, ctx, 'get', '/swatches/:swatchId', 'viewer', handle(async (req, res) => {
    res.json({ swatch: await svc.get(pid(req), idParam(req.params.swatchId, 'Swatch')) });
  }));
  productionRoute(r, ctx, 'get', '/swatches/:swatchId/tones', 'viewer', handle(async (req, res) => {
    res.json(await tones.swatchTones(pid(req), idParam(req.params.swatchId, 'Swatch')));
  }));
  productionRoute(r, ctx, 'patch', '/swatches/:swatchId', 'contributor', validate(swatchUpdateSchema), handle(async (req, res) => {
    res.json({ swatch: await svc.update(req.membership!, idParam(req.params.swatchId, 'Swatch'), req.body) });
  }));
  productionRoute(r, ctx, 'delete', '/swatches/:swatchId', 'contributor', handle(async (req, res) => {
    await svc.remove(req.membership!, idParam(req.params.swatchId, 'Swatch'));
    res.status(204).end();
  }));
  return r;
}
