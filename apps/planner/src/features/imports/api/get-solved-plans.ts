import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlanSummary } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/plans, kept to the solved versions (only they have lines and material calls to export). */
export const getSolvedPlans = async (): Promise<PlanSummary[]> => (await api.get<PlanSummary[]>('/api/plans')).filter((p) => p.solveStatus === 'solved');

export const solvedPlansQueryOptions = () => queryOptions({ queryKey: ['plans', 'list', 'solved'], queryFn: getSolvedPlans });

export const useSolvedPlans = () => useQuery(solvedPlansQueryOptions());
