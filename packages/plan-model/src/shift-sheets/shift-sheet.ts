import type { DispatchRule } from './dispatch-priority';

/**
 * Shift sheets: per work center, day and shift, the ordered jobs to run (issue 8). Times are
 * plant-local wall-clock times "YYYY-MM-DDTHH:MM"; `*Minute` fields count minutes from the start
 * of the plan week (its first day 00:00) for arithmetic and tests.
 */
export interface ShiftSheetJob {
  /** position in the shift's run order, 1-based */
  sequence: number;
  product: string;
  productName: string;
  family: string | null;
  /** routing step (operation) number */
  operation: number;
  quantity: number;
  unit: string;
  /** setup or changeover starts here (equals start when there is none) */
  setupStart: string;
  start: string;
  end: string;
  setupStartMinute: number;
  startMinute: number;
  endMinute: number;
  setupMinutes: number;
  /** part of the job runs in overtime added to the shift */
  overtime: boolean;
  /** this job continues a job begun earlier — in an earlier shift, or before a wait for the next transfer batch (no new setup) */
  continued: boolean;
  /** earliest week with firm orders this production serves, null if none */
  dueWeek: number | null;
  orderRefs: string[];
  previousWorkCenter: string | null;
  nextWorkCenter: string | null;
  /** materials and sub-assemblies to issue for this job (first operation only; scrap included) */
  materials: { item: string; name: string; quantity: number; unit: string }[];
}

export interface ShiftSheet {
  workCenter: string;
  workCenterName: string;
  week: number;
  /** ISO date of the day the shift starts */
  date: string;
  weekday: string;
  /** 1-based shift number of the day */
  shift: number;
  shiftStart: string;
  shiftEnd: string;
  /** end of overtime added to this shift, null without overtime */
  overtimeEnd: string | null;
  shiftStartMinute: number;
  shiftEndMinute: number;
  overtimeEndMinute: number | null;
  availableMinutes: number;
  overtimeMinutes: number;
  /** setup + run minutes planned in this shift (overtime included) */
  plannedMinutes: number;
  jobs: ShiftSheetJob[];
}

/** work the week's open time could not hold (the weekly plan leaves setups to the floor) */
export interface UnscheduledWork {
  workCenter: string;
  week: number;
  product: string;
  operation: number;
  quantity: number;
  hours: number;
  reason: string;
}

export type WorkingTimeCautionKind = 'weekly_hours' | 'daily_rest' | 'night_run';

export interface WorkingTimeCaution {
  kind: WorkingTimeCautionKind;
  workCenter: string;
  week: number;
  /** crew = the crew of this shift number */
  shift: number;
  limit: number;
  actual: number;
  message: string;
  /** where the default limit comes from */
  source: string;
}

export interface ShiftSheetSettings {
  /** minutes between a transfer batch's last unit on one work center and its first on the next (move, cooling, drying) */
  transferLagMinutes: number;
  /**
   * Transfer batch as a share of the week's quantity of a product, 0 < share ≤ 1: a routing step
   * hands its output to the next step (and a sub-assembly to the product using it) batch by
   * batch, so the next step may start once the first batch plus the lag is done (overlapping
   * operations). 1 = the whole quantity moves at once. Rounded up to whole units when the
   * quantity is whole, and never below one unit.
   */
  transferBatchShare: number;
  /** transfer batch in units per product code, overriding the share for that product */
  transferBatchUnits: Record<string, number>;
  /** setup multiplier when the previous job on the work center is of the same family (1 = no saving) */
  familySetupFactor: number;
  /** consecutive night shifts that earn a fatigue caution */
  nightRunDays: number;
  /** which of the operations able to start at once a work center runs first (dispatch-priority.ts) */
  dispatchRule: DispatchRule;
}

export interface ShiftSheetResult {
  sheets: ShiftSheet[];
  unscheduled: UnscheduledWork[];
  cautions: WorkingTimeCaution[];
  settings: ShiftSheetSettings;
}
