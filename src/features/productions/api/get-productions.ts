import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ProductionSummary } from './types';

export const getProductions = () => api.get<{ productions: ProductionSummary[] }>('/api/productions');
export const productionsQueryOptions = () => queryOptions({ queryKey: ['productions'], queryFn: getProductions });
export const useProductions = () => useQuery(productionsQueryOptions());
