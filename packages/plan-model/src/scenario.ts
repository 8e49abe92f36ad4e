import type { PlanningData, DemandKind } from './planning-data';
import { supplyCap } from './material-supply';

/**
 * A scenario: named what-if overrides on the plant's data, solved as its own plan version.
 * Overrides are plain data (kept as JSON with the scenario); applyScenario returns a changed
 * copy of the planning data and never touches the original.
 */
export type ScenarioOverride =
  | {
      kind: 'extra_shift';
      workCenter: string;
      fromWeek: number;
      toWeek: number;
      /** extra shifts per day (default 1) */
      shiftsPerDay?: number;
    }
  | {
      kind: 'supply_cap';
      material: string;
      fromWeek: number;
      toWeek: number;
      /** new cap per week; give this or factor */
      cap?: number;
      /** multiply the current cap (e.g. 0.5 = cut by half); a material with no cap cannot be scaled */
      factor?: number;
    }
  | {
      kind: 'demand_scale';
      /** product code; absent = every product */
      product?: string;
      factor: number;
      /** which demand (default both) */
      demandKind?: DemandKind;
      fromWeek?: number;
      toWeek?: number;
    }
  | {
      kind: 'maintenance';
      workCenter: string;
      fromWeek: number;
      toWeek: number;
    };

export interface ScenarioIssue {
  /** position of the override in the list */
  override: number;
  message: string;
}

export class ScenarioError extends Error {
  constructor(readonly issues: ScenarioIssue[]) {
    super(`scenario has ${issues.length} bad override(s): ${issues.map((i) => `#${i.override + 1}: ${i.message}`).join('; ')}`);
    this.name = 'ScenarioError';
  }
}

export function applyScenario(data: PlanningData, overrides: ScenarioOverride[]): PlanningData {
  const out: PlanningData = structuredClone(data);
  const issues: ScenarioIssue[] = [];
  const T = data.weeks.length;
  const weeksOk = (i: number, from: number, to: number) => {
    if (!Number.isInteger(from) || !Number.isInteger(to) || from < 1 || to > T || from > to) {
      issues.push({ override: i, message: `weeks ${from}–${to} are not a range inside 1–${T}` });
      return false;
    }
    return true;
  };
  const range = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, k) => from + k);

  overrides.forEach((o, i) => {
    switch (o.kind) {
      case 'extra_shift':
      case 'maintenance': {
        const wc = out.workCenters.find((w) => w.code === o.workCenter);
        if (!wc) return issues.push({ override: i, message: `work center ${o.workCenter} does not exist` });
        if (!weeksOk(i, o.fromWeek, o.toWeek)) return;
        const extra = o.kind === 'extra_shift' ? (o.shiftsPerDay ?? 1) : 0;
        if (o.kind === 'extra_shift' && !(extra > 0 && Number.isInteger(extra)))
          return issues.push({ override: i, message: `extra shifts per day must be a positive whole number, got ${extra}` });
        if (o.kind === 'extra_shift' && wc.shiftPattern && (wc.shiftPattern.shiftsPerDay + extra) * wc.shiftPattern.hoursPerShift > 24)
          return issues.push({ override: i, message: `${o.workCenter}: ${wc.shiftPattern.shiftsPerDay + extra} shifts of ${wc.shiftPattern.hoursPerShift} h exceed 24 h a day` });
        for (const week of range(o.fromWeek, o.toWeek))
          wc.exceptions.push(o.kind === 'extra_shift' ? { week, extraShiftsPerDay: extra } : { week, closed: true });
        return;
      }
      case 'supply_cap': {
        const m = out.materials.find((x) => x.code === o.material);
        if (!m) return issues.push({ override: i, message: `material ${o.material} does not exist` });
        if (!weeksOk(i, o.fromWeek, o.toWeek)) return;
        if ((o.cap === undefined) === (o.factor === undefined)) return issues.push({ override: i, message: 'give either a new cap or a factor' });
        if ((o.cap ?? 0) < 0 || (o.factor ?? 0) < 0) return issues.push({ override: i, message: 'a supply cap cannot be negative' });
        const caps = m.supplyCapByWeek ?? [];
        for (const week of range(o.fromWeek, o.toWeek)) {
          const current = supplyCap(m, week);
          if (o.factor !== undefined && current === null)
            return issues.push({ override: i, message: `material ${o.material} has no supply cap to scale; give a cap instead` });
          const cap = o.cap ?? current! * o.factor!;
          const k = caps.findIndex((c) => c.week === week);
          if (k >= 0) caps[k] = { week, cap };
          else caps.push({ week, cap });
        }
        m.supplyCapByWeek = caps;
        return;
      }
      case 'demand_scale': {
        if (o.product !== undefined && !out.products.some((p) => p.code === o.product))
          return issues.push({ override: i, message: `product ${o.product} does not exist` });
        if (!(o.factor >= 0)) return issues.push({ override: i, message: `demand factor must be ≥ 0, got ${o.factor}` });
        const from = o.fromWeek ?? 1;
        const to = o.toWeek ?? T;
        if (!weeksOk(i, from, to)) return;
        for (const d of out.demand)
          if ((o.product === undefined || d.product === o.product) && (o.demandKind === undefined || d.kind === o.demandKind) && d.week >= from && d.week <= to)
            d.qty *= o.factor;
        return;
      }
      default:
        issues.push({ override: i, message: `unknown override kind ${(o as { kind: string }).kind}` });
    }
  });
  if (issues.length > 0) throw new ScenarioError(issues);
  return out;
}
