import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { swatchesQueryOptions } from './get-swatches';
import { apiPaths } from '../../../lib/paths';

export const deleteSwatch = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(apiPaths.production(pid).swatch(id).root());
export function useDeleteSwatch(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteSwatch, onSuccess: () => qc.invalidateQueries({ queryKey: swatchesQueryOptions(pid).queryKey }) });
}
