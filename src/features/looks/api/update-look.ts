import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookUpdateInput, LookView } from '../../../../shared/schemas/look';
import { looksQueryOptions } from './get-looks';

export const updateLook = ({ pid, id, ...input }: LookUpdateInput & { pid: number; id: number }) => api.patch<{ look: LookView }>(`/api/productions/${pid}/looks/${id}`, input);
export function useUpdateLook(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateLook, onSuccess: () => qc.invalidateQueries({ queryKey: looksQueryOptions(pid).queryKey }) });
}
