import { useMutation, useQueryClient } from '@tanstack/react-query';
import { productCreateSchema, type Product, type ProductCreate } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { productsQueryOptions } from './get-products';

export { productCreateSchema };
export type { ProductCreate };

/** POST /api/products. */
export const createProduct = (body: ProductCreate): Promise<Product> => api.post<Product>('/api/products', body);

export function useCreateProduct() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createProduct,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: productsQueryOptions().queryKey }),
  });
}
