import { describe, expect, it } from 'vitest';
import { planActionSchema, planStateSchema, roles, type PlanAction, type PlanState, type Role } from '@millrace/contracts';
import { decideTransition, isImmutable } from '../../src/sign-off/plan-state-machine';

/**
 * The sign-off rules written out by hand, independent of the module's table (issue 6 item 1:
 * planners create, solve and submit; supervisors approve or return; released supersedes;
 * approved and released versions are immutable). Common practice of four-eyes sign-off, no source.
 */
const expected: Record<PlanAction, { role: Role; from: PlanState[]; to: PlanState }> = {
  submit: { role: 'planner', from: ['draft', 'returned'], to: 'submitted' },
  approve: { role: 'supervisor', from: ['submitted'], to: 'approved' },
  return: { role: 'supervisor', from: ['submitted'], to: 'returned' },
  release: { role: 'supervisor', from: ['approved'], to: 'released' },
};

const cases = planStateSchema.options.flatMap((state) =>
  planActionSchema.options.flatMap((action) => roles.map((role) => ({ state, action, role }))),
);

describe('plan state machine', () => {
  it('when the table is enumerated, then it covers 6 states × 4 actions × 4 roles', () => {
    expect(cases).toHaveLength(96);
  });

  it.each(cases)('when a $role tries to $action a $state plan, then the outcome follows the rules', ({ state, action, role }) => {
    const rule = expected[action];
    const result = decideTransition(state, action, role);
    if (role !== rule.role) {
      expect(result.outcome).toBe('forbidden');
    } else if (!rule.from.includes(state)) {
      expect(result.outcome).toBe('conflict');
      if (result.outcome === 'conflict') expect(result.reason).toContain(state);
    } else {
      expect(result).toEqual({ outcome: 'allowed', to: rule.to });
    }
  });

  it('when a plan is approved, released or superseded, then it is immutable; draft, submitted, returned are not', () => {
    expect(planStateSchema.options.filter(isImmutable)).toEqual(['approved', 'released', 'superseded']);
  });
});
