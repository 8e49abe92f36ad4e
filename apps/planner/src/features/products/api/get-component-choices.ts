import { queryOptions, useQuery } from '@tanstack/react-query';
import { maxPageSize, type MaterialPage, type WorkCenterPage } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** Materials a bill of materials can use (GET /api/materials). */
export const getMaterialChoices = (): Promise<MaterialPage> =>
  api.get<MaterialPage>('/api/materials', { params: { pageSize: maxPageSize, sort: 'code', dir: 'asc' } });

export const materialChoicesQueryOptions = () =>
  queryOptions({ queryKey: ['products', 'choices', 'materials'], queryFn: getMaterialChoices });

export const useMaterialChoices = () => useQuery(materialChoicesQueryOptions());

/** Work centers a routing step can use (GET /api/work-centers). */
export const getWorkCenterChoices = (): Promise<WorkCenterPage> =>
  api.get<WorkCenterPage>('/api/work-centers', { params: { pageSize: maxPageSize, sort: 'code', dir: 'asc' } });

export const workCenterChoicesQueryOptions = () =>
  queryOptions({ queryKey: ['products', 'choices', 'work-centers'], queryFn: getWorkCenterChoices });

export const useWorkCenterChoices = () => useQuery(workCenterChoicesQueryOptions());
