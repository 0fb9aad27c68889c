import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { productionsQueryOptions } from './get-productions';

export const deleteProduction = (id: number) => api.delete<void>(`/api/productions/${id}`);
export function useDeleteProduction() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteProduction, onSuccess: () => qc.invalidateQueries({ queryKey: productionsQueryOptions().queryKey }) });
}
