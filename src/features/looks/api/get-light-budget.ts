import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { apiPaths } from '../../../lib/paths';
import type { LightBudgetAnswer, LightBudgetRequest } from '../../../../shared/schemas/look';
import { looksQueryOptions } from './get-looks';

/** POST …/looks/light-budget: the light each look needs against the first (docs/api-exposure.md). */
export const getLightBudget = (pid: number, input: LightBudgetRequest, signal?: AbortSignal) =>
  api.post<LightBudgetAnswer>(`${apiPaths.production(pid).looks()}/light-budget`, input, { signal });
/** Under the looks' key, so a changed look refreshes it; nothing is asked for an empty list. */
export const lightBudgetQueryOptions = (pid: number, input: LightBudgetRequest) =>
  queryOptions({
    queryKey: [...looksQueryOptions(pid).queryKey, 'light-budget', input],
    queryFn: ({ signal }) => getLightBudget(pid, input, signal),
    enabled: pid > 0 && input.lookIds.length > 0,
    placeholderData: keepPreviousData,
    retry: false,
  });
export const useLightBudget = (pid: number, input: LightBudgetRequest) => useQuery(lightBudgetQueryOptions(pid, input));
