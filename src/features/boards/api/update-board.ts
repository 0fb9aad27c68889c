import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { BoardUpdateInput, BoardView } from '../../../../shared/schemas/board';
import { boardsQueryOptions } from './get-boards';

export const updateBoard = ({ pid, id, ...input }: BoardUpdateInput & { pid: number; id: number }) =>
  api.patch<{ board: BoardView }>(`/api/productions/${pid}/boards/${id}`, input);
export function useUpdateBoard(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateBoard, onSuccess: () => qc.invalidateQueries({ queryKey: boardsQueryOptions(pid).queryKey }) });
}
