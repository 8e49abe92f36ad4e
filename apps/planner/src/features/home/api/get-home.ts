import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HomeSummary } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/home: firm demand of the next weeks against available hours per work center. */
export const getHome = (weeks: number): Promise<HomeSummary> => api.get<HomeSummary>('/api/home', { params: { weeks } });

export const homeQueryOptions = (weeks: number) =>
  queryOptions({ queryKey: ['home', { weeks }], queryFn: () => getHome(weeks) });

export const useHome = (weeks: number) => useQuery(homeQueryOptions(weeks));
