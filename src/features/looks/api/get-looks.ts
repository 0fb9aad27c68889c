import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookView } from '../../../../shared/schemas/look';

export const getLooks = (pid: number) => api.get<{ looks: LookView[] }>(`/api/productions/${pid}/looks`);
export const looksQueryOptions = (pid: number) => queryOptions({ queryKey: ['productions', pid, 'looks'], queryFn: () => getLooks(pid), enabled: pid > 0 });
export const useLooks = (pid: number) => useQuery(looksQueryOptions(pid));
