import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LightPlanRequest, LightPlanResponse } from '../../../../shared/schemas/light-plan';
import { apiPaths } from '../../../lib/paths';

export const postLightPlan = (input: LightPlanRequest, signal?: AbortSignal) => api.post<LightPlanResponse>(apiPaths.lightPlan(), input, { signal });
/**
 * The lamp plan of a (valid, settled) request, computed on the server. A POST that changes nothing, read
 * as a query: the previous answer stays on screen while the next one is worked out.
 */
export const lightPlanQueryOptions = (input: LightPlanRequest | null) =>
  queryOptions({
    queryKey: ['light-plan', input],
    queryFn: ({ signal }) => postLightPlan(input!, signal),
    enabled: input !== null,
    placeholderData: keepPreviousData,
    staleTime: 5 * 60_000,
    retry: false,
  });
export const useLightPlan = (input: LightPlanRequest | null) => useQuery(lightPlanQueryOptions(input));
