import { useMutation, useQueryClient } from '@tanstack/react-query';
import { productUpdateSchema, type Product, type ProductUpdate } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { productQueryOptions } from './get-product';
import { productsQueryOptions } from './get-products';

export { productUpdateSchema };
export type { ProductUpdate };

/** PATCH /api/products/:id with the version read (409 when someone else saved first). */
export const updateProduct = ({ id, body }: { id: number; body: ProductUpdate }): Promise<Product> =>
  api.patch<Product>(`/api/products/${id}`, body);

export function useUpdateProduct() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateProduct,
    onSuccess: async (_product, { id }) => {
      await queryClient.invalidateQueries({ queryKey: productsQueryOptions().queryKey });
      await queryClient.invalidateQueries({ queryKey: productQueryOptions(id).queryKey });
    },
  });
}
