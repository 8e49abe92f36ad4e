import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlanSummary } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/plans: every plan version, newest first. */
export const getPlans = (): Promise<PlanSummary[]> => api.get<PlanSummary[]>('/api/plans');

/** Root of every plan query key; mutations invalidate through it. */
export const plansKey = ['plans'] as const;

export const plansQueryOptions = () => queryOptions({ queryKey: [...plansKey, 'list'], queryFn: getPlans });

export const usePlans = () => useQuery(plansQueryOptions());
