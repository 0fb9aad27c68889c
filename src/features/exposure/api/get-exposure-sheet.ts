import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ExposureSheet } from '../../../../shared/schemas/sheet';
import { apiPaths } from '../../../lib/paths';

export const getExposureSheet = (pid: number, lookId: number) => api.get<{ sheet: ExposureSheet }>(apiPaths.production(pid).look(lookId).sheet());
export const exposureSheetQueryOptions = (pid: number, lookId: number) =>
  queryOptions({ queryKey: ['productions', pid, 'looks', lookId, 'sheet'], queryFn: () => getExposureSheet(pid, lookId), enabled: pid > 0 && lookId > 0 });
export const useExposureSheet = (pid: number, lookId: number) => useQuery(exposureSheetQueryOptions(pid, lookId));
/** The PDF of the same sheet (a plain download link: the session cookie goes with it). */
export const exposureSheetPdfUrl = (pid: number, lookId: number) => apiPaths.production(pid).look(lookId).sheetPdf();
