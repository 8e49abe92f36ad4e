import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProductDetail } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/products/:id: a product with its bill of materials and routing. */
export const getProduct = (id: number): Promise<ProductDetail> => api.get<ProductDetail>(`/api/products/${id}`);

export const productQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['products', 'detail', id], queryFn: () => getProduct(id) });

export const useProduct = (id: number) => useQuery(productQueryOptions(id));
