import type { DataIssue, ScenarioOverride } from '@millrace/contracts';
import { applyScenario, ScenarioError, type PlanningData, type ScenarioOverride as ScenarioChange } from '@millrace/plan-model';

/**
 * A scenario's overrides (weeks as ISO week-start dates) applied to the plant's current data:
 * dates become the horizon's week numbers, overrides outside the horizon fall away, and an
 * override naming something that does not exist is an issue (422 when creating the plan).
 * The changes themselves are plan-model's applyScenario.
 */
export function applyScenarioOverrides(data: PlanningData, overrides: ScenarioOverride[]): { data: PlanningData; issues: DataIssue[] } {
  const issues: DataIssue[] = [];
  const changes: ScenarioChange[] = [];
  const workCenters = new Set(data.workCenters.map((w) => w.code));
  const materials = new Set(data.materials.map((m) => m.code));
  const products = new Set(data.products.map((p) => p.code));
  overrides.forEach((o, i) => {
    const item = `scenario override ${i + 1} (${o.kind.replace('_', ' ')})`;
    if ('workCenter' in o && !workCenters.has(o.workCenter)) return issues.push({ item, message: `${item}: work center ${o.workCenter} does not exist.` });
    if ('material' in o && !materials.has(o.material)) return issues.push({ item, message: `${item}: material ${o.material} does not exist.` });
    if (o.kind === 'demand_scale' && o.product !== undefined && !products.has(o.product))
      return issues.push({ item, message: `${item}: product ${o.product} does not exist.` });
    const weeks = data.weeks.filter((w) => w.startDate >= o.fromWeek && w.startDate <= o.toWeek).map((w) => w.index);
    if (weeks.length === 0) return;
    const fromWeek = Math.min(...weeks);
    const toWeek = Math.max(...weeks);
    switch (o.kind) {
      case 'extra_shift':
        changes.push({ kind: 'extra_shift', workCenter: o.workCenter, fromWeek, toWeek, shiftsPerDay: o.extraShiftsPerDay });
        break;
      case 'supply_cap':
        changes.push({ kind: 'supply_cap', material: o.material, fromWeek, toWeek, cap: o.weeklySupplyCap });
        break;
      case 'demand_scale':
        changes.push({ kind: 'demand_scale', product: o.product, fromWeek, toWeek, factor: o.factor, demandKind: o.demandKind });
        break;
      case 'maintenance':
        changes.push({ kind: 'maintenance', workCenter: o.workCenter, fromWeek, toWeek });
        break;
    }
  });
  if (issues.length > 0) return { data, issues };
  try {
    return { data: applyScenario(data, changes), issues };
  } catch (err) {
    if (!(err instanceof ScenarioError)) throw err;
    return { data, issues: err.issues.map((i) => ({ item: `scenario override ${i.override + 1}`, message: `scenario override ${i.override + 1}: ${i.message}` })) };
  }
}
