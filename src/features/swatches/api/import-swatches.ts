import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SwatchImportFields, SwatchView } from '../../../../shared/schemas/swatch';
import { apiPaths } from '../../../lib/paths';
import { swatchesQueryOptions } from './get-swatches';
import { importFormData } from './preview-swatch-import';

/** One measured swatch per sample of a spectrophotometer file, on the board if one is chosen; all or nothing. */
export const importSwatches = ({ pid, file, ...fields }: SwatchImportFields & { pid: number; file: File }) =>
  api.post<{ swatches: SwatchView[] }>(apiPaths.production(pid).swatchImport(), importFormData(file, fields));
export function useImportSwatches(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: importSwatches, onSuccess: () => qc.invalidateQueries({ queryKey: swatchesQueryOptions(pid).queryKey }) });
}
