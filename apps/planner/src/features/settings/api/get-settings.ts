import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlantSettings } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/settings: the plant's one row of settings. */
export const getSettings = (): Promise<PlantSettings> => api.get<PlantSettings>('/api/settings');

export const settingsQueryOptions = () => queryOptions({ queryKey: ['settings'], queryFn: getSettings });

export const useSettings = () => useQuery(settingsQueryOptions());
