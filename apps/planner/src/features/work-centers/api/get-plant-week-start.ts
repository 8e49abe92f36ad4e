import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlantSettings } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** The plant's week start (from GET /api/settings), so calendar weeks begin on the right day. */
export const getPlantWeekStart = async (): Promise<PlantSettings['weekStart']> =>
  (await api.get<PlantSettings>('/api/settings')).weekStart;

export const plantWeekStartQueryOptions = () =>
  queryOptions({ queryKey: ['work-centers', 'week-start'], queryFn: getPlantWeekStart, staleTime: 10 * 60_000 });

export const usePlantWeekStart = () => useQuery(plantWeekStartQueryOptions());
