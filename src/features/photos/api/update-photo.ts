import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PhotoUpdateInput, PhotoView } from '../../../../shared/schemas/photo';
import { photosQueryOptions } from './get-photos';
import { apiPaths } from '../../../lib/paths';

export const updatePhoto = ({ pid, id, ...input }: PhotoUpdateInput & { pid: number; id: number }) =>
  api.patch<{ photo: PhotoView }>(apiPaths.production(pid).photo(id).root(), input);
export function useUpdatePhoto(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updatePhoto, onSuccess: () => qc.invalidateQueries({ queryKey: photosQueryOptions(pid).queryKey }) });
}
