import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookTones } from '../../../../shared/schemas/board';
import { swatchQueryOptions } from './get-swatch';
import { apiPaths } from '../../../lib/paths';

export interface SwatchTonesAnswer {
  swatchId: number;
  looks: LookTones[];
}
export const getSwatchTones = (pid: number, id: number) => api.get<SwatchTonesAnswer>(apiPaths.production(pid).swatch(id).tones());
export const swatchTonesQueryOptions = (pid: number, id: number) =>
  queryOptions({ queryKey: [...swatchQueryOptions(pid, id).queryKey, 'tones'], queryFn: () => getSwatchTones(pid, id), enabled: pid > 0 && id > 0 });
export const useSwatchTones = (pid: number, id: number) => useQuery(swatchTonesQueryOptions(pid, id));
