import { useMutation, useQueryClient } from '@tanstack/react-query';
import { returnTransitionSchema, transitionSchema, type PlanAction, type PlanDetail } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { planQueryOptions } from './get-plan';
import { plansKey } from './get-plans';

export { returnTransitionSchema, transitionSchema };

/** POST /api/plans/:id/submit|approve|return|release (return needs a comment). */
export const transitionPlan = ({ planId, action, comment }: { planId: number; action: PlanAction; comment?: string }): Promise<PlanDetail> =>
  api.post<PlanDetail>(`/api/plans/${planId}/${action}`, comment ? { comment } : {});

export function useTransitionPlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: transitionPlan,
    onSuccess: async (plan) => {
      queryClient.setQueryData(planQueryOptions(plan.id).queryKey, plan);
      await queryClient.invalidateQueries({ queryKey: plansKey });
    },
  });
}
