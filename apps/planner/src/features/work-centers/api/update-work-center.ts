import { useMutation, useQueryClient } from '@tanstack/react-query';
import { workCenterUpdateSchema, type WorkCenter, type WorkCenterUpdate } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { workCenterQueryOptions } from './get-work-center';
import { workCentersQueryOptions } from './get-work-centers';

export { workCenterUpdateSchema };
export type { WorkCenterUpdate };

/** PATCH /api/work-centers/:id with the version read. */
export const updateWorkCenter = ({ id, body }: { id: number; body: WorkCenterUpdate }): Promise<WorkCenter> =>
  api.patch<WorkCenter>(`/api/work-centers/${id}`, body);

export function useUpdateWorkCenter() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateWorkCenter,
    onSuccess: async (_w, { id }) => {
      await queryClient.invalidateQueries({ queryKey: workCentersQueryOptions().queryKey });
      await queryClient.invalidateQueries({ queryKey: workCenterQueryOptions(id).queryKey });
    },
  });
}
