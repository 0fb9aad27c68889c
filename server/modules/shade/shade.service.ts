/**
 * POST /api/shade over the engine's `findShade` (shared/spectral/shade.ts); see docs/api-shade.md.
 * The search runs in the compute pool (services/compute-pool.ts; the job is shade-answer.ts `shadeJob`), off the
 * main event loop. Engine input errors become 400s naming the field path (`medium.id`, `near.skin.melanin`, …).
 */
import type { ShadeRequest, ShadeResponse } from '../../../shared/schemas/shade';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { InvalidError } from '../../errors';
import type { ComputePool } from '../../services/compute-pool';
import { getUpsampleTable } from '../../services/upsample-table';
import { shadeJob } from './shade-answer';

/**
 * The work a shade asks for, for fair use (middleware/fair-use.ts), in swatches simulated: a search takes
 * about 15 ms against 0.2–0.3 ms a swatch of a simulation (measured on the development machine).
 */
export const SHADE_WORK = 50;
export const shadeWork = (): number => SHADE_WORK;

/** Runs a validated shade request: the surface nearest `near` landing on `target` through the light path. */
export async function runShade(pool: ComputePool, dataDir: string, request: ShadeRequest): Promise<ShadeResponse> {
  const table = await getUpsampleTable(dataDir);
  try {
    return await pool.run(shadeJob, request, { table });
  } catch (err) {
    if (err instanceof SpectralInputError) throw new InvalidError(err.message, err.field);
    throw err;
  }
}
