import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { boardsQueryOptions } from './get-boards';

export const deleteBoard = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(`/api/productions/${pid}/boards/${id}`);
export function useDeleteBoard(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteBoard, onSuccess: () => qc.invalidateQueries({ queryKey: boardsQueryOptions(pid).queryKey }) });
}
