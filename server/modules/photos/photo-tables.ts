import { getUpsampleTable } from '../../services/upsample-table';
import { nodeReflectances } from '../../../shared/photo/node-reflectances';
import type { UpsampleTable } from '../../../shared/spectral/upsample-table';

/** The upsampling table and its node spectra (about 32 MB, computed once per process). */
export interface PhotoTables {
  upsample: UpsampleTable;
  reflectances: Float32Array;
}

let cached: { upsample: UpsampleTable; reflectances: Float32Array } | null = null;

/** The tables photo looks are built from (the upsampling table is the server's shared one). */
export async function getPhotoTables(dataDir: string): Promise<PhotoTables> {
  const upsample = await getUpsampleTable(dataDir);
  if (!cached || cached.upsample !== upsample) cached = { upsample, reflectances: nodeReflectances(upsample) };
  return cached;
}
