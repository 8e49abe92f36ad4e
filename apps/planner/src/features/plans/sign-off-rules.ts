import type { PlanAction, PlanState, Role, SolveStatus } from '@millrace/contracts';

/**
 * The sign-off state machine as the API enforces it (apps/api/src/sign-off/plan-state-machine.ts),
 * mirrored so the screen only offers what the API would accept. The API decides; a button shown
 * by mistake still gets a clear 403/409.
 */
const rules: Record<PlanAction, { roles: readonly Role[]; from: readonly PlanState[] }> = {
  submit: { roles: ['planner'], from: ['draft', 'returned'] },
  approve: { roles: ['supervisor'], from: ['submitted'] },
  return: { roles: ['supervisor'], from: ['submitted'] },
  release: { roles: ['supervisor'], from: ['approved'] },
};

/** States in which a plan version may be solved again (submitted is frozen while under review). */
const solvableStates: readonly PlanState[] = ['draft', 'returned'];

export type ActionAvailability = { outcome: 'offered' } | { outcome: 'hidden' } | { outcome: 'blocked'; reason: string };

/** Whether `role` gets the `action` button for a plan in `state`, and why it is blocked when it is. */
export function actionAvailability(action: PlanAction, state: PlanState, role: Role, solveStatus: SolveStatus): ActionAvailability {
  const rule = rules[action];
  if (!rule.roles.includes(role) || !rule.from.includes(state)) return { outcome: 'hidden' };
  if (action === 'submit' && solveStatus !== 'solved')
    return { outcome: 'blocked', reason: 'Only a solved and checked plan can go to sign-off; solve it first.' };
  return { outcome: 'offered' };
}

export function canSolve(state: PlanState, role: Role): boolean {
  return role === 'planner' && solvableStates.includes(state);
}

export const planActions: readonly PlanAction[] = ['submit', 'approve', 'return', 'release'];
