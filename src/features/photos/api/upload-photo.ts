import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PhotoView } from '../../../../shared/schemas/photo';
import { photosQueryOptions } from './get-photos';
import { apiPaths } from '../../../lib/paths';

/** Multipart upload: the file in the part named `file`, an optional name. */
export function uploadPhoto({ pid, file, name }: { pid: number; file: File; name?: string }) {
  const body = new FormData();
  if (name) body.append('name', name);
  body.append('file', file);
  return api.post<{ photo: PhotoView }>(apiPaths.production(pid).photos(), body);
}
export function useUploadPhoto(pid: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: uploadPhoto, onSuccess: () => qc.invalidateQueries({ queryKey: photosQueryOptions(pid).queryKey }) });
}
