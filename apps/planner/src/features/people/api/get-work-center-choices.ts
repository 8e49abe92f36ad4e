import { queryOptions, useQuery } from '@tanstack/react-query';
import { maxPageSize, type WorkCenterPage } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** A work center as the people page offers it for a floor lead. */
export type WorkCenterChoice = { id: number; code: string; name: string };

/** GET /api/work-centers (every signed-in role reads master data): all of them, by code. */
export const getWorkCenterChoices = async (): Promise<WorkCenterChoice[]> => {
  const page = await api.get<WorkCenterPage>('/api/work-centers', { params: { pageSize: maxPageSize, sort: 'code', dir: 'asc' } });
  return page.items.map(({ id, code, name }) => ({ id, code, name }));
};

export const workCenterChoicesQueryOptions = () => queryOptions({ queryKey: ['work-centers', 'choices'], queryFn: getWorkCenterChoices });

/** Loaded only when needed (someone on the page is or was given work centers). */
export const useWorkCenterChoices = (enabled: boolean) => useQuery({ ...workCenterChoicesQueryOptions(), enabled });
