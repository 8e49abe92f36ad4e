import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Scenario } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/scenarios: every scenario with its overrides. */
export const getScenarios = (): Promise<Scenario[]> => api.get<Scenario[]>('/api/scenarios');

export const scenariosKey = ['scenarios'] as const;

export const scenariosQueryOptions = () => queryOptions({ queryKey: [...scenariosKey, 'list'], queryFn: getScenarios });

export const useScenarios = () => useQuery(scenariosQueryOptions());
