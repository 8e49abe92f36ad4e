import type { PlanningData } from './planning-data';
import { findBomCycles } from './bom-graph';

/** What is wrong with one item of the planning data. */
export type ValidationIssueCode =
  | 'bom_cycle'
  | 'demand_without_routing'
  | 'negative_value'
  | 'invalid_value'
  | 'work_center_without_calendar'
  | 'horizon_beyond_data'
  | 'unknown_reference'
  | 'duplicate_code';

export interface ValidationIssue {
  code: ValidationIssueCode;
  /** the item at fault, e.g. "product P-100", "routing P-100 step 20", "BOM P-100 → P-200" */
  item: string;
  message: string;
}

const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/**
 * Checks the planning data for a plan over `horizonWeeks` weeks. Returns every issue found
 * (empty = valid); the API answers 422 with them and writes nothing.
 */
export function validatePlanningData(data: PlanningData, horizonWeeks: number): ValidationIssue[] {
  const issues: ValidationIssue[] = [];
  const add = (code: ValidationIssueCode, item: string, message: string) => issues.push({ code, item, message });
  const nonNegative = (item: string, field: string, v: unknown) => {
    if (!isNum(v)) add('invalid_value', item, `${item}: ${field} must be a finite number, got ${String(v)}`);
    else if (v < 0) add('negative_value', item, `${item}: ${field} is negative (${v})`);
  };
  const weekOk = (item: string, w: number) => {
    if (!Number.isInteger(w) || w < 1 || w > data.weeks.length)
      add('invalid_value', item, `${item}: week ${w} is not a week of the calendar (1..${data.weeks.length})`);
  };

  // horizon
  if (!Number.isInteger(horizonWeeks) || horizonWeeks < 1)
    add('invalid_value', 'horizon', `horizon: ${horizonWeeks} weeks is not a positive whole number`);
  if (horizonWeeks > data.weeks.length)
    add('horizon_beyond_data', 'horizon', `horizon: ${horizonWeeks} weeks asked but the calendar has ${data.weeks.length}`);
  const lastDemandWeek = data.demand.reduce((m, d) => Math.max(m, d.week), 0);
  if (horizonWeeks > lastDemandWeek)
    add(
      'horizon_beyond_data',
      'horizon',
      lastDemandWeek === 0
        ? `horizon: no demand is known in these weeks; enter firm orders or forecast first`
        : `horizon: ${horizonWeeks} weeks asked, but demand is known only up to week ${lastDemandWeek}; plan at most ${lastDemandWeek} weeks or enter firm orders or forecast for the later weeks`,
    );
  data.weeks.forEach((w, i) => {
    if (w.index !== i + 1) add('invalid_value', `week ${w.index}`, `week ${w.index}: weeks must be numbered 1..T in order`);
    if (!/^\d{4}-\d{2}-\d{2}$/.test(w.startDate)) add('invalid_value', `week ${w.index}`, `week ${w.index}: start date "${w.startDate}" is not YYYY-MM-DD`);
  });

  // codes
  const dup = (kind: string, codes: string[]) => {
    const seen = new Set<string>();
    for (const c of codes) {
      if (seen.has(c)) add('duplicate_code', `${kind} ${c}`, `${kind} ${c}: the code is used twice`);
      seen.add(c);
    }
    return seen;
  };
  const products = dup('product', data.products.map((p) => p.code));
  const materials = dup('material', data.materials.map((m) => m.code));
  const workCenters = dup('work center', data.workCenters.map((w) => w.code));

  for (const p of data.products) {
    const item = `product ${p.code}`;
    for (const f of ['price', 'safetyStock', 'openingStock', 'latePenalty'] as const) nonNegative(item, f, p[f]);
    for (const f of ['extraUnitCost', 'holdingCostPerUnitWeek', 'holdingCostAnnualRate'] as const)
      if (p[f] !== undefined) nonNegative(item, f, p[f]);
    if (!isNum(p.batchMultiple) || p.batchMultiple <= 0)
      add('invalid_value', item, `${item}: batchMultiple must be positive, got ${p.batchMultiple}`);
  }

  for (const b of data.bom) {
    const comp = b.componentProduct ?? b.material ?? '?';
    const item = `BOM ${b.parent} → ${comp}`;
    if (!products.has(b.parent)) add('unknown_reference', item, `${item}: parent ${b.parent} is not a product`);
    if ((b.componentProduct === undefined) === (b.material === undefined))
      add('invalid_value', item, `${item}: give exactly one of component product or material`);
    if (b.componentProduct !== undefined && !products.has(b.componentProduct))
      add('unknown_reference', item, `${item}: component ${b.componentProduct} is not a product`);
    if (b.material !== undefined && !materials.has(b.material))
      add('unknown_reference', item, `${item}: material ${b.material} is not a material`);
    nonNegative(item, 'qtyPer', b.qtyPer);
    nonNegative(item, 'scrapPct', b.scrapPct);
    if (isNum(b.scrapPct) && b.scrapPct >= 100) add('invalid_value', item, `${item}: scrap ${b.scrapPct}% leaves nothing usable`);
  }
  for (const cycle of findBomCycles(data.bom))
    add('bom_cycle', `product ${cycle[0]}`, `product ${cycle[0]} contains itself: ${cycle.join(' → ')}`);

  const routed = new Set<string>();
  for (const r of data.routings) {
    const item = `routing ${r.product} step ${r.sequence}`;
    if (!products.has(r.product)) add('unknown_reference', item, `${item}: ${r.product} is not a product`);
    if (!workCenters.has(r.workCenter)) add('unknown_reference', item, `${item}: work center ${r.workCenter} does not exist`);
    nonNegative(item, 'hoursPerUnit', r.hoursPerUnit);
    nonNegative(item, 'setupHours', r.setupHours);
    routed.add(r.product);
  }

  for (const w of data.workCenters) {
    const item = `work center ${w.code}`;
    if (!isNum(w.efficiency) || w.efficiency <= 0 || w.efficiency > 1.5)
      add('invalid_value', item, `${item}: efficiency ${w.efficiency} is outside (0, 1.5]`);
    if (w.overtimeCapHoursPerWeek !== null) nonNegative(item, 'overtimeCapHoursPerWeek', w.overtimeCapHoursPerWeek);
    nonNegative(item, 'overtimeCostPerHour', w.overtimeCostPerHour);
    const s = w.shiftPattern;
    if (!s || !(s.shiftsPerDay > 0) || !(s.hoursPerShift > 0) || !(s.daysPerWeek > 0)) {
      add('work_center_without_calendar', item, `${item}: no shift pattern (shifts, hours and days must be set)`);
    } else {
      if (s.hoursPerShift * s.shiftsPerDay > 24) add('invalid_value', item, `${item}: ${s.shiftsPerDay} shifts of ${s.hoursPerShift} h exceed 24 h a day`);
      if (s.daysPerWeek > 7) add('invalid_value', item, `${item}: ${s.daysPerWeek} days a week`);
      if (s.shiftStarts.length !== s.shiftsPerDay || s.shiftStarts.some((t) => !/^([01]\d|2[0-3]):[0-5]\d$/.test(t)))
        add('invalid_value', item, `${item}: give one start time HH:MM per shift (${s.shiftsPerDay})`);
    }
    for (const e of w.exceptions) {
      const ei = `${item} week ${e.week}`;
      weekOk(ei, e.week);
      for (const f of ['holidayDays', 'downtimeHours', 'extraShiftsPerDay'] as const) if (e[f] !== undefined) nonNegative(ei, f, e[f]);
    }
  }

  for (const m of data.materials) {
    const item = `material ${m.code}`;
    for (const f of ['unitCost', 'onHand', 'leadTimeWeeks'] as const) nonNegative(item, f, m[f]);
    if (isNum(m.leadTimeWeeks) && !Number.isInteger(m.leadTimeWeeks)) add('invalid_value', item, `${item}: lead time must be whole weeks`);
    if (m.weeklySupplyCap !== null) nonNegative(item, 'weeklySupplyCap', m.weeklySupplyCap);
    if (m.holdingCostPerUnitWeek !== undefined) nonNegative(item, 'holdingCostPerUnitWeek', m.holdingCostPerUnitWeek);
    if (m.lotRule !== 'lot_for_lot' && !(isNum(m.lotSize) && m.lotSize > 0))
      add('invalid_value', item, `${item}: lot rule ${m.lotRule} needs a positive lot size`);
    for (const c of m.supplyCapByWeek ?? []) {
      weekOk(`${item} supply cap`, c.week);
      nonNegative(`${item} supply cap week ${c.week}`, 'cap', c.cap);
    }
    for (const r of m.scheduledReceipts) {
      weekOk(`${item} receipt`, r.week);
      nonNegative(`${item} receipt week ${r.week}`, 'qty', r.qty);
    }
  }

  const reported = new Set<string>();
  for (const d of data.demand) {
    const item = `demand ${d.orderRef ? `order ${d.orderRef}` : d.product} week ${d.week}`;
    if (!products.has(d.product)) add('unknown_reference', item, `${item}: ${d.product} is not a product`);
    else if (!routed.has(d.product) && !reported.has(d.product)) {
      reported.add(d.product);
      add('demand_without_routing', `product ${d.product}`, `product ${d.product} has demand but no routing`);
    }
    nonNegative(item, 'qty', d.qty);
    weekOk(item, d.week);
    if (d.mustShip && d.kind !== 'firm') add('invalid_value', item, `${item}: only firm orders can be marked must-ship`);
  }
  return issues;
}
