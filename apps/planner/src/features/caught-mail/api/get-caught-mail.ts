import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CaughtMail, CaughtMailSummary } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/dev/mail (admin, development only): every caught message, newest first. */
export const getCaughtMailList = (): Promise<CaughtMailSummary[]> => api.get<CaughtMailSummary[]>('/api/dev/mail');

/** GET /api/dev/mail/:id: one caught message with its text and HTML parts. */
export const getCaughtMail = (id: string): Promise<CaughtMail> => api.get<CaughtMail>(`/api/dev/mail/${encodeURIComponent(id)}`);

export const caughtMailQueryOptions = () =>
  queryOptions({ queryKey: ['caught-mail', 'list'], queryFn: getCaughtMailList, refetchInterval: 10_000 });

export const caughtMessageQueryOptions = (id: string) =>
  queryOptions({ queryKey: ['caught-mail', 'detail', id], queryFn: () => getCaughtMail(id), staleTime: Infinity });

export const useCaughtMailList = () => useQuery(caughtMailQueryOptions());
export const useCaughtMessage = (id: string | null) => useQuery({ ...caughtMessageQueryOptions(id ?? ''), enabled: id !== null });
