import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WorkCenterDetail } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/work-centers/:id: a work center with its calendar weeks. */
export const getWorkCenter = (id: number): Promise<WorkCenterDetail> => api.get<WorkCenterDetail>(`/api/work-centers/${id}`);

export const workCenterQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['work-centers', 'detail', id], queryFn: () => getWorkCenter(id) });

export const useWorkCenter = (id: number) => useQuery(workCenterQueryOptions(id));
