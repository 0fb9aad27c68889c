import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { apiPaths } from '../../../lib/paths';

export interface OutboxMessage {
  id: number;
  to: string;
  from: string;
  subject: string;
  text: string;
  html: string;
  createdAt: string;
}
export const getOutbox = () => api.get<{ messages: OutboxMessage[] }>(apiPaths.outbox());
export const outboxQueryOptions = () => queryOptions({ queryKey: ['admin', 'outbox'], queryFn: getOutbox, refetchInterval: 5000 });
export const useOutbox = () => useQuery(outboxQueryOptions());
