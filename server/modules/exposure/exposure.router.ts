import { Router } from 'express';
import type { AppContext } from '../../context';
import { exposureRequestSchema, type ExposureRequest } from '../../../shared/schemas/exposure';
import { computeRoute } from '../route-registry';
import { computeExposure } from './exposure.service';

/** POST /api/exposure (signed in): the EI chain and the light level; see docs/api-exposure.md. */
export function exposureRouter(_ctx: AppContext): Router {
  const r = Router();
  computeRoute<ExposureRequest>(r, '/exposure', exposureRequestSchema, computeExposure);
  return r;
}
