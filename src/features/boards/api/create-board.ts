import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { BoardCreateInput, BoardView } from '../../../../shared/schemas/board';
import { boardsQueryOptions } from './get-boards';
import { apiPaths } from '../../../lib/paths';

export const createBoard = ({ pid, ...input }: BoardCreateInput & { pid: number }) => api.post<{ board: BoardView }>(apiPaths.production(pid).boards(), input);
export function useCreateBoard(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createBoard, onSuccess: () => qc.invalidateQueries({ queryKey: boardsQueryOptions(pid).queryKey }) });
}
