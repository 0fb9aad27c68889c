import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { MembershipUpdateInput } from '../../../../shared/schemas/auth';
import type { Member } from './types';
import { membersQueryOptions } from './get-members';
import { apiPaths } from '../../../lib/paths';

export const updateMember = ({ pid, id, ...input }: MembershipUpdateInput & { pid: number; id: number }) =>
  api.patch<{ member: Member }>(apiPaths.production(pid).member(id), input);
export function useUpdateMember(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateMember, onSuccess: () => qc.invalidateQueries({ queryKey: membersQueryOptions(pid).queryKey }) });
}
