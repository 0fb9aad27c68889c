import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { RenderStatus } from '../../../../shared/schemas/photo';
import { apiPaths } from '../../../lib/paths';

export const getRender = (pid: number, photoId: number, key: string) => api.get<{ render: RenderStatus }>(apiPaths.production(pid).photo(photoId).render(key));
/** Polls every 250 ms while the render is queued or running. */
export const renderQueryOptions = (pid: number, photoId: number, key: string) =>
  queryOptions({
    queryKey: ['productions', pid, 'photos', photoId, 'renders', key],
    queryFn: () => getRender(pid, photoId, key),
    enabled: pid > 0 && photoId > 0 && !!key,
    refetchInterval: (q) => {
      const s = q.state.data?.render.status;
      return s === 'done' || s === 'failed' ? false : 250;
    },
  });
export const useRender = (pid: number, photoId: number, key: string) => useQuery(renderQueryOptions(pid, photoId, key));
