import { useMutation } from '@tanstack/react-query';
import type { ImportKind, ImportMapping, SavedMapping } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** PUT /api/imports/:kind/mapping: the mapping the next file of this kind starts from. */
export const saveMapping = ({ kind, mapping }: { kind: ImportKind; mapping: ImportMapping }): Promise<SavedMapping> =>
  api.put<SavedMapping>(`/api/imports/${kind}/mapping`, { mapping });

export const useSaveMapping = () => useMutation({ mutationFn: saveMapping });
