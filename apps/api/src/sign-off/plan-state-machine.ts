import type { PlanAction, PlanState, Role } from '@millrace/contracts';

/**
 * The sign-off state machine as data: for each action, who may take it and from which
 * states, and where it leads. Pure — no database, no HTTP — so every
 * state × action × role combination can be tested from a table.
 *
 *   draft ──submit──► submitted ──approve──► approved ──release──► released ──(a later release)──► superseded
 *     ▲                   │
 *     └── returned ◄─return┘     (returned ──submit──► submitted)
 */
interface ActionRule {
  roles: readonly Role[];
  from: readonly PlanState[];
  to: PlanState;
}

export const planActionRules: Readonly<Record<PlanAction, ActionRule>> = {
  submit: { roles: ['planner'], from: ['draft', 'returned'], to: 'submitted' },
  approve: { roles: ['supervisor'], from: ['submitted'], to: 'approved' },
  return: { roles: ['supervisor'], from: ['submitted'], to: 'returned' },
  release: { roles: ['supervisor'], from: ['approved'], to: 'released' },
};

/** States whose plan and inputs can no longer change. */
export const immutableStates: readonly PlanState[] = ['approved', 'released', 'superseded'];
/** States in which a plan may be solved again or renamed (submitted is frozen while under review). */
export const editableStates: readonly PlanState[] = ['draft', 'returned'];

export type TransitionOutcome =
  | { outcome: 'allowed'; to: PlanState }
  | { outcome: 'forbidden'; reason: string }
  | { outcome: 'conflict'; reason: string };

const roleWords: Record<Role, string> = {
  admin: 'an admin',
  planner: 'a planner',
  supervisor: 'a supervisor',
  floor_lead: 'a floor lead',
};

const actionWords: Record<PlanAction, string> = {
  submit: 'submit',
  approve: 'approve',
  return: 'return',
  release: 'release',
};

/** Decides one transition: 403 reason for the wrong role, 409 reason for the wrong state. */
export function decideTransition(state: PlanState, action: PlanAction, role: Role): TransitionOutcome {
  const rule = planActionRules[action];
  if (!rule.roles.includes(role)) {
    const who = rule.roles.map((r) => roleWords[r]).join(' or ');
    return { outcome: 'forbidden', reason: `Only ${who} can ${actionWords[action]} a plan version; you are signed in as ${roleWords[role]}.` };
  }
  if (!rule.from.includes(state)) {
    const from = rule.from.join(' or ');
    return {
      outcome: 'conflict',
      reason: `This plan version is ${state}; only a ${from} version can be ${pastTense(action)}.`,
    };
  }
  return { outcome: 'allowed', to: rule.to };
}

function pastTense(action: PlanAction): string {
  return { submit: 'submitted', approve: 'approved', return: 'returned', release: 'released' }[action];
}

export function isImmutable(state: PlanState): boolean {
  return immutableStates.includes(state);
}

export function isEditable(state: PlanState): boolean {
  return editableStates.includes(state);
}
