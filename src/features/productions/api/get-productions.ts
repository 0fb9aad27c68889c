import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ProductionSummary } from './types';
import { apiPaths } from '../../../lib/paths';

export const getProductions = () => api.get<{ productions: ProductionSummary[] }>(apiPaths.productions());
export const productionsQueryOptions = () => queryOptions({ queryKey: ['productions'], queryFn: getProductions });
export const useProductions = () => useQuery(productionsQueryOptions());
