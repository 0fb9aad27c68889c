import { Router } from 'express';
import type { AppContext } from '../../context';
import { lightPlanRequestSchema, type LightPlanRequest } from '../../../shared/schemas/light-plan';
import { computeRoute } from '../route-registry';
import { computeLightPlan } from './light-plan.service';

/** POST /api/light-plan (signed in; CSRF as every state-changing route): lamps against the level a look needs; see docs/api-exposure.md. */
export function lightPlanRouter(_ctx: AppContext): Router {
  const r = Router();
  computeRoute<LightPlanRequest>(r, '/light-plan', lightPlanRequestSchema, computeLightPlan);
  return r;
}
