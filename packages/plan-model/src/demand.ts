import type { PlanningData } from './planning-data';

export interface WeeklyDemand {
  /** firm demand per week (index week − 1) */
  firm: number[];
  /** forecast demand per week */
  forecast: number[];
  /** the part of firm demand marked must-ship */
  mustShip: number[];
}

/** Demand per product and week inside the horizon; demand after the horizon is left out. */
export function demandByWeek(data: PlanningData, horizonWeeks: number): Map<string, WeeklyDemand> {
  const zeros = () => new Array<number>(horizonWeeks).fill(0);
  const out = new Map<string, WeeklyDemand>(
    data.products.map((p) => [p.code, { firm: zeros(), forecast: zeros(), mustShip: zeros() }]),
  );
  for (const d of data.demand) {
    if (d.week < 1 || d.week > horizonWeeks) continue;
    const w = out.get(d.product);
    if (!w) continue;
    if (d.kind === 'firm') {
      w.firm[d.week - 1] += d.qty;
      if (d.mustShip) w.mustShip[d.week - 1] += d.qty;
    } else w.forecast[d.week - 1] += d.qty;
  }
  return out;
}
