import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { looksQueryOptions } from './get-looks';

export const deleteLook = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(`/api/productions/${pid}/looks/${id}`);
export function useDeleteLook(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteLook, onSuccess: () => qc.invalidateQueries({ queryKey: looksQueryOptions(pid).queryKey }) });
}
