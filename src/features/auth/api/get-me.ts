import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { MeResponse } from '../../../../shared/schemas/auth';

export const getMe = () => api.get<MeResponse>('/api/auth/me');
export const meQueryOptions = () => queryOptions({ queryKey: ['auth', 'me'], queryFn: getMe, staleTime: 60_000 });
export const useMe = () => useQuery(meQueryOptions());
