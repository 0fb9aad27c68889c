import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookUpdateInput, LookView } from '../../../../shared/schemas/look';
import { looksQueryOptions } from './get-looks';
import { apiPaths } from '../../../lib/paths';

export const updateLook = ({ pid, id, ...input }: LookUpdateInput & { pid: number; id: number }) => api.patch<{ look: LookView }>(apiPaths.production(pid).look(id).root(), input);
export function useUpdateLook(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateLook, onSuccess: () => qc.invalidateQueries({ queryKey: looksQueryOptions(pid).queryKey }) });
}
