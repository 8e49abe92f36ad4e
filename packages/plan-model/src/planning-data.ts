/**
 * PlanningData: the plain input of the planning model.
 *
 * The API maps MariaDB rows to this shape and keeps it as a JSON snapshot with each plan version,
 * so a plan can be rebuilt exactly. Everything here is JSON-safe: no Infinity (an absent cap is
 * `null`), no Date objects (ISO strings), no Maps.
 *
 * Weeks are numbered 1..T; `week` fields everywhere refer to `HorizonWeek.index`.
 */

export type Weekday = 'monday' | 'tuesday' | 'wednesday' | 'thursday' | 'friday' | 'saturday' | 'sunday';

export interface PlantSettings {
  name?: string;
  /** ISO 4217 code, e.g. "EUR" */
  currency: string;
  weekStart: Weekday;
  /** working-time limit per crew, hours per week averaged (EU Working Time Directive 2003/88/EC Art. 6: 48) */
  maxWeeklyHours: number;
  /** minimum consecutive daily rest per 24 h (EU Working Time Directive 2003/88/EC Art. 3: 11) */
  minDailyRestHours: number;
  /** overtime pay multiplier on the regular rate (US FLSA minimum 1.5; informational for cost set-up) */
  overtimePremium: number;
  /**
   * penalty per unit of safety-stock shortfall and week; when absent each product uses half its
   * late penalty (documented default, see build-model)
   */
  safetyShortfallPenaltyPerUnitWeek?: number;
  /**
   * penalty per unit still backordered at the end of the horizon, on top of lost revenue; when
   * absent each product uses latePenalty × horizon weeks
   */
  endBackorderPenaltyPerUnit?: number;
}

/** Working-time defaults from the EU Working Time Directive 2003/88/EC (Art. 3, Art. 6). */
export const WORKING_TIME_DEFAULTS = { maxWeeklyHours: 48, minDailyRestHours: 11 } as const;
/** Overtime premium default 1.5× (US Fair Labor Standards Act minimum for non-exempt employees). */
export const DEFAULT_OVERTIME_PREMIUM = 1.5;

export interface HorizonWeek {
  /** 1..T */
  index: number;
  /** ISO date (YYYY-MM-DD) of the first day of the week */
  startDate: string;
}

export type ProductKind = 'finished' | 'subassembly';

export interface Product {
  code: string;
  name: string;
  unit: string;
  kind: ProductKind;
  /** selling price per unit (0 for a sub-assembly that is never sold) */
  price: number;
  /** variable cost per unit made beyond purchased materials (outside processing, direct labour paid per piece) */
  extraUnitCost?: number;
  /** holding cost per unit and week; takes precedence over holdingCostAnnualRate */
  holdingCostPerUnitWeek?: number;
  /** holding cost as a fraction of the unit's rolled-up standard cost per year (e.g. 0.24) */
  holdingCostAnnualRate?: number;
  /** soft floor on end-of-week stock */
  safetyStock: number;
  /** production in multiples of this quantity (1 = any whole number) */
  batchMultiple: number;
  openingStock: number;
  /** penalty per unit of firm demand shipped late, per week late */
  latePenalty: number;
  /** changeover group: products of one family follow each other without a full changeover */
  family?: string;
}

/** One line of a bill of materials: exactly one of componentProduct / material is set. */
export interface BomLine {
  parent: string;
  componentProduct?: string;
  material?: string;
  qtyPer: number;
  /** scrap percentage 0..<100: component use is qtyPer / (1 − scrapPct/100) */
  scrapPct: number;
}

export interface RoutingStep {
  product: string;
  sequence: number;
  workCenter: string;
  /** standard run hours per unit */
  hoursPerUnit: number;
  /** setup hours per run (batch) */
  setupHours: number;
}

export interface ShiftPattern {
  shiftsPerDay: number;
  hoursPerShift: number;
  daysPerWeek: number;
  /** start time of each shift, "HH:MM", length shiftsPerDay */
  shiftStarts: string[];
}

export interface CalendarException {
  week: number;
  /** holidays in working days: reduce daysPerWeek */
  holidayDays?: number;
  /** planned downtime (maintenance) in hours */
  downtimeHours?: number;
  /** extra shifts per day on top of the pattern (scenario: an extra shift) */
  extraShiftsPerDay?: number;
  /** closed the whole week (no regular time, no overtime) */
  closed?: boolean;
}

export interface WorkCenter {
  code: string;
  name: string;
  /** standard hours produced per clock hour (0 < efficiency ≤ 1.5) */
  efficiency: number;
  /** overtime clock hours per week allowed; null = no cap */
  overtimeCapHoursPerWeek: number | null;
  overtimeCostPerHour: number;
  /** null/absent = no calendar: a validation issue */
  shiftPattern: ShiftPattern | null;
  exceptions: CalendarException[];
}

export type LotRule = 'lot_for_lot' | 'fixed_order_quantity' | 'minimum_order_quantity' | 'period_order_quantity';

export interface ScheduledReceipt {
  week: number;
  qty: number;
}

export interface Material {
  code: string;
  name: string;
  unit: string;
  unitCost: number;
  onHand: number;
  leadTimeWeeks: number;
  /** most that can be ordered per week; null = no cap */
  weeklySupplyCap: number | null;
  /** caps for single weeks that replace weeklySupplyCap there (e.g. a scenario's supply cut) */
  supplyCapByWeek?: { week: number; cap: number }[];
  lotRule: LotRule;
  /** order quantity for fixed/minimum order quantity; periods covered for period order quantity */
  lotSize?: number;
  scheduledReceipts: ScheduledReceipt[];
  /** cost of holding one unit one week (default 0) */
  holdingCostPerUnitWeek?: number;
}

export type DemandKind = 'firm' | 'forecast';

export interface DemandLine {
  product: string;
  week: number;
  kind: DemandKind;
  qty: number;
  /** customer order reference (firm orders) */
  orderRef?: string;
  /** hard requirement: this firm order must ship complete by its week */
  mustShip?: boolean;
}

export interface PlanningData {
  plant: PlantSettings;
  weeks: HorizonWeek[];
  products: Product[];
  bom: BomLine[];
  routings: RoutingStep[];
  workCenters: WorkCenter[];
  materials: Material[];
  demand: DemandLine[];
}
