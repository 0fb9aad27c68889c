import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ResetConfirmInput } from '../../../../shared/schemas/auth';

export const confirmReset = (input: ResetConfirmInput) => api.post<{ ok: true; email: string }>('/api/auth/reset/confirm', input);
export const useConfirmReset = () => useMutation({ mutationFn: confirmReset });
