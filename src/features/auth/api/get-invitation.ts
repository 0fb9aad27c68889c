import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { apiPaths } from '../../../lib/paths';

export interface InvitationInfo {
  email: string;
  role: string;
  department: string;
  production: { id: number; name: string };
  hasAccount: boolean;
  expiresAt: string;
}
export const getInvitation = (token: string) => api.get<{ invitation: InvitationInfo }>(apiPaths.invitation(token).root());
export const invitationQueryOptions = (token: string) => queryOptions({ queryKey: ['invitation', token], queryFn: () => getInvitation(token) });
export const useInvitation = (token: string) => useQuery(invitationQueryOptions(token));
