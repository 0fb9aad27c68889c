import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { photosQueryOptions } from './get-photos';
import { apiPaths } from '../../../lib/paths';

export const deletePhoto = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(apiPaths.production(pid).photo(id).root());
export function useDeletePhoto(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deletePhoto, onSuccess: () => qc.invalidateQueries({ queryKey: photosQueryOptions(pid).queryKey }) });
}
