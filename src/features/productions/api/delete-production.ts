import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { productionsQueryOptions } from './get-productions';
import { apiPaths } from '../../../lib/paths';

export const deleteProduction = (id: number) => api.delete<void>(apiPaths.production(id).root());
export function useDeleteProduction() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteProduction, onSuccess: () => qc.invalidateQueries({ queryKey: productionsQueryOptions().queryKey }) });
}
