import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SwatchCreateInput, SwatchView } from '../../../../shared/schemas/swatch';
import { swatchesQueryOptions } from './get-swatches';
import { apiPaths } from '../../../lib/paths';

export const createSwatch = ({ pid, ...input }: SwatchCreateInput & { pid: number }) => api.post<{ swatch: SwatchView }>(apiPaths.production(pid).swatches(), input);
export function useCreateSwatch(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createSwatch, onSuccess: () => qc.invalidateQueries({ queryKey: swatchesQueryOptions(pid).queryKey }) });
}
