import type { EntityManager } from 'typeorm';
import { sheetLabourLawNote, type DataIssue, type ShiftSheetsWeek } from '@millrace/contracts';
import { buildShiftSheets, ShiftSheetError, type HorizonWeek, type Plan, type PlanningData, type ShiftSheetResult } from '@millrace/plan-model';
import { AppError } from '../http/app-error';
import { findPlan, loadPlanInputs, loadPlanModelPlan } from '../plans/plans.repository';
import { findApproval } from '../sign-off/audit.repository';
import { assertSheetsReadable } from './sheet-access';
import { currentWorkCenterCodes } from './shift-sheets.repository';
import { toSheetsWeek } from './to-sheets-week';
import { scopeSheetsWeek, workCenterScopeOf, type SheetReader } from './work-center-scope';

export interface ShiftSheetsRequest {
  planId: number;
  /** start date of the week; default the plan's first week */
  week?: string;
  reader: SheetReader;
}

/**
 * One week of shift sheets of a plan version, as the floor works from it: assert the plan exists
 * and may be read (approved or released; floor leads released only), find the week in the plan
 * (its sheets continue from the plan's first week: what earlier weeks could not finish runs first),
 * refuse sheets for work centers deleted since the plan was built, let plan-model sequence the
 * week (its bad input — a loaded work center with no open shift, a routing step without its
 * work center — comes back as 422 naming each item), then add the header data and keep a
 * floor lead's assigned work centers only (all of them when none are assigned). Nothing is
 * stored: the sheets are rebuilt from the approved plan each time.
 */
export async function getShiftSheets(db: EntityManager, req: ShiftSheetsRequest): Promise<ShiftSheetsWeek> {
  const plan = await findPlan(db, req.planId);
  if (!plan) throw AppError.notFound(`Plan version ${req.planId} does not exist.`);
  assertSheetsReadable(plan, req.reader.role);

  const [data, modelPlan] = [await loadPlanInputs(db, plan.id), await loadPlanModelPlan(db, plan.id)];
  if (!data || !modelPlan) throw AppError.conflict(`Plan version ${plan.id} has no stored plan to build shift sheets from; solve it again.`);

  const week = data.weeks.find((w) => w.startDate === (req.week ?? data.weeks[0]?.startDate));
  if (!week) {
    throw AppError.validation('The week is not part of this plan version.', [
      { path: 'query.week', message: `Plan version ${plan.id} covers the weeks starting ${plan.firstWeek} to ${plan.lastWeek}; ${req.week} is not one of them.` },
    ]);
  }

  assertWorkCentersStillExist(plan.id, data, modelPlan, week, await currentWorkCenterCodes(db));
  const result = sequenceWeek(plan.id, data, modelPlan, week.index);
  const approval = await findApproval(db, plan.id);
  const whole = toSheetsWeek({
    plan: { id: plan.id, name: plan.name, state: plan.state, approvedBy: approval?.by ?? null, approvedAt: approval?.at ?? null },
    data,
    modelPlan,
    weekIndex: week.index,
    result,
    labourLawNote: sheetLabourLawNote,
  });
  return scopeSheetsWeek(whole, await workCenterScopeOf(db, req.reader));
}

/**
 * Products made in the week, or in an earlier week whose unfinished work the week carries on,
 * whose routing sends them to a work center the plant no longer has.
 */
function assertWorkCentersStillExist(planId: number, data: PlanningData, modelPlan: Plan, week: HorizonWeek, existing: Set<string>): void {
  const made = new Set(modelPlan.products.filter((l) => l.week <= week.index && l.make > 1e-9).map((l) => l.product));
  const issues: DataIssue[] = data.routings
    .filter((r) => made.has(r.product) && !existing.has(r.workCenter))
    .map((r) => ({
      item: `routing ${r.product} step ${r.sequence}`,
      message: `The routing of ${r.product}, step ${r.sequence}, points at work center ${r.workCenter}, which has been deleted since plan version ${planId} was built. Build and approve a new plan version.`,
    }));
  if (issues.length > 0) {
    throw AppError.unprocessable(`The shift sheets of plan version ${planId} for the week starting ${week.startDate} cannot be built: ${issues.map((i) => i.message).join(' ')}`, issues);
  }
}

function sequenceWeek(planId: number, data: PlanningData, modelPlan: Plan, week: number): ShiftSheetResult {
  try {
    return buildShiftSheets(data, modelPlan, { weeks: [week] });
  } catch (err) {
    if (err instanceof ShiftSheetError) {
      // plan-model numbers weeks within the plan; the floor knows them by their dates (the
      // sheets of a week are built from the plan's first week on, so any earlier week may be named)
      const startOf = (n: string) => data.weeks.find((w) => w.index === Number(n))?.startDate;
      const dated = (text: string) =>
        text
          .replace(/\bin week (\d+)\b/g, (all, n: string) => (startOf(n) ? `in the week starting ${startOf(n)}` : all))
          .replace(/\bweek (\d+)\b/g, (all, n: string) => (startOf(n) ? `week starting ${startOf(n)}` : all));
      const issues = err.issues.map((i) => ({ item: dated(i.item).replace(/ week starting/, ', week starting'), message: dated(i.message) }));
      throw AppError.unprocessable(`The shift sheets of plan version ${planId} cannot be built: ${issues.map((i) => i.message).join('; ')}.`, issues);
    }
    throw err;
  }
}
