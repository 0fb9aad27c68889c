import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SwatchUpdateInput, SwatchView } from '../../../../shared/schemas/swatch';
import { swatchesQueryOptions } from './get-swatches';
import { apiPaths } from '../../../lib/paths';

export const updateSwatch = ({ pid, id, ...input }: SwatchUpdateInput & { pid: number; id: number }) =>
  api.patch<{ swatch: SwatchView }>(apiPaths.production(pid).swatch(id).root(), input);
export function useUpdateSwatch(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateSwatch, onSuccess: () => qc.invalidateQueries({ queryKey: swatchesQueryOptions(pid).queryKey }) });
}
