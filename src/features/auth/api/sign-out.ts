import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, setCsrfToken } from '../../../lib/api-client';

export const signOut = () => api.post<{ ok: true }>('/api/auth/sign-out');
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
