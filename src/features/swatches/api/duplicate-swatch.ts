import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import { swatchesQueryOptions } from './get-swatches';
import { apiPaths } from '../../../lib/paths';

/** A copy of a swatch (its colour or parameters, notes, department and light), named "… (copy)" by the server. */
export const duplicateSwatch = ({ pid, id, name }: { pid: number; id: number; name?: string }) =>
  api.post<{ swatch: SwatchView }>(apiPaths.production(pid).swatch(id).duplicate(), name ? { name } : {});
export function useDuplicateSwatch(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: duplicateSwatch, onSuccess: () => qc.invalidateQueries({ queryKey: swatchesQueryOptions(pid).queryKey }) });
}
