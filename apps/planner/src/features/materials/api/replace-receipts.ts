import { useMutation, useQueryClient } from '@tanstack/react-query';
import { receiptsReplaceSchema, type ReceiptsReplace } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { materialQueryOptions } from './get-material';

export { receiptsReplaceSchema };
export type { ReceiptsReplace };

/** PUT /api/materials/:id/receipts: the whole list of scheduled receipts. */
export const replaceReceipts = ({ id, body }: { id: number; body: ReceiptsReplace }): Promise<unknown> =>
  api.put<unknown>(`/api/materials/${id}/receipts`, body);

export function useReplaceReceipts() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: replaceReceipts,
    onSuccess: (_r, { id }) => queryClient.invalidateQueries({ queryKey: materialQueryOptions(id).queryKey }),
  });
}
