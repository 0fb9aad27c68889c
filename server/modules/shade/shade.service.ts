/**
 * POST /api/shade over the engine's `findShade` (shared/spectral/shade.ts); see docs/api-shade.md.
 * Engine input errors become 400s naming the field path (`medium.id`, `near.skin.melanin`, …).
 */
import type { ShadeRequest, ShadeResponse } from '../../../shared/schemas/shade';
import { resolveLightPath } from '../../../shared/spectral/compute';
import { SpectralInputError, within } from '../../../shared/spectral/errors';
import { findShade } from '../../../shared/spectral/shade';
import { InvalidError } from '../../errors';
import { getUpsampleTable } from '../../services/upsample-table';

function engine<T>(fn: () => T): T {
  try {
    return fn();
  } catch (err) {
    if (err instanceof SpectralInputError) throw new InvalidError(err.message, err.field);
    throw err;
  }
}

/** Runs a validated shade request: the surface nearest `near` landing on `target` through the light path. */
export async function runShade(dataDir: string, request: ShadeRequest): Promise<ShadeResponse> {
  const lightPath = engine(() => resolveLightPath(request));
  const table = await getUpsampleTable(dataDir);
  const targetStops = request.target.zone !== undefined ? request.target.zone - 5 : request.target.stops!;
  const r = engine(() => within(['near'], () => findShade(lightPath, targetStops, request.near, table)));
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
