import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OutboxMessage, OutboxState } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/outbox (admin): mail in one state, or (no state) mail still waiting or failed. */
export const getOutbox = (state?: OutboxState): Promise<OutboxMessage[]> => api.get<OutboxMessage[]>('/api/outbox', { params: { state } });

export const outboxQueryOptions = (state?: OutboxState) =>
  queryOptions({ queryKey: ['outbox', { state: state ?? 'open' }], queryFn: () => getOutbox(state), refetchInterval: 15_000 });

export const useOutbox = (state?: OutboxState) => useQuery(outboxQueryOptions(state));
