import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { invitationsQueryOptions } from './get-invitations';

export const revokeInvitation = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(`/api/productions/${pid}/invitations/${id}`);
export function useRevokeInvitation(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: revokeInvitation, onSuccess: () => qc.invalidateQueries({ queryKey: invitationsQueryOptions(pid).queryKey }) });
}
