import type { MaterialCall } from './material-calls';

/**
 * A plan: what the solution of the planning model (or a rounded/edited version of it) says to
 * do, in plain JSON. Quantities per product and week, load per work center and week, material
 * use and purchases, bottleneck values, reduced costs, unmet orders with their causes.
 * Caps that do not exist are `null` (never Infinity), so a plan survives JSON.
 */

export type PlanOutcome = 'optimal' | 'infeasible' | 'not_solved';

export interface ProductWeekLine {
  product: string;
  week: number;
  make: number;
  /** firm orders shipped this week (on time or from backlog) */
  shipFirm: number;
  /** forecast demand served this week */
  shipForecast: number;
  ship: number;
  /** consumed by parent products made this week */
  usedInParents: number;
  /** end-of-week stock */
  stock: number;
  /** firm backlog at the end of the week */
  late: number;
  /** safety stock minus stock, when positive */
  safetyShortfall: number;
}

export interface WorkCenterWeekLine {
  workCenter: string;
  week: number;
  /** standard hours of load */
  loadHours: number;
  /** standard hours of regular time */
  availableHours: number;
  /** overtime clock hours */
  overtimeHours: number;
  overtimeCapHours: number | null;
  /** load as % of regular time (null when no regular time) */
  loadPct: number | null;
  /** capacity row tight with a positive bottleneck value */
  binding: boolean;
  /** value of one more standard hour of regular time (currency per hour) */
  bottleneckValue: number;
}

export interface MaterialWeekLine {
  material: string;
  week: number;
  /** purchase released this week (arrives after the lead time) */
  buy: number;
  /** purchases arriving this week */
  arriving: number;
  scheduledReceipt: number;
  use: number;
  /** end-of-week stock */
  stock: number;
  supplyCap: number | null;
  /** value of one more unit in stock this week (currency per unit) */
  bottleneckValue: number;
  /** value of one more unit of weekly supply cap in this release week */
  supplyCapValue: number;
}

export type ResourceKind = 'capacity' | 'material' | 'supply_cap';

export interface BottleneckValue {
  kind: ResourceKind;
  /** work center or material code */
  item: string;
  name: string;
  /** weeks in which the resource binds */
  weeks: number[];
  /** value per week (same order as weeks) */
  values: number[];
  /** 'per_hour' or 'per_unit' */
  unit: 'per_hour' | 'per_unit';
  /** e.g. "Edge bander: one more hour is worth 38.10 in week 4, 12.00 in week 5" */
  text: string;
}

export type ProductMarginalOutcome = 'made' | 'not_worth_making' | 'not_needed';

export interface ProductMarginal {
  product: string;
  made: number;
  /**
   * per week, how much margin one more unit made would lose: the reduced cost of make plus,
   * where the week has forecast demand, that of selling it (positive = loses money)
   */
  reducedCostByWeek: number[];
  outcome: ProductMarginalOutcome;
  text: string;
}

export type ShortageCauseKind = 'capacity' | 'supply_cap' | 'lead_time' | 'material' | 'economics';

export interface ShortageCause {
  kind: ShortageCauseKind;
  item: string;
  weeks: number[];
  value?: number;
  text: string;
}

export interface UnmetOrder {
  orderRef: string;
  product: string;
  week: number;
  qty: number;
  shortQty: number;
  /** week the order is complete, or null if not within the horizon */
  completeWeek: number | null;
  causes: ShortageCause[];
  text: string;
}

export interface MarginBreakdown {
  revenue: number;
  materialSpend: number;
  extraUnitCost: number;
  overtimeCost: number;
  holdingCost: number;
  latePenalty: number;
  endBackorderPenalty: number;
  safetyShortfallPenalty: number;
  /** revenue − all costs and penalties above */
  margin: number;
}

export interface Plan {
  horizonWeeks: number;
  currency: string;
  outcome: PlanOutcome;
  /** objective value of the model solved (−margin + smoothing cost) */
  objective: number | null;
  smoothingCost: number;
  margin: MarginBreakdown;
  products: ProductWeekLine[];
  workCenters: WorkCenterWeekLine[];
  materials: MaterialWeekLine[];
  bottlenecks: BottleneckValue[];
  productMarginals: ProductMarginal[];
  unmetOrders: UnmetOrder[];
  /** purchase suggestions from MRP on the plan's production (see material-calls.ts) */
  materialCalls: MaterialCall[];
  /** sentences naming the conflicting requirements when the model is infeasible */
  infeasibility: string[];
}
