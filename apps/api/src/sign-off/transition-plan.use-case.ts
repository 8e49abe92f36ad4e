import type { DataSource, EntityManager } from 'typeorm';
import type { PlanAction, PlanDetail, Role } from '@millrace/contracts';
import type { SignedInPerson } from '../auth/current-person';
import { AppError } from '../http/app-error';
import { enqueueMail } from '../mail/outbox.repository';
import { findPlan, findPlanDetail, findReleasedOverlapping, setPlanState, type PlanRecord } from '../plans/plans.repository';
import { appendAudit } from './audit.repository';
import { floorLeadGroups } from './floor-lead-recipients';
import { decideTransition } from './plan-state-machine';
import { signOffMail } from './sign-off-mail';

export interface TransitionRequest {
  planId: number;
  action: PlanAction;
  comment: string | null;
  person: SignedInPerson;
  publicUrl: string;
}

/**
 * One sign-off step, in one transaction: lock the plan, let the state machine decide (403/409),
 * require a solved and checked plan to submit, change the state, supersede overlapping released
 * plans on release, append the audit rows and put the e-mails in the outbox. Either all of it
 * is committed or none of it.
 */
export async function transitionPlan(ds: DataSource, req: TransitionRequest): Promise<PlanDetail> {
  await ds.transaction(async (db) => {
    const plan = await findPlan(db, req.planId, 'lock');
    if (!plan) throw AppError.notFound(`Plan version ${req.planId} does not exist.`);
    const decision = decideTransition(plan.state, req.action, req.person.role);
    if (decision.outcome === 'forbidden') throw new AppError(403, 'forbidden', decision.reason);
    if (decision.outcome === 'conflict') throw AppError.conflict(decision.reason);
    if (req.action === 'submit') assertSubmittable(plan);

    await setPlanState(db, plan.id, decision.to, req.action === 'submit' ? req.person.id : undefined);
    await appendAudit(db, {
      planId: plan.id,
      actor: req.person,
      action: req.action,
      fromState: plan.state,
      toState: decision.to,
      comment: req.comment,
      inputsHash: plan.inputsHash,
      resultsHash: plan.resultsHash,
    });
    if (req.action === 'release') await supersedeOverlapping(db, plan, req.person);
    const event = { action: req.action, plan, actorName: req.person.name, comment: req.comment, publicUrl: req.publicUrl };
    if (req.action === 'release') {
      // floor leads: one e-mail per set of assigned work centers, naming them
      for (const group of await floorLeadGroups(db)) await enqueueMail(db, signOffMail({ ...event, workCenters: group.workCenters }, group.to));
    } else {
      const to = await recipients(db, req.action, plan);
      if (to.length > 0) await enqueueMail(db, signOffMail(event, to));
    }
  });
  const detail = await findPlanDetail(ds.manager, req.planId);
  if (!detail) throw AppError.notFound(`Plan version ${req.planId} does not exist.`);
  return detail;
}

function assertSubmittable(plan: PlanRecord): void {
  if (plan.solveStatus === 'solved') return;
  const why =
    plan.solveStatus === 'check_failed'
      ? 'its plan failed the independent check'
      : plan.solveStatus === 'not_solved'
        ? 'it has not been solved yet'
        : `its last solve ended as "${plan.solveStatus.replace('_', ' ')}"`;
  throw AppError.conflict(`Plan version ${plan.id} cannot be submitted: ${why}. Only a solved and checked plan can go to sign-off.`);
}

/** A released plan supersedes every earlier released plan it shares a week with. */
async function supersedeOverlapping(db: EntityManager, plan: PlanRecord, person: SignedInPerson): Promise<void> {
  for (const older of await findReleasedOverlapping(db, plan.id, plan.firstWeek, plan.lastWeek)) {
    await setPlanState(db, older.id, 'superseded');
    const from = older.firstWeek > plan.firstWeek ? older.firstWeek : plan.firstWeek;
    const to = older.lastWeek < plan.lastWeek ? older.lastWeek : plan.lastWeek;
    await appendAudit(db, {
      planId: older.id,
      actor: person,
      action: 'supersede',
      fromState: 'released',
      toState: 'superseded',
      comment: `Superseded by plan version ${plan.id} ("${plan.name}") for the weeks ${from} to ${to}.`,
      inputsHash: older.inputsHash,
      resultsHash: older.resultsHash,
    });
  }
}

/** submitted → supervisors; approved/returned → the submitting planner (released → floor leads: floorLeadGroups). */
async function recipients(db: EntityManager, action: Exclude<PlanAction, 'release'>, plan: PlanRecord): Promise<string[]> {
  const byRole = async (role: Role) =>
    ((await db.query('SELECT email FROM person WHERE role = ? AND active = 1 ORDER BY id', [role])) as { email: string }[]).map((r) => r.email);
  switch (action) {
    case 'submit':
      return byRole('supervisor');
    case 'approve':
    case 'return': {
      if (plan.submittedBy === null) return [];
      const rows: { email: string }[] = await db.query('SELECT email FROM person WHERE id = ? AND active = 1', [plan.submittedBy]);
      return rows.map((r) => r.email);
    }
  }
}
