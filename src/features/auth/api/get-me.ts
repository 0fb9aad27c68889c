import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { MeResponse } from '../../../../shared/schemas/auth';
import { apiPaths } from '../../../lib/paths';

export const getMe = () => api.get<MeResponse>(apiPaths.auth.me());
export const meQueryOptions = () => queryOptions({ queryKey: ['auth', 'me'], queryFn: getMe, staleTime: 60_000 });
export const useMe = () => useQuery(meQueryOptions());
