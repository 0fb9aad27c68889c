import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookView } from '../../../../shared/schemas/look';
import type { ExposureSheet } from '../../../../shared/schemas/sheet';
import { apiPaths } from '../../../lib/paths';

/** The production's looks, for the plan's look chooser (the same query as the Looks page). */
export const getPlanLooks = (pid: number) => api.get<{ looks: LookView[] }>(apiPaths.production(pid).looks());
export const planLooksQueryOptions = (pid: number) => queryOptions({ queryKey: ['productions', pid, 'looks'], queryFn: () => getPlanLooks(pid), enabled: pid > 0 });
export const usePlanLooks = (pid: number) => useQuery(planLooksQueryOptions(pid));

/**
 * A look's exposure sheet (the same query as the sheet page): its effective EI worked out from the
 * look's analysis (box speed, rating and filter factor), its camera and its shadow-detail threshold.
 */
export const getPlanSheet = (pid: number, lookId: number) => api.get<{ sheet: ExposureSheet }>(apiPaths.production(pid).look(lookId).sheet());
export const planSheetQueryOptions = (pid: number, lookId: number | null) =>
  queryOptions({
    queryKey: ['productions', pid, 'looks', lookId ?? 0, 'sheet'],
    queryFn: () => getPlanSheet(pid, lookId!),
    enabled: pid > 0 && lookId !== null && lookId > 0,
  });
export const usePlanSheet = (pid: number, lookId: number | null) => useQuery(planSheetQueryOptions(pid, lookId));
