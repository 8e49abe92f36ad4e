import type { EntityManager } from 'typeorm';
import { planSummarySchema, type Caution, type PlanResults, type PlanReview } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { findPlan, findPlanDetail, loadPlanInputs, loadPlanResults, toSummary } from '../plans/plans.repository';
import { lastApprovedPlanId } from './audit.repository';
import { advisoryCaution, workingTimeCautions } from './working-time-cautions';

/** Changes smaller than this are not listed (solver noise). */
const changeEpsilon = 1e-6;

/**
 * What a supervisor reviews: the plan against the last approved version (quantities made, load
 * and overtime per work center and week, unmet orders, margin), its certificate, and cautions.
 */
export async function reviewPlan(db: EntityManager, planId: number): Promise<PlanReview> {
  const detail = await findPlanDetail(db, planId);
  if (!detail) throw AppError.notFound(`Plan version ${planId} does not exist.`);
  const results = await loadPlanResults(db, planId);
  if (!results) throw AppError.conflict(`Plan version ${planId} has no results to review (its solve status is ${detail.solveStatus}).`);
  const inputs = await loadPlanInputs(db, planId);

  const baselineId = await lastApprovedPlanId(db, planId);
  const baselineRecord = baselineId === null ? null : await findPlan(db, baselineId);
  const before = baselineId === null ? null : await loadPlanResults(db, baselineId);

  const cautions: Caution[] = [advisoryCaution, ...(inputs ? workingTimeCautions(inputs, results) : [])];
  if (results.unmet.length > 0) {
    cautions.push({
      kind: 'unmet_orders',
      item: null,
      week: null,
      message: `${results.unmet.length === 1 ? '1 firm order is' : `${results.unmet.length} firm orders are`} not shipped in full on time (${round(results.totals.unmetQty)} units short in total).`,
    });
  }
  const check = detail.certificate?.crossCheck;
  if (check && check.status !== 'verified') {
    cautions.push({ kind: 'unverified', item: null, week: null, message: `The independent cross-check has not verified this plan: ${check.message}` });
  }

  return {
    plan: planSummarySchema.parse(detail),
    baseline: baselineRecord ? toSummary(baselineRecord) : null,
    certificate: detail.certificate,
    changes: {
      margin: change(before?.totals.margin ?? 0, results.totals.margin),
      overtimeHours: change(before?.totals.overtimeHours ?? 0, results.totals.overtimeHours),
      unmetQty: change(before?.totals.unmetQty ?? 0, results.totals.unmetQty),
      quantities: diff(
        before?.lines.map((l) => ({ key: [l.product, l.weekStart], v: l.make })) ?? [],
        results.lines.map((l) => ({ key: [l.product, l.weekStart], v: l.make })),
      ).map(([product, weekStart, c]) => ({ product, weekStart, ...c })),
      load: diff(loadOf(before, 'loadHours'), loadOf(results, 'loadHours')).map(([workCenter, weekStart, c]) => ({ workCenter, weekStart, ...c })),
      overtime: diff(loadOf(before, 'overtimeHours'), loadOf(results, 'overtimeHours')).map(([workCenter, weekStart, c]) => ({
        workCenter,
        weekStart,
        ...c,
      })),
    },
    unmet: { before: before?.unmet ?? [], after: results.unmet },
    cautions,
  };
}

type Keyed = { key: [string, string]; v: number };
type Change = { before: number; after: number; delta: number };

function change(before: number, after: number): Change {
  return { before, after, delta: after - before };
}

function loadOf(results: PlanResults | null, field: 'loadHours' | 'overtimeHours'): Keyed[] {
  return results?.load.map((l) => ({ key: [l.workCenter, l.weekStart], v: l[field] })) ?? [];
}

/** Rows whose value differs between the two plans, matched by item and calendar week. */
function diff(before: Keyed[], after: Keyed[]): [string, string, Change][] {
  const map = new Map<string, { key: [string, string]; before: number; after: number }>();
  for (const b of before) map.set(b.key.join('|'), { key: b.key, before: b.v, after: 0 });
  for (const a of after) {
    const k = a.key.join('|');
    const e = map.get(k) ?? { key: a.key, before: 0, after: 0 };
    e.after = a.v;
    map.set(k, e);
  }
  return [...map.values()]
    .filter((e) => Math.abs(e.after - e.before) > changeEpsilon)
    .sort((x, y) => x.key[0].localeCompare(y.key[0]) || x.key[1].localeCompare(y.key[1]))
    .map((e) => [e.key[0], e.key[1], change(e.before, e.after)]);
}

const round = (v: number) => Math.round(v * 100) / 100;
