import { queryOptions, useQuery } from '@tanstack/react-query';
import { maxPageSize, type ProductPage } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/products: every product in one page (tables sort and filter in the browser). */
export const getProducts = (): Promise<ProductPage> =>
  api.get<ProductPage>('/api/products', { params: { pageSize: maxPageSize, sort: 'code', dir: 'asc' } });

export const productsQueryOptions = () => queryOptions({ queryKey: ['products', 'list'], queryFn: getProducts });

export const useProducts = () => useQuery(productsQueryOptions());
