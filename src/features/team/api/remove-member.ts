import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { membersQueryOptions } from './get-members';
import { apiPaths } from '../../../lib/paths';

export const removeMember = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(apiPaths.production(pid).member(id));
export function useRemoveMember(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: removeMember, onSuccess: () => qc.invalidateQueries({ queryKey: membersQueryOptions(pid).queryKey }) });
}
