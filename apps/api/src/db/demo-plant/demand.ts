import { demoProducts } from './products';

/** Weeks of demand the demo carries, starting with the current week. */
export const demoWeeks = 13;

/** Share of a week's expected volume already on firm customer orders, by weeks ahead (demo data). */
const firmShareByWeeksAhead = [1, 1, 1, 0.8, 0.6, 0.4, 0.25, 0.15, 0, 0, 0, 0, 0];

/** Large one-off customer orders on top of the usual volume (demo data). */
const contractOrders: Array<{ product: string; weekOffset: number; qty: number; orderRef: string }> = [
  { product: 'CHR-OAK', weekOffset: 1, qty: 36, orderRef: 'SO-HOTEL-BRAMBLE' },
  { product: 'CHR-OAK', weekOffset: 2, qty: 36, orderRef: 'SO-HOTEL-BRAMBLE' },
  { product: 'CHR-ASH-UPH', weekOffset: 3, qty: 4, orderRef: 'SO-CAFE-LINDEN' },
  { product: 'SBD-OAK', weekOffset: 5, qty: 3, orderRef: 'SO-OFFICE-FERN' },
];

/** A small deterministic wobble in [0.85, 1.15] per product and week, so the demo is the same every time. */
function wobble(code: string, week: number): number {
  let h = 2166136261;
  for (const ch of `${code}#${week}`) h = Math.imul(h ^ ch.charCodeAt(0), 16777619) >>> 0;
  return 0.85 + ((h % 1000) / 1000) * 0.3;
}

export interface DemoDemand {
  firm: Array<{ product: string; weekOffset: number; orderRef: string; qty: number }>;
  forecast: Array<{ product: string; weekOffset: number; qty: number }>;
}

/**
 * Firm orders and forecasts for the demo's 13 weeks: each finished good's expected weekly volume
 * (its rate with a gentle seasonal swing and a wobble) is split into firm orders (most of it in
 * the next weeks, none far out) and the forecast of the rest, plus a few large contract orders.
 */
export function demoDemand(): DemoDemand {
  const firm: DemoDemand['firm'] = [];
  const forecast: DemoDemand['forecast'] = [];
  let orderNo = 24100;
  for (const p of demoProducts) {
    if (!p.weeklyRate) continue;
    for (let k = 0; k < demoWeeks; k++) {
      const expected = Math.round(p.weeklyRate * (1 + 0.12 * Math.sin(k / 2)) * wobble(p.code, k));
      const firmQty = Math.round(expected * firmShareByWeeksAhead[k]);
      // split into one to three customer orders
      const parts = firmQty >= 12 ? 3 : firmQty >= 4 ? 2 : firmQty > 0 ? 1 : 0;
      let left = firmQty;
      for (let i = 0; i < parts; i++) {
        const qty = i === parts - 1 ? left : Math.round(firmQty / parts);
        left -= qty;
        firm.push({ product: p.code, weekOffset: k, orderRef: `SO-${orderNo++}`, qty });
      }
      if (expected - firmQty > 0) forecast.push({ product: p.code, weekOffset: k, qty: expected - firmQty });
    }
  }
  for (const c of contractOrders) firm.push({ ...c });
  return { firm, forecast };
}
