import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Invitation } from './types';
import { apiPaths } from '../../../lib/paths';

export const getInvitations = (pid: number) => api.get<{ invitations: Invitation[] }>(apiPaths.production(pid).invitations());
export const invitationsQueryOptions = (pid: number) =>
  queryOptions({ queryKey: ['productions', pid, 'invitations'], queryFn: () => getInvitations(pid) });
export const useInvitations = (pid: number, enabled = true) => useQuery({ ...invitationsQueryOptions(pid), enabled });
