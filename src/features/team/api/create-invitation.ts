import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { InvitationCreateInput } from '../../../../shared/schemas/auth';
import type { Invitation } from './types';
import { invitationsQueryOptions } from './get-invitations';

export const createInvitation = ({ pid, ...input }: InvitationCreateInput & { pid: number }) =>
  api.post<{ invitation: Invitation }>(`/api/productions/${pid}/invitations`, input);
export function useCreateInvitation(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createInvitation, onSuccess: () => qc.invalidateQueries({ queryKey: invitationsQueryOptions(pid).queryKey }) });
}
