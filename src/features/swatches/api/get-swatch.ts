import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import { swatchesQueryOptions } from './get-swatches';
import { apiPaths } from '../../../lib/paths';

export const getSwatch = (pid: number, id: number) => api.get<{ swatch: SwatchView }>(apiPaths.production(pid).swatch(id).root());
export const swatchQueryOptions = (pid: number, id: number) =>
  queryOptions({ queryKey: [...swatchesQueryOptions(pid).queryKey, id], queryFn: () => getSwatch(pid, id), enabled: pid > 0 && id > 0 });
export const useSwatch = (pid: number, id: number) => useQuery(swatchQueryOptions(pid, id));
