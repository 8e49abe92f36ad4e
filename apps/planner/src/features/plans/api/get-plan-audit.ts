import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditEntry } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { plansKey } from './get-plans';

/** GET /api/plans/:id/audit: the append-only trail of a plan version, oldest first. */
export const getPlanAudit = (id: number): Promise<AuditEntry[]> => api.get<AuditEntry[]>(`/api/plans/${id}/audit`);

export const planAuditQueryOptions = (id: number) => queryOptions({ queryKey: [...plansKey, 'audit', id], queryFn: () => getPlanAudit(id) });

export const usePlanAudit = (id: number) => useQuery(planAuditQueryOptions(id));
