import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RunProgress } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { runProgressQueryOptions } from './get-run-progress';
import { plansKey } from './get-plans';

/** POST /api/plans/:id/runs/:runId/cancel: a queued run stops at once, a running one at its next iteration. */
export const cancelRun = ({ planId, runId }: { planId: number; runId: number }): Promise<RunProgress> =>
  api.post<RunProgress>(`/api/plans/${planId}/runs/${runId}/cancel`);

export function useCancelRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelRun,
    onSuccess: async (run, { planId, runId }) => {
      queryClient.setQueryData(runProgressQueryOptions(planId, runId).queryKey, run);
      await queryClient.invalidateQueries({ queryKey: plansKey });
    },
  });
}
