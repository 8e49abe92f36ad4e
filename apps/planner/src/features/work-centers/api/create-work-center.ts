import { useMutation, useQueryClient } from '@tanstack/react-query';
import { workCenterCreateSchema, type WorkCenter, type WorkCenterCreate } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { workCentersQueryOptions } from './get-work-centers';

export { workCenterCreateSchema };
export type { WorkCenterCreate };

/** POST /api/work-centers. */
export const createWorkCenter = (body: WorkCenterCreate): Promise<WorkCenter> => api.post<WorkCenter>('/api/work-centers', body);

export function useCreateWorkCenter() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createWorkCenter,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: workCentersQueryOptions().queryKey }),
  });
}
