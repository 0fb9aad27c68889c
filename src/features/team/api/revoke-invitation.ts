import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { invitationsQueryOptions } from './get-invitations';
import { apiPaths } from '../../../lib/paths';

export const revokeInvitation = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(apiPaths.production(pid).invitation(id));
export function useRevokeInvitation(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: revokeInvitation, onSuccess: () => qc.invalidateQueries({ queryKey: invitationsQueryOptions(pid).queryKey }) });
}
