import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { boardsQueryOptions } from './get-boards';
import { apiPaths } from '../../../lib/paths';

export const deleteBoard = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(apiPaths.production(pid).board(id).root());
export function useDeleteBoard(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteBoard, onSuccess: () => qc.invalidateQueries({ queryKey: boardsQueryOptions(pid).queryKey }) });
}
