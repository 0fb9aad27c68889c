import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { AcceptInvitationInput } from '../../../../shared/schemas/auth';
import { meQueryOptions } from './get-me';
import { apiPaths } from '../../../lib/paths';

export const acceptInvitation = ({ token, ...input }: AcceptInvitationInput & { token: string }) =>
  api.post<{ productionId: number }>(apiPaths.invitation(token).accept(), input);
export function useAcceptInvitation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: acceptInvitation, onSuccess: () => qc.invalidateQueries({ queryKey: meQueryOptions().queryKey }) });
}
