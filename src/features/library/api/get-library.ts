import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LibraryView, LibraryItemView } from '../../../../shared/schemas/simulate';
import { apiPaths } from '../../../lib/paths';

export type { LibraryView, LibraryItemView };
export const getLibrary = () => api.get<LibraryView>(apiPaths.library());
export const libraryQueryOptions = () => queryOptions({ queryKey: ['library'], queryFn: getLibrary, staleTime: 3_600_000 });
export const useLibrary = () => useQuery(libraryQueryOptions());
