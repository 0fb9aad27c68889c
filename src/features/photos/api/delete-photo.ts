import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { photosQueryOptions } from './get-photos';

export const deletePhoto = ({ pid, id }: { pid: number; id: number }) => api.delete<void>(`/api/productions/${pid}/photos/${id}`);
export function useDeletePhoto(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deletePhoto, onSuccess: () => qc.invalidateQueries({ queryKey: photosQueryOptions(pid).queryKey }) });
}
