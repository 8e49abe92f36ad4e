import { describe, expect, it } from 'vitest';
import { validatePlanningData } from '../src/validate-planning-data';
import { buildModel, PlanningDataError } from '../src/build-model';
import type { PlanningData } from '../src/planning-data';
import { generatePlant } from './support/generate-plant';

/** Bad input named item by item (issue 4, "Bad input"); the API answers 422 with these. */
const good = (): PlanningData => generatePlant(21, { finished: 4, subassemblies: 3, workCenters: 3, materials: 3, weeks: 4 });

const issuesOf = (d: PlanningData, horizon = 4) => validatePlanningData(d, horizon);

describe('validatePlanningData', () => {
  it('finds nothing wrong with a consistent plant', () => {
    expect(issuesOf(good())).toEqual([]);
  });

  it('names a BOM cycle with its path', () => {
    const d = good();
    d.bom.push({ parent: 'S-1', componentProduct: 'S-2', qtyPer: 1, scrapPct: 0 });
    d.bom.push({ parent: 'S-2', componentProduct: 'S-3', qtyPer: 1, scrapPct: 0 });
    d.bom.push({ parent: 'S-3', componentProduct: 'S-1', qtyPer: 1, scrapPct: 0 });
    const cycles = issuesOf(d).filter((i) => i.code === 'bom_cycle');
    expect(cycles).toHaveLength(1);
    expect(cycles[0].message).toMatch(/S-1 → S-2 → S-3 → S-1/);
  });

  it('names a product that contains itself directly', () => {
    const d = good();
    d.bom.push({ parent: 'P-1', componentProduct: 'P-1', qtyPer: 1, scrapPct: 0 });
    expect(issuesOf(d)).toContainEqual({ code: 'bom_cycle', item: 'product P-1', message: 'product P-1 contains itself: P-1 → P-1' });
  });

  it('names a product with demand but no routing', () => {
    const d = good();
    d.routings = d.routings.filter((r) => r.product !== 'P-2');
    expect(issuesOf(d)).toContainEqual(expect.objectContaining({ code: 'demand_without_routing', item: 'product P-2' }));
  });

  it('names negative hours and quantities', () => {
    const d = good();
    d.routings[0].hoursPerUnit = -1;
    d.demand.find((x) => x.kind === 'firm')!.qty = -5;
    d.materials[0].onHand = -2;
    const found = issuesOf(d).filter((i) => i.code === 'negative_value').map((i) => i.item);
    expect(found).toContain(`routing ${d.routings[0].product} step ${d.routings[0].sequence}`);
    expect(found.some((i) => i.startsWith('demand order'))).toBe(true);
    expect(found).toContain('material M-1');
  });

  it('names a work center with no shift pattern', () => {
    const d = good();
    d.workCenters[1].shiftPattern = null;
    expect(issuesOf(d)).toContainEqual(expect.objectContaining({ code: 'work_center_without_calendar', item: 'work center WC-2' }));
  });

  it('names a horizon beyond the calendar and beyond the demand data', () => {
    const d = good();
    expect(issuesOf(d, 6).filter((i) => i.code === 'horizon_beyond_data')).toHaveLength(2);
    d.demand = d.demand.filter((x) => x.week <= 2);
    expect(issuesOf(d, 3)).toContainEqual(expect.objectContaining({ code: 'horizon_beyond_data', message: expect.stringMatching(/week 2/) }));
  });

  it('names unknown references', () => {
    const d = good();
    d.routings.push({ product: 'P-1', sequence: 99, workCenter: 'WC-GONE', hoursPerUnit: 1, setupHours: 0 });
    d.bom.push({ parent: 'P-1', material: 'M-GONE', qtyPer: 1, scrapPct: 0 });
    d.demand.push({ product: 'P-404', week: 1, kind: 'firm', qty: 1, orderRef: '9' });
    const items = issuesOf(d).filter((i) => i.code === 'unknown_reference').map((i) => i.item);
    expect(items).toEqual(['BOM P-1 → M-GONE', 'routing P-1 step 99', 'demand order 9 week 1']);
  });

  it('names duplicate codes, impossible scrap and missing lot sizes', () => {
    const d = good();
    d.products.push({ ...d.products[0] });
    d.bom[0].scrapPct = 100;
    d.materials[0].lotRule = 'fixed_order_quantity';
    d.materials[0].lotSize = undefined;
    const codes = issuesOf(d).map((i) => `${i.code}:${i.item}`);
    expect(codes).toContain('duplicate_code:product P-1');
    expect(codes.some((c) => c.startsWith('invalid_value:BOM'))).toBe(true);
    expect(codes).toContain('invalid_value:material M-1');
  });

  it('buildModel refuses bad data with every issue attached', () => {
    const d = good();
    d.workCenters[0].shiftPattern = null;
    d.routings[0].setupHours = -1;
    try {
      buildModel(d, { horizonWeeks: 4 });
      expect.unreachable('buildModel accepted bad data');
    } catch (e) {
      expect(e).toBeInstanceOf(PlanningDataError);
      expect((e as PlanningDataError).issues.map((i) => i.code).sort()).toEqual(['negative_value', 'work_center_without_calendar']);
    }
  });
});
