import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { AcceptInvitationInput } from '../../../../shared/schemas/auth';
import { meQueryOptions } from './get-me';

export const acceptInvitation = ({ token, ...input }: AcceptInvitationInput & { token: string }) =>
  api.post<{ productionId: number }>(`/api/invitations/${encodeURIComponent(token)}/accept`, input);
export function useAcceptInvitation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: acceptInvitation, onSuccess: () => qc.invalidateQueries({ queryKey: meQueryOptions().queryKey }) });
}
