import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MaterialDetail } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/materials/:id: a material with its scheduled receipts. */
export const getMaterial = (id: number): Promise<MaterialDetail> => api.get<MaterialDetail>(`/api/materials/${id}`);

export const materialQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['materials', 'detail', id], queryFn: () => getMaterial(id) });

export const useMaterial = (id: number) => useQuery(materialQueryOptions(id));
