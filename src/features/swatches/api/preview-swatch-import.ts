import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SwatchImportFields, SwatchImportPreview } from '../../../../shared/schemas/swatch';
import { apiPaths } from '../../../lib/paths';

/** The multipart body of an import: the file in the part named `file`, the department and board if chosen. */
export function importFormData(file: File, fields: SwatchImportFields): FormData {
  const body = new FormData();
  if (fields.department) body.append('department', String(fields.department));
  if (fields.boardId) body.append('boardId', String(fields.boardId));
  body.append('file', file);
  return body;
}

/** Reads a spectrophotometer file on the server and answers what an import would add (nothing is written). */
export const previewSwatchImport = ({ pid, file, ...fields }: SwatchImportFields & { pid: number; file: File }) =>
  api.post<{ preview: SwatchImportPreview }>(apiPaths.production(pid).swatchImportPreview(), importFormData(file, fields));
export const usePreviewSwatchImport = () => useMutation({ mutationFn: previewSwatchImport });
