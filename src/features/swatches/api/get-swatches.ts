import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SwatchView } from '../../../../shared/schemas/swatch';
import { apiPaths } from '../../../lib/paths';

export const getSwatches = (pid: number) => api.get<{ swatches: SwatchView[] }>(apiPaths.production(pid).swatches());
export const swatchesQueryOptions = (pid: number) => queryOptions({ queryKey: ['productions', pid, 'swatches'], queryFn: () => getSwatches(pid), enabled: pid > 0 });
export const useSwatches = (pid: number) => useQuery(swatchesQueryOptions(pid));
