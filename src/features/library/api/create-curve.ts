import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { CurveCreateInput, CurveView } from '../../../../shared/schemas/curve';
import { curvesQueryOptions } from './get-curves';
import { apiPaths } from '../../../lib/paths';

export const createCurve = ({ pid, ...input }: CurveCreateInput & { pid: number }) => api.post<{ curve: CurveView }>(apiPaths.production(pid).curves(), input);
export function useCreateCurve(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createCurve, onSuccess: () => qc.invalidateQueries({ queryKey: curvesQueryOptions(pid).queryKey }) });
}
