import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ProductionCreateInput } from '../../../../shared/schemas/auth';
import type { ProductionSummary } from './types';
import { productionsQueryOptions } from './get-productions';
import { apiPaths } from '../../../lib/paths';

export const updateProduction = ({ id, ...input }: Partial<ProductionCreateInput> & { id: number }) =>
  api.patch<{ production: ProductionSummary }>(apiPaths.production(id).root(), input);
export function useUpdateProduction() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateProduction, onSuccess: () => qc.invalidateQueries({ queryKey: productionsQueryOptions().queryKey }) });
}
