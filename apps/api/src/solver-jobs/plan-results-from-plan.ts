import type { PlanResults } from '@millrace/contracts';
import type { MaterialCallResult, Plan, PlanningData } from '@millrace/plan-model';
import { demandByWeek } from '@millrace/plan-model';

/** Below this a quantity is shown as nothing (solver noise after snapping). */
const quantityEpsilon = 1e-9;

/**
 * plan-model's Plan (+ its material calls) → the API's typed results. Names and week start dates
 * come from the planning data snapshot the plan was built from.
 */
export function planResultsFromPlan(planId: number, data: PlanningData, plan: Plan, calls: MaterialCallResult): PlanResults {
  const weekStart = (t: number) => data.weeks[t - 1]?.startDate ?? '';
  const productName = new Map(data.products.map((p) => [p.code, p.name]));
  const wcName = new Map(data.workCenters.map((w) => [w.code, w.name]));
  const material = new Map(data.materials.map((m) => [m.code, m]));
  const demand = demandByWeek(data, plan.horizonWeeks);

  const lines = plan.products.map((l) => {
    const d = demand.get(l.product);
    return {
      product: l.product,
      productName: productName.get(l.product) ?? l.product,
      week: l.week,
      weekStart: weekStart(l.week),
      demand: d ? d.firm[l.week - 1] + d.forecast[l.week - 1] : 0,
      make: l.make,
      ship: l.ship,
      stock: l.stock,
      late: l.late,
    };
  });

  const load = plan.workCenters.map((l) => ({
    workCenter: l.workCenter,
    workCenterName: wcName.get(l.workCenter) ?? l.workCenter,
    week: l.week,
    weekStart: weekStart(l.week),
    loadHours: l.loadHours,
    availableHours: l.availableHours,
    percentOfAvailable: l.loadPct,
    overtimeHours: l.overtimeHours,
  }));

  const materialCalls = calls.records.flatMap((rec) => {
    const m = material.get(rec.item);
    if (!m) return [];
    return rec.gross.flatMap((gross, i) => {
      const receipt = rec.plannedReceipts[i] ?? 0;
      const scheduled = rec.scheduledReceipts[i] ?? 0;
      if (gross <= quantityEpsilon && receipt <= quantityEpsilon && scheduled <= quantityEpsilon) return [];
      const week = i + 1;
      const releaseWeek = week - m.leadTimeWeeks;
      return [
        {
          material: m.code,
          materialName: m.name,
          unit: m.unit,
          week,
          weekStart: weekStart(week),
          grossRequirement: gross,
          scheduledReceipt: scheduled,
          projectedAvailable: rec.projectedAvailable[i] ?? 0,
          netRequirement: rec.net[i] ?? 0,
          plannedReceipt: receipt,
          releaseWeek,
          pastDue: receipt > quantityEpsilon && releaseWeek < 1,
          spend: receipt * m.unitCost,
        },
      ];
    });
  });

  const bottlenecks = plan.bottlenecks.map((b) => ({
    kind: b.kind,
    item: b.item,
    itemName: b.name,
    unit: b.unit,
    weeks: b.weeks.map((w, i) => ({ week: w, weekStart: weekStart(w), value: b.values[i] })),
    message: b.text,
  }));

  const reducedCosts = plan.productMarginals.map((m) => ({
    product: m.product,
    productName: productName.get(m.product) ?? m.product,
    made: m.made,
    outcome: m.outcome,
    reducedCostByWeek: m.reducedCostByWeek,
    message: m.text,
  }));

  const unmet = plan.unmetOrders.map((u) => ({
    product: u.product,
    orderRef: u.orderRef,
    week: u.week,
    weekStart: weekStart(u.week),
    qty: u.qty,
    qtyShort: u.shortQty,
    completeWeek: u.completeWeek,
    causes: u.causes.map((c) => ({ kind: c.kind, item: c.item, message: c.text })),
    message: u.text,
  }));

  const m = plan.margin;
  return {
    planId,
    objective: plan.objective === null ? 0 : -plan.objective,
    currency: plan.currency,
    lines,
    load,
    materialCalls,
    bottlenecks,
    reducedCosts,
    unmet,
    totals: {
      margin: m.margin,
      revenue: m.revenue,
      materialSpend: m.materialSpend,
      extraUnitCost: m.extraUnitCost,
      overtimeCost: m.overtimeCost,
      holdingCost: m.holdingCost,
      latePenalty: m.latePenalty,
      endBackorderPenalty: m.endBackorderPenalty,
      safetyShortfallPenalty: m.safetyShortfallPenalty,
      smoothingCost: plan.smoothingCost,
      overtimeHours: plan.workCenters.reduce((a, l) => a + l.overtimeHours, 0),
      unmetQty: plan.unmetOrders.reduce((a, u) => a + u.shortQty, 0),
    },
  };
}
