import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { apiPaths } from '../../../lib/paths';

export const requestReset = (input: { email: string }) => api.post<{ ok: true; message: string }>(apiPaths.auth.resetRequest(), input);
export const useRequestReset = () => useMutation({ mutationFn: requestReset });
