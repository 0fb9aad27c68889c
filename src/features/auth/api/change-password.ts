import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ChangePasswordInput } from '../../../../shared/schemas/auth';
import { sessionsQueryOptions } from './get-sessions';
import { apiPaths } from '../../../lib/paths';

/** Changes the password; the server ends the other sessions and answers this one's fresh CSRF token (the api client keeps it). */
export const changePassword = (input: ChangePasswordInput) => api.post<{ ok: true; csrfToken: string }>(apiPaths.auth.password(), input);
export function useChangePassword() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: changePassword, onSuccess: () => qc.invalidateQueries({ queryKey: sessionsQueryOptions().queryKey }) });
}
