import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { InvitationCreateInput } from '../../../../shared/schemas/auth';
import type { Invitation } from './types';
import { invitationsQueryOptions } from './get-invitations';
import { apiPaths } from '../../../lib/paths';

export const createInvitation = ({ pid, ...input }: InvitationCreateInput & { pid: number }) =>
  api.post<{ invitation: Invitation }>(apiPaths.production(pid).invitations(), input);
export function useCreateInvitation(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createInvitation, onSuccess: () => qc.invalidateQueries({ queryKey: invitationsQueryOptions(pid).queryKey }) });
}
