import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { sessionsQueryOptions } from './get-sessions';
import { apiPaths } from '../../../lib/paths';

/** Ends every session of the user but this one ("sign out everywhere else"). */
export const endOtherSessions = () => api.post<{ ended: number }>(apiPaths.auth.endOtherSessions());
export function useEndOtherSessions() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: endOtherSessions, onSettled: () => qc.invalidateQueries({ queryKey: sessionsQueryOptions().queryKey }) });
}
