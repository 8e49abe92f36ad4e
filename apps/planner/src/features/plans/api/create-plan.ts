import { useMutation, useQueryClient } from '@tanstack/react-query';
import { planCreateSchema, type PlanCreate, type PlanDetail } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { plansQueryOptions } from './get-plans';

export { planCreateSchema };
export type { PlanCreate };

/** POST /api/plans: a new draft version from the current data (or a scenario). 422 lists the data issues. */
export const createPlan = (body: PlanCreate): Promise<PlanDetail> => api.post<PlanDetail>('/api/plans', body);

export function useCreatePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createPlan,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plansQueryOptions().queryKey }),
  });
}
