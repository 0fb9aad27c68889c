import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ExposureSheet } from '../../../../shared/schemas/sheet';
import { apiPaths } from '../../../lib/paths';

/** `?boards=1,2` when boards are picked (an empty pick lists no board); nothing for the boards that show the look. */
const boardsQuery = (boards?: readonly number[]) => (boards ? `?boards=${boards.join(',')}` : '');

export const getExposureSheet = (pid: number, lookId: number, boards?: readonly number[]) =>
  api.get<{ sheet: ExposureSheet }>(`${apiPaths.production(pid).look(lookId).sheet()}${boardsQuery(boards)}`);
export const exposureSheetQueryOptions = (pid: number, lookId: number, boards?: readonly number[]) =>
  queryOptions({
    queryKey: ['productions', pid, 'looks', lookId, 'sheet', boards ? boards.join(',') : 'shown'],
    queryFn: () => getExposureSheet(pid, lookId, boards),
    enabled: pid > 0 && lookId > 0,
    placeholderData: keepPreviousData,
  });
export const useExposureSheet = (pid: number, lookId: number, boards?: readonly number[]) => useQuery(exposureSheetQueryOptions(pid, lookId, boards));
/** The PDF of the same sheet (a plain download link: the session cookie goes with it). */
export const exposureSheetPdfUrl = (pid: number, lookId: number, boards?: readonly number[]) => `${apiPaths.production(pid).look(lookId).sheetPdf()}${boardsQuery(boards)}`;
