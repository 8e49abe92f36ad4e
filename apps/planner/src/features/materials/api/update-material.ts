import { useMutation, useQueryClient } from '@tanstack/react-query';
import { materialUpdateSchema, type Material, type MaterialUpdate } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { materialQueryOptions } from './get-material';
import { materialsQueryOptions } from './get-materials';

export { materialUpdateSchema };
export type { MaterialUpdate };

/** PATCH /api/materials/:id with the version read. */
export const updateMaterial = ({ id, body }: { id: number; body: MaterialUpdate }): Promise<Material> =>
  api.patch<Material>(`/api/materials/${id}`, body);

export function useUpdateMaterial() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMaterial,
    onSuccess: async (_m, { id }) => {
      await queryClient.invalidateQueries({ queryKey: materialsQueryOptions().queryKey });
      await queryClient.invalidateQueries({ queryKey: materialQueryOptions(id).queryKey });
    },
  });
}
