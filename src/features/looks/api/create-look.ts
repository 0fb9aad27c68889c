import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookCreateInput, LookView } from '../../../../shared/schemas/look';
import { looksQueryOptions } from './get-looks';
import { apiPaths } from '../../../lib/paths';

export const createLook = ({ pid, ...input }: LookCreateInput & { pid: number }) => api.post<{ look: LookView }>(apiPaths.production(pid).looks(), input);
export function useCreateLook(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createLook, onSuccess: () => qc.invalidateQueries({ queryKey: looksQueryOptions(pid).queryKey }) });
}
