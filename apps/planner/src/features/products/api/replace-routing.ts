import { useMutation, useQueryClient } from '@tanstack/react-query';
import { routingReplaceSchema, type RoutingReplace } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { productQueryOptions } from './get-product';

export { routingReplaceSchema };
export type { RoutingReplace };

/** PUT /api/products/:id/routing: the ordered steps, checked against the product's version. */
export const replaceRouting = ({ id, body }: { id: number; body: RoutingReplace }): Promise<unknown> =>
  api.put<unknown>(`/api/products/${id}/routing`, body);

export function useReplaceRouting() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: replaceRouting,
    onSuccess: (_r, { id }) => queryClient.invalidateQueries({ queryKey: productQueryOptions(id).queryKey }),
  });
}
