import { apiPaths } from '../../../lib/paths';

/** GET /api/productions/:id/sheets.pdf?looks=1,2,3: the sheets of several looks in one PDF (a plain download link). */
export const daySheetsPdfUrl = (pid: number, lookIds: readonly number[]) => `${apiPaths.production(pid).root()}/sheets.pdf?looks=${lookIds.join(',')}`;
