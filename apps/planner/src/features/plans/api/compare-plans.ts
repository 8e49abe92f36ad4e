import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlanComparison } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { plansKey } from './get-plans';

/** GET /api/plans/compare?a=&b=: two versions side by side, with b − a for every figure. */
export const comparePlans = (a: number, b: number): Promise<PlanComparison> => api.get<PlanComparison>('/api/plans/compare', { params: { a, b } });

export const planComparisonQueryOptions = (a: number, b: number) =>
  queryOptions({ queryKey: [...plansKey, 'compare', a, b], queryFn: () => comparePlans(a, b) });

export const usePlanComparison = (a: number | null, b: number | null) =>
  useQuery({ ...planComparisonQueryOptions(a ?? 0, b ?? 0), enabled: a !== null && b !== null && a !== b });
