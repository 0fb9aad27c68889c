import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ProductionSummary } from './types';
import { apiPaths } from '../../../lib/paths';

export const getProduction = (id: number) => api.get<{ production: ProductionSummary }>(apiPaths.production(id).root());
export const productionQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['productions', id], queryFn: () => getProduction(id), enabled: id > 0 });
export const useProduction = (id: number) => useQuery(productionQueryOptions(id));
