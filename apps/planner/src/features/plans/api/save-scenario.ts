import { useMutation, useQueryClient } from '@tanstack/react-query';
import { scenarioCreateSchema, scenarioUpdateSchema, type Scenario, type ScenarioCreate, type ScenarioUpdate } from '@millrace/contracts';
import { api } from '@/lib/api-client';
import { scenariosKey } from './get-scenarios';

export { scenarioCreateSchema, scenarioUpdateSchema };
export type { ScenarioCreate, ScenarioUpdate };

/** POST /api/scenarios */
export const createScenario = (body: ScenarioCreate): Promise<Scenario> => api.post<Scenario>('/api/scenarios', body);

/** PATCH /api/scenarios/:id with the version read (409 when someone else saved first). */
export const updateScenario = ({ id, body }: { id: number; body: ScenarioUpdate }): Promise<Scenario> =>
  api.patch<Scenario>(`/api/scenarios/${id}`, body);

/** DELETE /api/scenarios/:id */
export const deleteScenario = (id: number): Promise<void> => api.delete<void>(`/api/scenarios/${id}`);

export function useCreateScenario() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createScenario, onSuccess: () => queryClient.invalidateQueries({ queryKey: scenariosKey }) });
}

export function useUpdateScenario() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updateScenario, onSuccess: () => queryClient.invalidateQueries({ queryKey: scenariosKey }) });
}

export function useDeleteScenario() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: deleteScenario, onSuccess: () => queryClient.invalidateQueries({ queryKey: scenariosKey }) });
}
