import type { PlanningData } from '@millrace/plan-model';
import type { MasterDataRows } from './planning-data.repository';

/**
 * Maps the stored rows to the plain PlanningData of the planning model for the weeks given
 * (week 1 = weekStarts[0]). Pure: no database, no clock.
 *
 * - Products: the active ones, plus any product an included BOM uses (so a BOM never points
 *   outside the data); their demand, BOM lines and routings come along.
 * - Holding cost: the stored % a year becomes the model's annual fraction (24 % → 0.24).
 * - Calendar weeks and demand outside the horizon are left out.
 * - Scheduled receipts due before the horizon are still expected: they count in week 1; later
 *   ones beyond the horizon are left out.
 */
export function toPlanningData(rows: MasterDataRows, weekStarts: string[]): PlanningData {
  const weekIndex = new Map(weekStarts.map((w, i) => [w, i + 1]));
  const productById = new Map(rows.products.map((p) => [p.id, p]));
  const materialById = new Map(rows.materials.map((m) => [m.id, m]));
  const workCenterById = new Map(rows.workCenters.map((w) => [w.id, w]));

  const included = new Set<number>(rows.products.filter((p) => p.active).map((p) => p.id));
  for (let grew = true; grew; ) {
    grew = false;
    for (const line of rows.bom) {
      if (included.has(line.parentProductId) && line.componentProductId !== null && !included.has(line.componentProductId)) {
        included.add(line.componentProductId);
        grew = true;
      }
    }
  }
  const products = rows.products.filter((p) => included.has(p.id));

  return {
    plant: {
      name: rows.settings.plantName,
      currency: rows.settings.currency,
      weekStart: rows.settings.weekStart,
      maxWeeklyHours: rows.settings.maxWeeklyHours,
      minDailyRestHours: rows.settings.minDailyRestHours,
      overtimePremium: rows.settings.overtimePremium,
    },
    weeks: weekStarts.map((startDate, i) => ({ index: i + 1, startDate })),
    products: products.map((p) => ({
      code: p.code,
      name: p.name,
      unit: p.unit,
      kind: p.kind,
      price: p.price,
      holdingCostAnnualRate: p.holdingCostRatePct / 100,
      safetyStock: p.safetyStock,
      batchMultiple: p.batchMultiple,
      openingStock: p.openingStock,
      latePenalty: p.latePenalty,
      ...(p.family !== null && { family: p.family }),
    })),
    bom: rows.bom
      .filter((b) => included.has(b.parentProductId))
      .map((b) => ({
        parent: productById.get(b.parentProductId)!.code,
        ...(b.componentProductId !== null
          ? { componentProduct: productById.get(b.componentProductId)!.code }
          : { material: materialById.get(b.materialId!)!.code }),
        qtyPer: b.qtyPer,
        scrapPct: b.scrapPct,
      })),
    routings: rows.routings
      .filter((r) => included.has(r.productId))
      .map((r) => ({
        product: productById.get(r.productId)!.code,
        sequence: r.sequence,
        workCenter: workCenterById.get(r.workCenterId)!.code,
        hoursPerUnit: r.hoursPerUnit,
        setupHours: r.setupHours,
      })),
    workCenters: rows.workCenters.map((w) => ({
      code: w.code,
      name: w.name,
      efficiency: w.efficiency,
      overtimeCapHoursPerWeek: w.overtimeCapHoursPerWeek,
      overtimeCostPerHour: w.overtimeCostPerHour,
      shiftPattern: { ...w.shiftPattern, shiftStarts: [...w.shiftPattern.shiftStarts] },
      exceptions: rows.calendar
        .filter((c) => c.workCenterId === w.id && weekIndex.has(c.weekStart))
        .map((c) => ({
          week: weekIndex.get(c.weekStart)!,
          ...(c.holidayDays > 0 && { holidayDays: c.holidayDays }),
          ...(c.downtimeHours > 0 && { downtimeHours: c.downtimeHours }),
          ...(c.extraShifts > 0 && { extraShiftsPerDay: c.extraShifts }),
        })),
    })),
    materials: rows.materials.map((m) => ({
      code: m.code,
      name: m.name,
      unit: m.unit,
      unitCost: m.unitCost,
      onHand: m.onHand,
      leadTimeWeeks: m.leadTimeWeeks,
      weeklySupplyCap: m.weeklySupplyCap,
      lotRule: m.lotRule,
      ...(m.lotSize !== null && { lotSize: m.lotSize }),
      scheduledReceipts: receiptsByWeek(rows.receipts.filter((r) => r.materialId === m.id), weekStarts),
    })),
    demand: [
      ...rows.firmOrders
        .filter((o) => included.has(o.productId) && weekIndex.has(o.weekStart) && o.qty > 0)
        .map((o) => ({ product: productById.get(o.productId)!.code, week: weekIndex.get(o.weekStart)!, kind: 'firm' as const, qty: o.qty, orderRef: o.orderRef, ...(o.mustShip && { mustShip: true }) })),
      ...rows.forecasts
        .filter((f) => included.has(f.productId) && weekIndex.has(f.weekStart) && f.qty > 0)
        .map((f) => ({ product: productById.get(f.productId)!.code, week: weekIndex.get(f.weekStart)!, kind: 'forecast' as const, qty: f.qty })),
    ],
  };
}

/** Receipts summed per horizon week; those due before week 1 are still expected and count in week 1. */
function receiptsByWeek(receipts: Array<{ weekStart: string; qty: number }>, weekStarts: string[]): Array<{ week: number; qty: number }> {
  const byWeek = new Map<number, number>();
  const last = weekStarts[weekStarts.length - 1];
  for (const r of receipts) {
    if (r.weekStart > last) continue;
    const idx = r.weekStart < weekStarts[0] ? 1 : weekStarts.findIndex((w) => w === r.weekStart) + 1;
    if (idx < 1) continue;
    byWeek.set(idx, (byWeek.get(idx) ?? 0) + r.qty);
  }
  return [...byWeek.entries()].sort((a, b) => a[0] - b[0]).map(([week, qty]) => ({ week, qty }));
}
