import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookView } from '../../../../shared/schemas/look';
import { looksQueryOptions } from './get-looks';

export const duplicateLook = ({ pid, id, name }: { pid: number; id: number; name?: string }) =>
  api.post<{ look: LookView }>(`/api/productions/${pid}/looks/${id}/duplicate`, name ? { name } : {});
export function useDuplicateLook(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: duplicateLook, onSuccess: () => qc.invalidateQueries({ queryKey: looksQueryOptions(pid).queryKey }) });
}
