import { describe, expect, it } from 'vitest';
import { economicOrderQuantity, lotSizingCost, netItem, periodOrderQuantityPeriods, runMrp } from '../src/mrp';

const at = (periods: number, entries: Record<number, number>) =>
  Array.from({ length: periods }, (_, i) => entries[i + 1] ?? 0);

describe('MRP netting (Orlicky, Material Requirements Planning, figs 7-2 to 7-4; DOMAIN.md §2 row 4)', () => {
  it('nets gross requirements against on hand and a scheduled receipt: net 7 in period 6 and 12 in period 7', () => {
    const gross = at(8, { 2: 20, 4: 25, 6: 15, 7: 12 });
    const rec = netItem({ code: 'X', onHand: 23, leadTime: 0, scheduledReceipts: at(8, { 3: 30 }) }, gross, 8);
    expect(rec.net).toEqual(at(8, { 6: 7, 7: 12 }));
    // projected available from the same figure: 23, 3, 33, 8, 8, 0, 0, 0
    expect(rec.projectedAvailable).toEqual([23, 3, 33, 8, 8, 0, 0, 0]);
  });
});

describe('MRP explosion (Orlicky, fig 7-10; DOMAIN.md §2 row 5)', () => {
  // A gross 10, 0, 15, 10, 20, 5, 0, 10, 15; receipt 14 in period 3; on hand 12.
  // B: 1 per A, on hand 28. C: 1 per B, on hand 8. Lot-for-lot, lead time 2 for all.
  const result = runMrp({
    periods: 9,
    items: [
      { code: 'A', onHand: 12, leadTime: 2, scheduledReceipts: at(9, { 3: 14 }) },
      { code: 'B', onHand: 28, leadTime: 2 },
      { code: 'C', onHand: 8, leadTime: 2 },
    ],
    links: [
      { parent: 'A', component: 'B', qtyPer: 1 },
      { parent: 'B', component: 'C', qtyPer: 1 },
    ],
    independentDemand: { A: [10, 0, 15, 10, 20, 5, 0, 10, 15] },
  });
  it('plans A releases 9, 20, 5, 10, 15 in periods 2, 3, 4, 6, 7', () => {
    expect(result.get('A')!.plannedReleases).toEqual(at(9, { 2: 9, 3: 20, 4: 5, 6: 10, 7: 15 }));
  });
  it('plans B releases 1, 5, 10, 15 in periods 1, 2, 4, 5', () => {
    expect(result.get('B')!.plannedReleases).toEqual(at(9, { 1: 1, 2: 5, 4: 10, 5: 15 }));
  });
  it('plans C releases 8, 15 in periods 2, 3', () => {
    expect(result.get('C')!.plannedReleases).toEqual(at(9, { 2: 8, 3: 15 }));
  });
  it('explodes in low-level-code order', () => {
    expect([...result.values()].map((r) => [r.item, r.lowLevelCode])).toEqual([['A', 0], ['B', 1], ['C', 2]]);
  });
});

describe('MRP lot sizing (Orlicky, figs 8-2, 8-3, 8-15; DOMAIN.md §2 row 6)', () => {
  // net requirements periods 1–9; setup 100; unit cost 50; carrying 24 %/yr = 1 per unit-period
  const req = [35, 10, 0, 40, 0, 20, 5, 10, 30];
  const item = { code: 'X', onHand: 0, leadTime: 0 };
  it('EOQ is 58', () => {
    expect(Math.round(economicOrderQuantity(150 / 9, 100, 1))).toBe(58);
  });
  it('fixed order quantity 58 orders in periods 1, 4, 8 and costs 506', () => {
    const rec = netItem({ ...item, lotRule: 'fixed_order_quantity', lotSize: 58 }, req, 9);
    expect(rec.plannedReceipts).toEqual(at(9, { 1: 58, 4: 58, 8: 58 }));
    expect(lotSizingCost(rec.plannedReceipts, req, 100, 1)).toBe(506);
  });
  it('period order quantity (P = EOQ ÷ average demand = 3) orders 85@1, 35@6, 30@9 and costs 455', () => {
    const P = periodOrderQuantityPeriods(58, 150 / 9);
    expect(P).toBe(3);
    const rec = netItem({ ...item, lotRule: 'period_order_quantity', lotSize: P }, req, 9);
    expect(rec.plannedReceipts).toEqual(at(9, { 1: 85, 6: 35, 9: 30 }));
    expect(lotSizingCost(rec.plannedReceipts, req, 100, 1)).toBe(455);
  });
  it('lot-for-lot costs 700 (7 setups)', () => {
    const rec = netItem(item, req, 9);
    expect(rec.plannedReceipts).toEqual(req);
    expect(lotSizingCost(rec.plannedReceipts, req, 100, 1)).toBe(700);
  });
  it('minimum order quantity raises small orders to the minimum (common practice, no source)', () => {
    const rec = netItem({ ...item, lotRule: 'minimum_order_quantity', lotSize: 30 }, [10, 0, 65], 3);
    expect(rec.plannedReceipts).toEqual([30, 0, 45]);
  });
  it('flags a release that falls before period 1 as past due', () => {
    const rec = netItem({ code: 'Y', onHand: 0, leadTime: 2 }, [5, 0, 7], 3);
    expect(rec.pastDue).toEqual([{ needPeriod: 1, releasePeriod: -1, qty: 5 }]);
    expect(rec.plannedReleases).toEqual([7, 0, 0]);
  });
  it('rejects a lot rule without a lot size', () => {
    expect(() => netItem({ ...item, lotRule: 'fixed_order_quantity' }, req, 9)).toThrow(/lot size/);
  });
});
