import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookTones } from '../../../../shared/schemas/board';
import type { LookAnalysis, LookAnalyseInput } from '../../../../shared/schemas/look';
import { looksQueryOptions } from './get-looks';
import { apiPaths } from '../../../lib/paths';

export interface AnalyseAnswer {
  analysis: LookAnalysis;
  board: { tones: LookTones; swatches: { id: number; name: string; hex: string; estimated: boolean }[] } | null;
}
export const analyseLook = (pid: number, input: LookAnalyseInput, signal?: AbortSignal) =>
  api.post<AnalyseAnswer>(apiPaths.production(pid).analyseLook(), input, { signal });
/**
 * The analysis of an unsaved look (the bench while it is edited), computed on the server. The caller
 * debounces the input; the previous answer stays on screen while the next one is computed.
 */
export const analyseLookQueryOptions = (pid: number, input: LookAnalyseInput | null) =>
  queryOptions({
    queryKey: [...looksQueryOptions(pid).queryKey, 'analyse', input],
    queryFn: ({ signal }) => analyseLook(pid, input!, signal),
    enabled: pid > 0 && input !== null,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
    retry: false,
  });
export const useAnalyseLook = (pid: number, input: LookAnalyseInput | null) => useQuery(analyseLookQueryOptions(pid, input));
