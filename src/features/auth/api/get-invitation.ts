import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export interface InvitationInfo {
  email: string;
  role: string;
  department: string;
  production: { id: number; name: string };
  hasAccount: boolean;
  expiresAt: string;
}
export const getInvitation = (token: string) => api.get<{ invitation: InvitationInfo }>(`/api/invitations/${encodeURIComponent(token)}`);
export const invitationQueryOptions = (token: string) => queryOptions({ queryKey: ['invitation', token], queryFn: () => getInvitation(token) });
export const useInvitation = (token: string) => useQuery(invitationQueryOptions(token));
