import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { BoardTones } from '../../../../shared/schemas/board';
import { boardQueryOptions } from './get-board';
import { apiPaths } from '../../../lib/paths';

export interface BoardTonesParams {
  looks?: number[];
  mergeStops?: number;
  mergeDeltaE?: number;
}
export const getBoardTones = (pid: number, id: number, p: BoardTonesParams, signal?: AbortSignal) => {
  const q = new URLSearchParams();
  if (p.looks?.length) q.set('looks', p.looks.join(','));
  if (p.mergeStops !== undefined) q.set('mergeStops', String(p.mergeStops));
  if (p.mergeDeltaE !== undefined) q.set('mergeDeltaE', String(p.mergeDeltaE));
  return api.get<{ tones: BoardTones }>(apiPaths.production(pid).board(id).tones(q), { signal });
};
/** Tones are computed on the server per request; the previous answer stays on screen while the next one loads. */
export const boardTonesQueryOptions = (pid: number, id: number, p: BoardTonesParams = {}) =>
  queryOptions({
    queryKey: [...boardQueryOptions(pid, id).queryKey, 'tones', p],
    queryFn: ({ signal }) => getBoardTones(pid, id, p, signal),
    enabled: pid > 0 && id > 0,
    placeholderData: keepPreviousData,
  });
export const useBoardTones = (pid: number, id: number, p: BoardTonesParams = {}) => useQuery(boardTonesQueryOptions(pid, id, p));
