import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { BoardView } from '../../../../shared/schemas/board';
import { apiPaths } from '../../../lib/paths';

export const getBoards = (pid: number) => api.get<{ boards: BoardView[] }>(apiPaths.production(pid).boards());
export const boardsQueryOptions = (pid: number) => queryOptions({ queryKey: ['productions', pid, 'boards'], queryFn: () => getBoards(pid), enabled: pid > 0 });
export const useBoards = (pid: number) => useQuery(boardsQueryOptions(pid));
