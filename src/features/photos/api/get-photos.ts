import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PhotoView } from '../../../../shared/schemas/photo';
import { apiPaths } from '../../../lib/paths';

export const getPhotos = (pid: number) => api.get<{ photos: PhotoView[] }>(apiPaths.production(pid).photos());
export const photosQueryOptions = (pid: number) => queryOptions({ queryKey: ['productions', pid, 'photos'], queryFn: () => getPhotos(pid), enabled: pid > 0 });
export const usePhotos = (pid: number) => useQuery(photosQueryOptions(pid));
