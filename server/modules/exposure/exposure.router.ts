import { Router } from 'express';
import type { AppContext } from '../../context';
import { requireAuth } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { exposureRequestSchema, type ExposureRequest } from '../../../shared/schemas/exposure';
import { computeExposure } from './exposure.service';

/** POST /api/exposure (signed in): the EI chain and the light level; see docs/api-exposure.md. */
export function exposureRouter(_ctx: AppContext): Router {
  const r = Router();
  r.post('/exposure', requireAuth, validate(exposureRequestSchema), (req, res) => {
    res.json(computeExposure(req.body as ExposureRequest));
  });
  return r;
}
