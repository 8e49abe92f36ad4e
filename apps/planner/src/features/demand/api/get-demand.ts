import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { maxPageSize, type DemandGrid } from '@millrace/contracts';
import { api } from '@/lib/api-client';

export type DemandWindow = { from?: string; weeks: number };

/** GET /api/demand: every product × `weeks` weeks from `from` (default: the current plant week). */
export const getDemand = ({ from, weeks }: DemandWindow): Promise<DemandGrid> =>
  api.get<DemandGrid>('/api/demand', { params: { from, weeks, pageSize: maxPageSize } });

export const demandQueryOptions = (window: DemandWindow) =>
  queryOptions({ queryKey: ['demand', 'grid', window], queryFn: () => getDemand(window), placeholderData: keepPreviousData });

export const useDemand = (window: DemandWindow) => useQuery(demandQueryOptions(window));
