import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ImportRun, ImportSummary } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { uploadBody, type ImportUpload } from './preview-import';

export type AppliedImport = { run: ImportRun; summary: ImportSummary };

/** POST /api/imports/:kind/apply: the same file and mapping, written in one transaction (or not at all). */
export const applyImport = (upload: ImportUpload): Promise<AppliedImport> =>
  api.post<AppliedImport>(`/api/imports/${upload.kind}/apply`, uploadBody(upload));

export function useApplyImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: applyImport,
    // An import can change any master data or demand on screen: refresh everything read so far.
    onSuccess: () => queryClient.invalidateQueries({ predicate: (q) => q.queryKey[0] !== 'me' }),
  });
}
