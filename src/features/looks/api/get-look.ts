import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { LookView } from '../../../../shared/schemas/look';
import { looksQueryOptions } from './get-looks';
import { apiPaths } from '../../../lib/paths';

export const getLook = (pid: number, id: number) => api.get<{ look: LookView }>(apiPaths.production(pid).look(id).root());
export const lookQueryOptions = (pid: number, id: number) =>
  queryOptions({ queryKey: [...looksQueryOptions(pid).queryKey, id], queryFn: () => getLook(pid, id), enabled: pid > 0 && id > 0 });
export const useLook = (pid: number, id: number) => useQuery(lookQueryOptions(pid, id));
