import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlanDetail } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { plansKey } from './get-plans';

/** GET /api/plans/:id: the version with its certificate, solve status and check outcome. */
export const getPlan = (id: number): Promise<PlanDetail> => api.get<PlanDetail>(`/api/plans/${id}`);

export const planQueryOptions = (id: number) => queryOptions({ queryKey: [...plansKey, 'detail', id], queryFn: () => getPlan(id) });

export const usePlan = (id: number) => useQuery(planQueryOptions(id));
