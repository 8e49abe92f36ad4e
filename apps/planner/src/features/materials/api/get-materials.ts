import { queryOptions, useQuery } from '@tanstack/react-query';
import { maxPageSize, type MaterialPage } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/materials: every material in one page. */
export const getMaterials = (): Promise<MaterialPage> =>
  api.get<MaterialPage>('/api/materials', { params: { pageSize: maxPageSize, sort: 'code', dir: 'asc' } });

export const materialsQueryOptions = () => queryOptions({ queryKey: ['materials', 'list'], queryFn: getMaterials });

export const useMaterials = () => useQuery(materialsQueryOptions());
