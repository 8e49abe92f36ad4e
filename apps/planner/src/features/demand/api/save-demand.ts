import { useMutation, useQueryClient } from '@tanstack/react-query';
import { demandBatchSchema, type DemandBatch, type DemandBatchResult } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { demandQueryOptions } from './get-demand';

export { demandBatchSchema };
export type { DemandBatch };

/** PUT /api/demand: every changed cell in one request; all are written or none. */
export const saveDemand = (body: DemandBatch): Promise<DemandBatchResult> => api.put<DemandBatchResult>('/api/demand', body);

export function useSaveDemand() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveDemand,
    // The grid key starts with the factory's first two parts; every window is refreshed.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: demandQueryOptions({ weeks: 0 }).queryKey.slice(0, 2) }),
  });
}
