import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { CurveView } from '../../../../shared/schemas/curve';
import { apiPaths } from '../../../lib/paths';

export const getCurves = (pid: number) => api.get<{ curves: CurveView[] }>(apiPaths.production(pid).curves());
export const curvesQueryOptions = (pid: number) => queryOptions({ queryKey: ['productions', pid, 'curves'], queryFn: () => getCurves(pid), enabled: pid > 0 });
export const useCurves = (pid: number) => useQuery(curvesQueryOptions(pid));
