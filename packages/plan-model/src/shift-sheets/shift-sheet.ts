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
  /** plan week whose production this is, when the job was carried over from an earlier week; null for the week's own work */
  carriedFromWeek: number | null;
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

/**
 * Work still open after the plan's last week (or at a work center with no open time left), listed
 * with its reason, never dropped. `week` is the plan week whose production it is.
 */
export interface UnscheduledWork {
  workCenter: string;
  week: number;
  product: string;
  operation: number;
  quantity: number;
  hours: number;
  reason: string;
}

/** work a week could not finish, carried over into the next week's first open time (ahead of that week's own work) */
export interface CarriedWork {
  workCenter: string;
  /** plan week whose production it is */
  fromWeek: number;
  /** the week it leaves unfinished; it continues in the week after */
  outOfWeek: number;
  product: string;
  operation: number;
  quantity: number;
  /** clock hours still to work (setup included when the step has not begun) */
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
  /** what each shown week hands on to the next (the sheets of week t continue from the plan's first week) */
  carriedOver: CarriedWork[];
  /** overtime the plan gives a work center that finds no room after its shifts (the next shift starts first) */
  overtimeNotPlaced: { workCenter: string; week: number; hours: number }[];
  cautions: WorkingTimeCaution[];
  settings: ShiftSheetSettings;
}
