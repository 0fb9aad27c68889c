import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { RenderRequestInput, RenderStatus } from '../../../../shared/schemas/photo';
import { apiPaths } from '../../../lib/paths';

/** Starts a full-resolution render (or finds it in the cache). */
export const startRender = ({ pid, photoId, ...input }: RenderRequestInput & { pid: number; photoId: number }) =>
  api.post<{ render: RenderStatus }>(apiPaths.production(pid).photo(photoId).renders(), input);
export const useStartRender = () => useMutation({ mutationFn: startRender });
