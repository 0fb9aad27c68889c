import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SwatchUpdateInput, SwatchView } from '../../../../shared/schemas/swatch';
import { swatchesQueryOptions } from './get-swatches';

export const updateSwatch = ({ pid, id, ...input }: SwatchUpdateInput & { pid: number; id: number }) =>
  api.patch<{ swatch: SwatchView }>(`/api/productions/${pid}/swatches/${id}`, input);
export function useUpdateSwatch(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateSwatch, onSuccess: () => qc.invalidateQueries({ queryKey: swatchesQueryOptions(pid).queryKey }) });
}
