import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SessionInfo } from '../../../../shared/schemas/auth';
import { apiPaths } from '../../../lib/paths';

export const getSessions = () => api.get<{ sessions: SessionInfo[] }>(apiPaths.auth.sessions());
export const sessionsQueryOptions = () => queryOptions({ queryKey: ['auth', 'sessions'], queryFn: getSessions });
export const useSessions = () => useQuery(sessionsQueryOptions());
