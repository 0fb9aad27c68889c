import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { BoardView } from '../../../../shared/schemas/board';
import { boardsQueryOptions } from './get-boards';
import { apiPaths } from '../../../lib/paths';

export const getBoard = (pid: number, id: number) => api.get<{ board: BoardView }>(apiPaths.production(pid).board(id).root());
export const boardQueryOptions = (pid: number, id: number) =>
  queryOptions({ queryKey: [...boardsQueryOptions(pid).queryKey, id], queryFn: () => getBoard(pid, id), enabled: pid > 0 && id > 0 });
export const useBoard = (pid: number, id: number) => useQuery(boardQueryOptions(pid, id));
