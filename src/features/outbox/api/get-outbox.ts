import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export interface OutboxMessage {
  id: number;
  to: string;
  from: string;
  subject: string;
  text: string;
  html: string;
  createdAt: string;
}
export const getOutbox = () => api.get<{ messages: OutboxMessage[] }>('/api/admin/outbox');
export const outboxQueryOptions = () => queryOptions({ queryKey: ['admin', 'outbox'], queryFn: getOutbox, refetchInterval: 5000 });
export const useOutbox = () => useQuery(outboxQueryOptions());
