import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Member } from './types';
import { apiPaths } from '../../../lib/paths';

export const getMembers = (pid: number) => api.get<{ members: Member[] }>(apiPaths.production(pid).members());
export const membersQueryOptions = (pid: number) => queryOptions({ queryKey: ['productions', pid, 'members'], queryFn: () => getMembers(pid) });
export const useMembers = (pid: number) => useQuery(membersQueryOptions(pid));
