import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SetupInput } from '../../../../shared/schemas/auth';
import { meQueryOptions } from './get-me';
import { apiPaths } from '../../../lib/paths';

export const setup = (input: SetupInput) => api.post<{ user: { id: number } }>(apiPaths.auth.setup(), input);
export function useSetup() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: setup, onSuccess: () => qc.invalidateQueries({ queryKey: meQueryOptions().queryKey }) });
}
