import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ImportKind, ImportRun } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** POST /api/imports/:kind/undo: restores what the latest applied import of the kind changed. */
export const undoImport = (kind: ImportKind): Promise<ImportRun> => api.post<ImportRun>(`/api/imports/${kind}/undo`);

export function useUndoImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: undoImport,
    onSuccess: () => queryClient.invalidateQueries({ predicate: (q) => q.queryKey[0] !== 'me' }),
  });
}
