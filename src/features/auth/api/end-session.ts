import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { sessionsQueryOptions } from './get-sessions';
import { apiPaths } from '../../../lib/paths';

/** Ends one of the user's other sessions (signs that browser out). */
export const endSession = (id: string) => api.delete<void>(apiPaths.auth.session(id));
export function useEndSession() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: endSession, onSettled: () => qc.invalidateQueries({ queryKey: sessionsQueryOptions().queryKey }) });
}
