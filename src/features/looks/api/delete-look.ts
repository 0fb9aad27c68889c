import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { looksQueryOptions } from './get-looks';
import { apiPaths } from '../../../lib/paths';

export const deleteLook = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(apiPaths.production(pid).look(id).root());
export function useDeleteLook(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteLook, onSuccess: () => qc.invalidateQueries({ queryKey: looksQueryOptions(pid).queryKey }) });
}
