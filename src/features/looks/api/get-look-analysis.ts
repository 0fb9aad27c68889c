import { queryOptions, useQuery, useQueries } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookAnalysis } from '../../../../shared/schemas/look';
import { lookQueryOptions } from './get-look';
import { apiPaths } from '../../../lib/paths';

export const getLookAnalysis = (pid: number, id: number) => api.get<{ analysis: LookAnalysis }>(apiPaths.production(pid).look(id).analysis());
export const lookAnalysisQueryOptions = (pid: number, id: number) =>
  queryOptions({ queryKey: [...lookQueryOptions(pid, id).queryKey, 'analysis'], queryFn: () => getLookAnalysis(pid, id), enabled: pid > 0 && id > 0 });
export const useLookAnalysis = (pid: number, id: number) => useQuery(lookAnalysisQueryOptions(pid, id));
/** Analyses of several looks at once (compare). */
export const useLookAnalyses = (pid: number, ids: number[]) => useQueries({ queries: ids.map((id) => lookAnalysisQueryOptions(pid, id)) });
