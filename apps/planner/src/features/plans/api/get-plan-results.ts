import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlanResults } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { plansKey } from './get-plans';

/** GET /api/plans/:id/results: lines, load, material calls, bottleneck values, unmet orders, totals. */
export const getPlanResults = (id: number): Promise<PlanResults> => api.get<PlanResults>(`/api/plans/${id}/results`);

export const planResultsQueryOptions = (id: number) =>
  queryOptions({ queryKey: [...plansKey, 'results', id], queryFn: () => getPlanResults(id), staleTime: 5 * 60_000 });

export const usePlanResults = (id: number, enabled = true) => useQuery({ ...planResultsQueryOptions(id), enabled });
