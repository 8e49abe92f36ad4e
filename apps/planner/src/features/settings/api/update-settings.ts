import { useMutation, useQueryClient } from '@tanstack/react-query';
import { plantSettingsUpdateSchema, type PlantSettings, type PlantSettingsUpdate } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { settingsQueryOptions } from './get-settings';

export { plantSettingsUpdateSchema };
export type { PlantSettingsUpdate };

/** PUT /api/settings: every field, with the version read. */
export const updateSettings = (body: PlantSettingsUpdate): Promise<PlantSettings> => api.put<PlantSettings>('/api/settings', body);

export function useUpdateSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSettings,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: settingsQueryOptions().queryKey }),
  });
}
