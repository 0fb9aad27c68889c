import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookView } from '../../../../shared/schemas/look';
import { apiPaths } from '../../../lib/paths';

export const getLooks = (pid: number) => api.get<{ looks: LookView[] }>(apiPaths.production(pid).looks());
export const looksQueryOptions = (pid: number) => queryOptions({ queryKey: ['productions', pid, 'looks'], queryFn: () => getLooks(pid), enabled: pid > 0 });
export const useLooks = (pid: number) => useQuery(looksQueryOptions(pid));
