import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, setCsrfToken } from '../../../lib/api-client';
import { apiPaths } from '../../../lib/paths';

export const signOut = () => api.post<{ ok: true }>(apiPaths.auth.signOut());
export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      setCsrfToken(null);
      qc.clear();
    },
  });
}
