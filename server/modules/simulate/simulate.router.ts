import { Router } from 'express';
import type { AppContext } from '../../context';
import { requireAuth } from '../../middleware/require-role';
import { simulateRequestSchema, type SimulateRequest } from '../../../shared/schemas/simulate';
import { UPSAMPLE_METHOD } from '../../../shared/spectral/upsample-table';
import { computeRoute, handle } from '../route-registry';
import { libraryListing, runSimulation, simulationWork, upsampleTableGzip } from './simulate.service';
import { simulateJob } from './simulate.job';

/**
 * Signed-in only (docs/api-simulate.md):
 *   POST /api/simulate                 light, filters, medium, swatches → tones (compute pool; fair use per user)
 *   GET  /api/library                  the built-in lights, filters and media with their curves
 *   GET  /api/library/upsample-table   the spectral upsampling table, binary
 */
export function simulateRouter(ctx: AppContext): Router {
  const r = Router();
  ctx.compute.preload(simulateJob);
  computeRoute<SimulateRequest>(r, '/simulate', simulateRequestSchema, (body) => runSimulation(ctx.compute, ctx.env.dataDir, body), {
    fairUse: { limiter: ctx.fairUse, work: simulationWork },
  });
  r.get('/library', requireAuth, (_req, res) => {
    res.set('Cache-Control', 'private, max-age=3600');
    res.json(libraryListing());
  });
  r.get(
    '/library/upsample-table',
    requireAuth,
    handle(async (_req, res) => {
      const gz = await upsampleTableGzip(ctx.env.dataDir);
      res.set('Content-Type', 'application/octet-stream');
      res.set('Content-Encoding', 'gzip');
      res.set('Cache-Control', 'private, max-age=86400');
      res.set('ETag', `"upsample-r${UPSAMPLE_METHOD.resolution}-v${UPSAMPLE_METHOD.version}"`);
      res.send(gz);
    }),
  );
  return r;
}
