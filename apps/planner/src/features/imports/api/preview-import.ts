import { useMutation } from '@tanstack/react-query';
import type { ImportKind, ImportMapping, ImportPreview } from '@millrace/contracts';
import { api } from '@/lib/api-client';

export type ImportUpload = { kind: ImportKind; file: File; mapping?: ImportMapping; sheet?: string; headerRow?: number };

/** The multipart body the import routes read: the file, and optionally the sheet and mapping. */
export function uploadBody({ file, mapping, sheet, headerRow }: ImportUpload): FormData {
  const body = new FormData();
  if (sheet) body.set('sheet', sheet);
  if (headerRow) body.set('headerRow', String(headerRow));
  if (mapping) body.set('mapping', JSON.stringify(mapping));
  body.set('file', file, file.name);
  return body;
}

/** POST /api/imports/:kind: read the file and show what applying it would do (nothing is written). */
export const previewImport = (upload: ImportUpload): Promise<ImportPreview> =>
  api.post<ImportPreview>(`/api/imports/${upload.kind}`, uploadBody(upload));

export const usePreviewImport = () => useMutation({ mutationFn: previewImport });
