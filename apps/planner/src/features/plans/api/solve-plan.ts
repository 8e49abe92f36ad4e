import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SolveAccepted } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { plansKey } from './get-plans';

/** POST /api/plans/:id/solve → 202 { runId }; the run is read with get-run-progress. */
export const solvePlan = (planId: number): Promise<SolveAccepted> => api.post<SolveAccepted>(`/api/plans/${planId}/solve`);

export function useSolvePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: solvePlan,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plansKey }),
  });
}
