import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { swatchesQueryOptions } from './get-swatches';

export const deleteSwatch = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(`/api/productions/${pid}/swatches/${id}`);
export function useDeleteSwatch(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteSwatch, onSuccess: () => qc.invalidateQueries({ queryKey: swatchesQueryOptions(pid).queryKey }) });
}
