import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookView } from '../../../../shared/schemas/look';
import { looksQueryOptions } from './get-looks';
import { apiPaths } from '../../../lib/paths';

export const duplicateLook = ({ pid, id, name }: { pid: number; id: number; name?: string }) =>
  api.post<{ look: LookView }>(apiPaths.production(pid).look(id).duplicate(), name ? { name } : {});
export function useDuplicateLook(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: duplicateLook, onSuccess: () => qc.invalidateQueries({ queryKey: looksQueryOptions(pid).queryKey }) });
}
