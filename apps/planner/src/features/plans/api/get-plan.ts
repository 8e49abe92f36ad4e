import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlanDetail } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { plansKey } from './get-plans';

/** GET /api/plans/:id: the version with its certificate, solve status and check outcome. */
export const getPlan = (id: number): Promise<PlanDetail> => api.get<PlanDetail>(`/api/plans/${id}`);

export const planQueryOptions = (id: number) => queryOptions({ queryKey: [...plansKey, 'detail', id], queryFn: () => getPlan(id) });

/** How often an open plan is read again while its solve or cross-check is still going (common practice, no source). */
export const planPollIntervalMs = 2000;

/** True while something about the plan will still change by itself. */
export function isPlanSettling(plan: PlanDetail | undefined): boolean {
  if (!plan) return false;
  return plan.solveStatus === 'queued' || plan.solveStatus === 'solving' || plan.certificate?.crossCheck?.status === 'running';
}

/** The plan, read again while its solve or cross-check runs so the page follows it. */
export const usePlan = (id: number) =>
  useQuery({ ...planQueryOptions(id), refetchInterval: (query) => (isPlanSettling(query.state.data) ? planPollIntervalMs : false) });
