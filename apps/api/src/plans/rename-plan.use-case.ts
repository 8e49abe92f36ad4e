import type { DataSource } from 'typeorm';
import type { PlanDetail, PlanUpdate } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { isEditable } from '../sign-off/plan-state-machine';
import { findPlan, findPlanDetail, renamePlanIfVersion } from './plans.repository';

/** Renames a draft or returned version; approved, released and superseded ones are immutable (409). */
export async function renamePlan(ds: DataSource, planId: number, input: PlanUpdate): Promise<PlanDetail> {
  await ds.transaction(async (db) => {
    const plan = await findPlan(db, planId, 'lock');
    if (!plan) throw AppError.notFound(`Plan version ${planId} does not exist.`);
    if (!isEditable(plan.state)) throw AppError.conflict(`Plan version ${planId} is ${plan.state} and can no longer change.`);
    if ((await renamePlanIfVersion(db, planId, input.version, input.name)) === 'version_mismatch')
      throw AppError.conflict(`Someone else changed plan version ${planId} since you opened it; reload to see their change.`);
  });
  return (await findPlanDetail(ds.manager, planId))!;
}
