import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PhotoLookView } from '../../../../shared/schemas/photo';

/** A saved look resolved to spectra for the live preview (POST, since unsaved looks go the same way). */
export const getPhotoLook = (pid: number, lookId: number) => api.post<{ look: PhotoLookView }>(`/api/productions/${pid}/photo-looks`, { lookId });
export const photoLookQueryOptions = (pid: number, lookId: number) =>
  queryOptions({ queryKey: ['productions', pid, 'photo-looks', lookId], queryFn: () => getPhotoLook(pid, lookId), enabled: pid > 0 && lookId > 0, staleTime: 60_000 });
export const usePhotoLook = (pid: number, lookId: number) => useQuery(photoLookQueryOptions(pid, lookId));
