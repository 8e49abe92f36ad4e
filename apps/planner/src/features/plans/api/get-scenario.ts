import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Scenario } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { scenariosKey } from './get-scenarios';

/** GET /api/scenarios/:id */
export const getScenario = (id: number): Promise<Scenario> => api.get<Scenario>(`/api/scenarios/${id}`);

export const scenarioQueryOptions = (id: number) => queryOptions({ queryKey: [...scenariosKey, 'detail', id], queryFn: () => getScenario(id) });

export const useScenario = (id: number) => useQuery(scenarioQueryOptions(id));
