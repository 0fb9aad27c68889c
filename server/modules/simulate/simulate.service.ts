/**
 * POST /api/simulate and the built-in library, over the spectral engine (shared/spectral).
 * Engine input errors become 400s naming the field path; see docs/api-simulate.md. A simulation runs in
 * the compute pool (services/compute-pool.ts), off the main event loop.
 */
import type { LibraryView, SimulateRequest } from '../../../shared/schemas/simulate';
import { resolveFilter, resolveLight, resolveMedium } from '../../../shared/spectral/compute';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { LIBRARY_FILTERS, LIBRARY_LIGHTS, LIBRARY_MEDIA } from '../../../shared/spectral/library';
import { GRID_SHAPE } from '../../../shared/spectral/policy';
import type { Spectrum } from '../../../shared/spectral/spectrum';
import { UPSAMPLE_METHOD } from '../../../shared/spectral/upsample-table';
import { InvalidError } from '../../errors';
import type { ComputePool, JsonText } from '../../services/compute-pool';
import { getUpsampleTable, getUpsampleTableGzip } from '../../services/upsample-table';
import { simulateJob } from './simulate.job';

const round = (s: Spectrum) => Array.from(s.values, (v) => Number(v.toPrecision(6)));

let libraryView: LibraryView | null = null;

/** The built-in library with curves (computed once). */
export function libraryListing(): LibraryView {
  libraryView ??= {
    grid: { ...GRID_SHAPE },
    items: [
      ...LIBRARY_LIGHTS.map((i) => ({ ...i, kind: 'light' as const, values: round(resolveLight({ id: i.id })) })),
      ...LIBRARY_FILTERS.map((i) => ({ ...i, kind: 'filter' as const, values: round(resolveFilter({ id: i.id })) })),
      ...LIBRARY_MEDIA.map((i) => ({ ...i, kind: 'medium' as const, values: round(resolveMedium({ id: i.id })) })),
    ].map(({ id, kind, name, description, generic, note, definition, values }) => ({ id, kind, name, description, generic, note, definition, values })),
    upsample: { name: UPSAMPLE_METHOD.name, source: UPSAMPLE_METHOD.source, version: UPSAMPLE_METHOD.version, resolution: UPSAMPLE_METHOD.resolution },
  };
  return libraryView;
}

/** The work a simulation asks for, for fair use (middleware/fair-use.ts): its swatches. */
export function simulationWork(request: SimulateRequest): number {
  return request.swatches.length;
}

/**
 * Runs a validated simulate request in the compute pool (the engine's `simulate`, in a worker thread) and
 * answers its JSON text; engine input errors → InvalidError with the field path.
 */
export async function runSimulation(pool: ComputePool, dataDir: string, request: SimulateRequest): Promise<JsonText> {
  const needsTable = request.swatches.some((s) => s.reflectance === undefined);
  const table = needsTable ? await getUpsampleTable(dataDir) : null;
  try {
    return await pool.runJson(simulateJob, request, { table });
  } catch (err) {
    if (err instanceof SpectralInputError) throw new InvalidError(err.message, err.field);
    throw err;
  }
}

/** The estimate's table for the browser: its compact form, gzip-compressed. */
export function upsampleTableGzip(dataDir: string): Promise<Buffer> {
  return getUpsampleTableGzip(dataDir);
}
