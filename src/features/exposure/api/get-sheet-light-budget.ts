import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { apiPaths } from '../../../lib/paths';
import { MAX_LIGHT_BUDGET_LOOKS, type LightBudgetAnswer, type LookView } from '../../../../shared/schemas/look';

export interface SheetCamera { tStop: number; fps: number; shutterAngle: number }

/**
 * The light budget a sheet shows: every look of the production in id order (the first is the reference;
 * past the limit, the reference, this look and the next ones), at the sheet's own camera, through
 * POST …/looks/light-budget (docs/api-exposure.md).
 */
export async function getSheetLightBudget(pid: number, lookId: number, camera: SheetCamera, signal?: AbortSignal): Promise<LightBudgetAnswer> {
  const looks = (await api.get<{ looks: LookView[] }>(apiPaths.production(pid).looks(), { signal })).looks.map((l) => l.id).sort((a, b) => a - b);
  const lookIds = looks.length <= MAX_LIGHT_BUDGET_LOOKS ? looks : [...new Set([looks[0], lookId, ...looks])].slice(0, MAX_LIGHT_BUDGET_LOOKS).sort((a, b) => a - b);
  return api.post<LightBudgetAnswer>(`${apiPaths.production(pid).looks()}/light-budget`, { lookIds, ...camera }, { signal });
}
export const sheetLightBudgetQueryOptions = (pid: number, lookId: number, camera: SheetCamera) =>
  queryOptions({
    queryKey: ['productions', pid, 'looks', 'light-budget', 'sheet', lookId, camera],
    queryFn: ({ signal }) => getSheetLightBudget(pid, lookId, camera, signal),
    enabled: pid > 0 && lookId > 0,
    retry: false,
  });
export const useSheetLightBudget = (pid: number, lookId: number, camera: SheetCamera) => useQuery(sheetLightBudgetQueryOptions(pid, lookId, camera));
