import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlanReview } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { plansKey } from './get-plans';

/** GET /api/plans/:id/review: changes against the last approved version, certificate, cautions. */
export const getPlanReview = (id: number): Promise<PlanReview> => api.get<PlanReview>(`/api/plans/${id}/review`);

export const planReviewQueryOptions = (id: number) => queryOptions({ queryKey: [...plansKey, 'review', id], queryFn: () => getPlanReview(id) });

export const usePlanReview = (id: number, enabled = true) => useQuery({ ...planReviewQueryOptions(id), enabled });
