import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { apiPaths } from '../../../lib/paths';
import type { ActivityKind, ActivityPage } from '../../../../shared/schemas/activity';

/** What the page filters the log by (the API also takes `actor`, a user id). */
export interface ActivityFilter {
  kind?: ActivityKind;
  actor?: number;
}

export const getActivity = (pid: number, filter: ActivityFilter, before?: number) =>
  api.get<ActivityPage>(apiPaths.production(pid).activity({ ...filter, before }));

/**
 * The log as pages, newest first; each next page starts below the last entry shown ("Older").
 * Always stale: any write anywhere in the production adds to it.
 */
export const activityQueryOptions = (pid: number, filter: ActivityFilter = {}) =>
  infiniteQueryOptions({
    queryKey: ['productions', pid, 'activity', filter],
    queryFn: ({ pageParam }) => getActivity(pid, filter, pageParam),
    initialPageParam: undefined as number | undefined,
    getNextPageParam: (last) => last.next ?? undefined,
    staleTime: 0,
  });

export const useActivity = (pid: number, filter: ActivityFilter, enabled = true) =>
  useInfiniteQuery({ ...activityQueryOptions(pid, filter), enabled });
