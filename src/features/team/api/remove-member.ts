import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { membersQueryOptions } from './get-members';

export const removeMember = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(`/api/productions/${pid}/members/${id}`);
export function useRemoveMember(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: removeMember, onSuccess: () => qc.invalidateQueries({ queryKey: membersQueryOptions(pid).queryKey }) });
}
