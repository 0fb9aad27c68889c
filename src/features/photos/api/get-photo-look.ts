import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PhotoLookView } from '../../../../shared/schemas/photo';
import { apiPaths } from '../../../lib/paths';

/** A saved look resolved to spectra for the live preview (POST, since unsaved looks go the same way). */
export const getPhotoLook = (pid: number, lookId: number) => api.post<{ look: PhotoLookView }>(apiPaths.production(pid).photoLooks(), { lookId });
export const photoLookQueryOptions = (pid: number, lookId: number) =>
  queryOptions({ queryKey: ['productions', pid, 'photo-looks', lookId], queryFn: () => getPhotoLook(pid, lookId), enabled: pid > 0 && lookId > 0, staleTime: 60_000 });
export const usePhotoLook = (pid: number, lookId: number) => useQuery(photoLookQueryOptions(pid, lookId));
