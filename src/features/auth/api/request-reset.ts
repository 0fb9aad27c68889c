import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export const requestReset = (input: { email: string }) => api.post<{ ok: true; message: string }>('/api/auth/reset/request', input);
export const useRequestReset = () => useMutation({ mutationFn: requestReset });
