import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { CurveUpdateInput, CurveView } from '../../../../shared/schemas/curve';
import { curvesQueryOptions } from './get-curves';
import { apiPaths } from '../../../lib/paths';

export const updateCurve = ({ pid, id, ...input }: CurveUpdateInput & { pid: number; id: number }) => api.patch<{ curve: CurveView }>(apiPaths.production(pid).curve(id), input);
export function useUpdateCurve(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateCurve, onSuccess: () => qc.invalidateQueries({ queryKey: curvesQueryOptions(pid).queryKey }) });
}
