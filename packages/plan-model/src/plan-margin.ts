import type { PlanningData } from './planning-data';
import type { MarginBreakdown, MaterialWeekLine, ProductWeekLine, WorkCenterWeekLine } from './plan';
import { holdingCostPerUnitWeek, standardCosts } from './standard-cost';

/**
 * Contribution margin of a plan, computed from the planning data and the plan's quantities
 * (not from the LP): revenue − material purchases − extra unit costs − overtime − holding −
 * late penalties − end-of-horizon backorder penalty − safety-stock shortfall penalty.
 * The same penalty defaults as the model: end-of-horizon penalty latePenalty × T, shortfall
 * penalty half the late penalty, unless the plant settings give them.
 */
export function planMargin(
  data: PlanningData,
  horizonWeeks: number,
  lines: { products: ProductWeekLine[]; workCenters: WorkCenterWeekLine[]; materials: MaterialWeekLine[] },
  /** rolled-up standard costs when the caller already has them (repeated calls) */
  std: Map<string, number> = standardCosts(data),
): MarginBreakdown {
  const product = new Map(data.products.map((p) => [p.code, p]));
  const wc = new Map(data.workCenters.map((w) => [w.code, w]));
  const mat = new Map(data.materials.map((m) => [m.code, m]));
  const b: MarginBreakdown = {
    revenue: 0, materialSpend: 0, extraUnitCost: 0, overtimeCost: 0, holdingCost: 0,
    latePenalty: 0, endBackorderPenalty: 0, safetyShortfallPenalty: 0, margin: 0,
  };
  for (const l of lines.products) {
    const p = product.get(l.product);
    if (!p) continue;
    b.revenue += p.price * l.ship;
    b.extraUnitCost += (p.extraUnitCost ?? 0) * l.make;
    b.holdingCost += holdingCostPerUnitWeek(p, std.get(p.code) ?? 0) * l.stock;
    b.latePenalty += p.latePenalty * l.late;
    if (l.week === horizonWeeks) b.endBackorderPenalty += (data.plant.endBackorderPenaltyPerUnit ?? p.latePenalty * horizonWeeks) * l.late;
    b.safetyShortfallPenalty += (data.plant.safetyShortfallPenaltyPerUnitWeek ?? p.latePenalty / 2) * Math.max(0, p.safetyStock - l.stock);
  }
  for (const l of lines.workCenters) b.overtimeCost += (wc.get(l.workCenter)?.overtimeCostPerHour ?? 0) * l.overtimeHours;
  for (const l of lines.materials) {
    const m = mat.get(l.material);
    if (!m) continue;
    b.materialSpend += m.unitCost * l.buy;
    b.holdingCost += (m.holdingCostPerUnitWeek ?? 0) * l.stock;
  }
  b.margin = b.revenue - b.materialSpend - b.extraUnitCost - b.overtimeCost - b.holdingCost - b.latePenalty - b.endBackorderPenalty - b.safetyShortfallPenalty;
  return b;
}
