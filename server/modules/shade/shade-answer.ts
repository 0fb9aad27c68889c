/**
 * The answer of POST /api/shade as a pure function of the validated body and the upsampling table, and the
 * compute-pool job that runs it (`shadeJob`; services/compute-jobs.ts). Loaded in the pool's threads:
 * engine imports only. Engine input errors stay SpectralInputErrors (with their field path);
 * shade.service.ts turns them into 400s.
 */
import type { ShadeRequest, ShadeResponse } from '../../../shared/schemas/shade';
import { resolveLightPath } from '../../../shared/spectral/compute';
import { within } from '../../../shared/spectral/errors';
import { findShade } from '../../../shared/spectral/shade';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';
import { computeJob, needTable } from '../../services/compute-jobs';

/** The surface nearest `near` landing on `target` through the request's light path (shared/spectral/shade.ts). */
export function shadeAnswer(request: ShadeRequest, table: UpsampleTable): ShadeResponse {
  const lightPath = resolveLightPath(request);
  const targetStops = request.target.zone !== undefined ? request.target.zone - 5 : request.target.stops!;
  const r = within(['near'], () => findShade(lightPath, targetStops, request.near, table));
  const { possible, plausible } = r.range;
  return {
    srgb: r.srgb,
    stops: r.stops,
    zone: r.zone,
    range: { possible, plausible },
    reached: r.reached,
    changed: r.changed,
    value: r.value,
    source: r.source,
    ...('srgb' in r.source ? {} : { params: r.source }),
    ...(r.message ? { message: r.message } : {}),
  };
}

/** POST /api/shade's search as a compute-pool job. */
export const shadeJob = computeJob<ShadeRequest, ShadeResponse>('shade', import.meta.url, (body, table) => shadeAnswer(body, needTable(table)));
