import { useMutation, useQueryClient } from '@tanstack/react-query';
import { materialCreateSchema, type Material, type MaterialCreate } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { materialsQueryOptions } from './get-materials';

export { materialCreateSchema };
export type { MaterialCreate };

/** POST /api/materials. */
export const createMaterial = (body: MaterialCreate): Promise<Material> => api.post<Material>('/api/materials', body);

export function useCreateMaterial() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createMaterial,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: materialsQueryOptions().queryKey }),
  });
}
