import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SignInInput } from '../../../../shared/schemas/auth';
import { meQueryOptions } from './get-me';
import { apiPaths } from '../../../lib/paths';

export const signIn = (input: SignInInput) => api.post<{ user: { id: number; email: string; name: string } }>(apiPaths.auth.signIn(), input);
export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: signIn, onSuccess: () => qc.invalidateQueries({ queryKey: meQueryOptions().queryKey }) });
}
