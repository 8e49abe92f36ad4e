import { queryOptions, useQuery } from '@tanstack/react-query';
import { maxPageSize, type WorkCenterPage } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/work-centers: every work center in one page. */
export const getWorkCenters = (): Promise<WorkCenterPage> =>
  api.get<WorkCenterPage>('/api/work-centers', { params: { pageSize: maxPageSize, sort: 'code', dir: 'asc' } });

export const workCentersQueryOptions = () => queryOptions({ queryKey: ['work-centers', 'list'], queryFn: getWorkCenters });

export const useWorkCenters = () => useQuery(workCentersQueryOptions());
