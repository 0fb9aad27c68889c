import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ResetConfirmInput } from '../../../../shared/schemas/auth';
import { apiPaths } from '../../../lib/paths';

export const confirmReset = (input: ResetConfirmInput) => api.post<{ ok: true; email: string }>(apiPaths.auth.resetConfirm(), input);
export const useConfirmReset = () => useMutation({ mutationFn: confirmReset });
