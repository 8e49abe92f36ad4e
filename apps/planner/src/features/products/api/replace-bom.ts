import { useMutation, useQueryClient } from '@tanstack/react-query';
import { bomReplaceSchema, type BomReplace } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { productQueryOptions } from './get-product';

export { bomReplaceSchema };
export type { BomReplace };

/** PUT /api/products/:id/bom: the whole bill of materials, checked against the product's version. */
export const replaceBom = ({ id, body }: { id: number; body: BomReplace }): Promise<unknown> =>
  api.put<unknown>(`/api/products/${id}/bom`, body);

export function useReplaceBom() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: replaceBom,
    onSuccess: (_r, { id }) => queryClient.invalidateQueries({ queryKey: productQueryOptions(id).queryKey }),
  });
}
