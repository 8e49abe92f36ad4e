import { expect } from 'vitest';
import type { PlanState } from '@millrace/contracts';
import { waitForRun } from '../support/plan-runs';
import type { TestAgent } from '../support/test-app';

export interface SignOffAgents {
  planner: TestAgent;
  supervisor: TestAgent;
}

/**
 * A plan version taken through the real sign-off steps up to `state`: created and solved by the
 * planner, then submitted, approved and released as far as asked (draft stops after the solve).
 */
export async function planInState(agents: SignOffAgents, name: string, firstWeek: string, state: Extract<PlanState, 'draft' | 'submitted' | 'approved' | 'released'>): Promise<number> {
  const created = await agents.planner.post('/api/plans').send({ name, horizonWeeks: 4, firstWeek });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  const id: number = created.body.id;
  const solve = await agents.planner.post(`/api/plans/${id}/solve`);
  expect(solve.status).toBe(202);
  const run = await waitForRun(agents.planner, id, solve.body.runId);
  expect(run.state, JSON.stringify(run)).toBe('finished');
  const plan = (await agents.planner.get(`/api/plans/${id}`)).body;
  expect(plan.solveStatus, plan.solveMessage ?? '').toBe('solved');
  if (state === 'draft') return id;
  expect((await agents.planner.post(`/api/plans/${id}/submit`).send({})).status).toBe(200);
  if (state === 'submitted') return id;
  expect((await agents.supervisor.post(`/api/plans/${id}/approve`).send({})).status).toBe(200);
  if (state === 'approved') return id;
  expect((await agents.supervisor.post(`/api/plans/${id}/release`).send({})).status).toBe(200);
  return id;
}
