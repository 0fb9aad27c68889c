/**
 * POST /api/simulate and the built-in library, over the spectral engine (shared/spectral).
 * Engine input errors become 400s naming the field path; see docs/api-simulate.md.
 */
import type { LibraryView, SimulateRequest, SimulateResponse } from '../../../shared/schemas/simulate';
import { resolveFilter, resolveLight, resolveMedium, simulate } from '../../../shared/spectral/compute';
import { SpectralInputError } from '../../../shared/spectral/errors';
import { LIBRARY_FILTERS, LIBRARY_LIGHTS, LIBRARY_MEDIA } from '../../../shared/spectral/library';
import { GRID_SHAPE } from '../../../shared/spectral/policy';
import type { Spectrum } from '../../../shared/spectral/spectrum';
import { UPSAMPLE_METHOD } from '../../../shared/spectral/upsample-table';
import { InvalidError } from '../../errors';
import { getUpsampleTable, getUpsampleTableGzip } from '../../services/upsample-table';

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

/** Runs a validated simulate request; engine input errors → InvalidError with the field path. */
export async function runSimulation(dataDir: string, request: SimulateRequest): Promise<SimulateResponse> {
  const needsTable = request.swatches.some((s) => s.reflectance === undefined);
  const table = needsTable ? await getUpsampleTable(dataDir) : null;
  try {
    return simulate(request, table);
  } catch (err) {
    if (err instanceof SpectralInputError) throw new InvalidError(err.message, err.field);
    throw err;
  }
}

/** The estimate's table for the browser: its compact form, gzip-compressed. */
export function upsampleTableGzip(dataDir: string): Promise<Buffer> {
  return getUpsampleTableGzip(dataDir);
}
