import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { BoardUpdateInput, BoardView } from '../../../../shared/schemas/board';
import { boardsQueryOptions } from './get-boards';
import { apiPaths } from '../../../lib/paths';

export const updateBoard = ({ pid, id, ...input }: BoardUpdateInput & { pid: number; id: number }) =>
  api.patch<{ board: BoardView }>(apiPaths.production(pid).board(id).root(), input);
export function useUpdateBoard(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateBoard, onSuccess: () => qc.invalidateQueries({ queryKey: boardsQueryOptions(pid).queryKey }) });
}
