import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { UncertaintyStatus } from '../../../../shared/schemas/photo';
import { apiPaths } from '../../../lib/paths';

export const getUncertainty = (pid: number, key: string) => api.get<{ uncertainty: UncertaintyStatus }>(apiPaths.production(pid).photoUncertaintyStatus(key));
/** Polls every 300 ms while the table is building; stops once it is done or failed. */
export const uncertaintyQueryOptions = (pid: number, key: string, enabled = true) =>
  queryOptions({
    queryKey: ['productions', pid, 'photo-uncertainty', key],
    queryFn: () => getUncertainty(pid, key),
    enabled: enabled && pid > 0 && !!key,
    staleTime: Infinity,
    refetchInterval: (q) => {
      const s = q.state.data?.uncertainty.status;
      return s === 'done' || s === 'failed' ? false : 300;
    },
  });
export const useUncertainty = (pid: number, key: string, enabled = true) => useQuery(uncertaintyQueryOptions(pid, key, enabled));
