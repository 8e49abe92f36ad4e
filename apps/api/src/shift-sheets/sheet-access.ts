import type { PlanState, Role } from '@millrace/contracts';
import { AppError } from '../http/app-error';

/** Words for a plan state inside a sentence ("Plan version 4 is a draft"). */
const stateWords: Record<PlanState, string> = {
  draft: 'a draft',
  submitted: 'submitted and waiting for sign-off',
  approved: 'approved but not yet released',
  returned: 'returned to the planner',
  released: 'released',
  superseded: 'superseded by a newer released plan',
};

/** Plan states whose sheets each role may read: floor leads work from released plans only. */
export function readableStates(role: Role): readonly PlanState[] {
  return role === 'floor_lead' ? ['released'] : ['approved', 'released'];
}

/**
 * Shift sheets exist for approved and released plan versions (issue 8); anything else is a 409
 * naming the state. Floor leads only see released ones (403 for an approved one: a supervisor
 * still has to release it to the floor).
 */
export function assertSheetsReadable(plan: { id: number; state: PlanState }, role: Role): void {
  if (plan.state !== 'approved' && plan.state !== 'released') {
    throw AppError.conflict(
      `Plan version ${plan.id} is ${stateWords[plan.state]}; shift sheets exist only for approved or released plan versions.`,
    );
  }
  if (!readableStates(role).includes(plan.state)) {
    throw new AppError(
      403,
      'forbidden',
      `Plan version ${plan.id} is ${stateWords[plan.state]}; floor leads see the shift sheets of released plan versions only.`,
    );
  }
}
