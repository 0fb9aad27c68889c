import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { curvesQueryOptions } from './get-curves';
import { apiPaths } from '../../../lib/paths';

export const deleteCurve = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(apiPaths.production(pid).curve(id));
export function useDeleteCurve(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteCurve, onSuccess: () => qc.invalidateQueries({ queryKey: curvesQueryOptions(pid).queryKey }) });
}
