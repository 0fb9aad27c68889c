import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ProductionCreateInput } from '../../../../shared/schemas/auth';
import type { ProductionSummary } from './types';
import { productionsQueryOptions } from './get-productions';
import { apiPaths } from '../../../lib/paths';

export const createProduction = (input: ProductionCreateInput) => api.post<{ production: ProductionSummary }>(apiPaths.productions(), input);
export function useCreateProduction() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createProduction, onSuccess: () => qc.invalidateQueries({ queryKey: productionsQueryOptions().queryKey }) });
}
