import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
// The built-in library's answer type lives with its route (type-only import: nothing of the server reaches the bundle).
import type { LibraryView, LibraryItemView } from '../../../../server/modules/simulate/simulate.service';

export type { LibraryView, LibraryItemView };
export const getLibrary = () => api.get<LibraryView>('/api/library');
export const libraryQueryOptions = () => queryOptions({ queryKey: ['library'], queryFn: getLibrary, staleTime: 3_600_000 });
export const useLibrary = () => useQuery(libraryQueryOptions());
