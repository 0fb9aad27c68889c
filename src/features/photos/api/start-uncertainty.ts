import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PhotoLookRequestInput, UncertaintyStatus } from '../../../../shared/schemas/photo';
import { apiPaths } from '../../../lib/paths';

/** Starts (or finds) the uncertainty table of a look: 202 while it builds, 200 when it is done already. */
export const startUncertainty = (pid: number, choice: PhotoLookRequestInput) =>
  api.post<{ uncertainty: UncertaintyStatus }>(apiPaths.production(pid).photoUncertainty(), choice);

/**
 * As a query (the request starts or finds the same table, so repeating it is harmless): one per look
 * choice, kept while the page is open; poll `uncertaintyQueryOptions` with its key until it is done.
 */
export const startUncertaintyQueryOptions = (pid: number, choice: PhotoLookRequestInput | null) =>
  queryOptions({
    queryKey: ['productions', pid, 'photo-uncertainty', 'start', choice],
    queryFn: () => startUncertainty(pid, choice!),
    enabled: pid > 0 && choice !== null,
    staleTime: Infinity,
    retry: false,
  });
export const useStartUncertainty = (pid: number, choice: PhotoLookRequestInput | null) => useQuery(startUncertaintyQueryOptions(pid, choice));
