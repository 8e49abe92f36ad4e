import type { PlanningData } from '../planning-data';
import type { Plan } from '../plan';
import type { ShiftSheet, ShiftSheetJob, ShiftSheetResult, ShiftSheetSettings, UnscheduledWork } from './shift-sheet';
import { shiftWindows, type ShiftWindow } from './shift-windows';
import { weekOperations, type WeekOperation } from './week-operations';
import { wallClock, weekdayOf } from './plant-clock';
import { workingTimeCautions } from './working-time';
import { componentUsePerUnit } from '../bom-graph';

/**
 * Approved plan → shift sheets: for each work center, day and shift, the jobs in run order with
 * times (issue 8; DOMAIN.md §4). Each week is loaded forward, operation by operation: of the
 * operations whose predecessors are placed, the one that can start earliest (non-delay
 * dispatching), ties in the order of weekOperations (earliest firm due week first, grouped by
 * family and product, sub-assemblies before their parents, routing steps in sequence):
 *
 *  - an operation starts at the latest of: its work center free, the previous routing step's
 *    finish (whole quantity) plus the transfer lag, its sub-assemblies' finish plus the lag;
 *  - a setup is needed when the product changes on the work center (× the family factor when
 *    the previous product is of the same family) and is never started where it cannot finish
 *    inside the shift (overtime included);
 *  - the run fills open shift time, split across shifts when needed (whole units when the
 *    quantity is whole); the split parts add up exactly to the plan's quantity;
 *  - no time outside open shifts: closed weeks, holidays and downtime have no windows;
 *  - overtime from the plan extends the day's last shift and is marked on the jobs in it;
 *  - what does not fit in the week is listed as unscheduled with its reason, never dropped.
 */
export const DEFAULT_SHIFT_SHEET_SETTINGS: ShiftSheetSettings = { transferLagMinutes: 0, familySetupFactor: 1, nightRunDays: 5 };

export interface ShiftSheetIssue {
  item: string;
  message: string;
}

export class ShiftSheetError extends Error {
  constructor(readonly issues: ShiftSheetIssue[]) {
    super(`shift sheets cannot be built: ${issues.map((i) => i.message).join('; ')}`);
    this.name = 'ShiftSheetError';
  }
}

interface Piece {
  op: WeekOperation;
  window: ShiftWindow;
  setupStart: number;
  start: number;
  end: number;
  setupMinutes: number;
  quantity: number;
  continued: boolean;
}

const EPS = 1e-9;

export function buildShiftSheets(data: PlanningData, plan: Plan, options: Partial<ShiftSheetSettings> & { weeks?: number[] } = {}): ShiftSheetResult {
  const settings: ShiftSheetSettings = { ...DEFAULT_SHIFT_SHEET_SETTINGS, ...options };
  if (!(settings.transferLagMinutes >= 0)) throw new ShiftSheetError([{ item: 'settings', message: `transfer lag must be ≥ 0 minutes, got ${settings.transferLagMinutes}` }]);
  if (!(settings.familySetupFactor >= 0 && settings.familySetupFactor <= 1))
    throw new ShiftSheetError([{ item: 'settings', message: `family setup factor must be between 0 and 1, got ${settings.familySetupFactor}` }]);
  if (plan.outcome !== 'optimal') throw new ShiftSheetError([{ item: 'plan', message: `the plan has no production to schedule (outcome ${plan.outcome})` }]);
  const weeks = options.weeks ?? Array.from({ length: plan.horizonWeeks }, (_, i) => i + 1);

  // bad input first, all of it, before anything is built
  const issues: ShiftSheetIssue[] = [];
  const wcByCode = new Map(data.workCenters.map((w) => [w.code, w]));
  const opsByWeek = new Map<number, WeekOperation[]>();
  const windowsOf = new Map<string, ShiftWindow[]>();
  for (const week of weeks) {
    if (!data.weeks.some((w) => w.index === week)) {
      issues.push({ item: `week ${week}`, message: `week ${week} is not in the plan's calendar` });
      continue;
    }
    let ops: WeekOperation[] = [];
    try {
      ops = weekOperations(data, plan, week);
    } catch (e) {
      issues.push({ item: `week ${week}`, message: (e as Error).message });
    }
    opsByWeek.set(week, ops);
    for (const code of new Set(ops.map((o) => o.workCenter))) {
      const wc = wcByCode.get(code)!;
      const overtime = plan.workCenters.find((l) => l.workCenter === code && l.week === week)?.overtimeHours ?? 0;
      const { windows } = shiftWindows(wc, week, overtime);
      windowsOf.set(`${code}|${week}`, windows);
      if (windows.length === 0) {
        const hours = ops.filter((o) => o.workCenter === code).reduce((a, o) => a + (o.setupMinutes + o.quantity * o.runMinutesPerUnit) / 60, 0);
        issues.push({ item: `work center ${code} week ${week}`, message: `work center ${code} has no open shift in week ${week} but the plan loads it with ${hours.toFixed(1)} h` });
      }
    }
  }
  if (issues.length > 0) throw new ShiftSheetError(issues);

  const sheets: ShiftSheet[] = [];
  const unscheduled: UnscheduledWork[] = [];
  for (const week of weeks) {
    const pieces = scheduleWeek(data, week, opsByWeek.get(week)!, windowsOf, settings, unscheduled);
    sheets.push(...toSheets(data, week, pieces, windowsOf));
  }
  return { sheets, unscheduled, cautions: workingTimeCautions(data, sheets, settings.nightRunDays), settings };
}

function scheduleWeek(
  data: PlanningData,
  week: number,
  ops: WeekOperation[],
  windowsOf: Map<string, ShiftWindow[]>,
  settings: ShiftSheetSettings,
  unscheduled: UnscheduledWork[],
): Piece[] {
  const pieces: Piece[] = [];
  const cursor = new Map<string, number>();
  const last = new Map<string, { product: string; family: string | null }>();
  /** per product: end of its latest operation and the quantity that operation completed */
  const done = new Map<string, { end: number; quantity: number }>();
  const lag = settings.transferLagMinutes;

  // Non-delay dispatching (Giffler & Thompson 1960; Baker & Trietsch 2009, ch. on dispatching):
  // of the operations whose predecessors are placed — the product's previous routing step, or
  // for a first step every sub-assembly made this week — place next the one that can start
  // earliest on its work center; ties go to the priority order of weekOperations. A work center
  // thus never waits for a late-released job while work that is ready could run.
  const queues = new Map<string, WeekOperation[]>();
  for (const op of ops) queues.set(op.product, [...(queues.get(op.product) ?? []), op]);
  const priority = [...queues.keys()];
  const componentsOf = new Map<string, string[]>();
  for (const b of data.bom)
    if (b.componentProduct !== undefined && queues.has(b.componentProduct) && queues.has(b.parent) && b.componentProduct !== b.parent)
      componentsOf.set(b.parent, [...(componentsOf.get(b.parent) ?? []), b.componentProduct]);
  const ready = (product: string) => done.has(product) || (componentsOf.get(product) ?? []).every((c) => queues.get(c)!.length === 0);
  const earliestStart = (op: WeekOperation) => {
    const before = done.get(op.product);
    let release = before ? before.end + lag : 0;
    if (!before)
      for (const c of componentsOf.get(op.product) ?? []) {
        const d = done.get(c);
        if (d) release = Math.max(release, d.end + lag);
      }
    return Math.max(cursor.get(op.workCenter) ?? 0, release);
  };
  const next = (): WeekOperation | undefined => {
    let pick: string | undefined;
    let best = Number.POSITIVE_INFINITY;
    for (const product of priority) {
      const head = queues.get(product)![0];
      if (!head || !ready(product)) continue;
      const t = earliestStart(head);
      if (t < best - EPS) [pick, best] = [product, t];
    }
    // nothing ready (a cycle among this week's products): fall back to the priority order
    pick ??= priority.find((p) => queues.get(p)!.length > 0);
    return pick === undefined ? undefined : queues.get(pick)!.shift();
  };

  for (let op = next(); op !== undefined; op = next()) {
    const windows = windowsOf.get(`${op.workCenter}|${week}`)!;
    const before = done.get(op.product);
    let quantity = op.quantity;
    let release = 0;
    if (before) {
      // a later step can only work what the earlier step finished this week
      if (before.quantity < quantity - EPS) {
        unscheduled.push({
          workCenter: op.workCenter, week, product: op.product, operation: op.operation, quantity: quantity - before.quantity,
          hours: ((quantity - before.quantity) * op.runMinutesPerUnit) / 60, reason: 'the previous operation did not finish this quantity in the week',
        });
        quantity = before.quantity;
      }
      release = before.end + lag;
    } else {
      for (const b of data.bom)
        if (b.parent === op.product && b.componentProduct !== undefined) {
          const c = done.get(b.componentProduct);
          if (c) release = Math.max(release, c.end + lag);
        }
    }
    if (quantity <= EPS) {
      done.set(op.product, { end: release, quantity: 0 });
      continue;
    }
    const prev = last.get(op.workCenter);
    const setup = prev?.product === op.product ? 0 : prev && op.family !== null && prev.family === op.family ? op.setupMinutes * settings.familySetupFactor : op.setupMinutes;
    const whole = Math.abs(quantity - Math.round(quantity)) < 1e-9;
    const t0 = Math.max(cursor.get(op.workCenter) ?? 0, release);

    // the setup must finish inside one shift (overtime included)
    let wi = windows.findIndex((w) => Math.max(t0, w.start) + setup <= w.overtimeEnd + EPS && (setup > 0 || Math.max(t0, w.start) < w.overtimeEnd));
    if (wi < 0) {
      unscheduled.push({
        workCenter: op.workCenter, week, product: op.product, operation: op.operation, quantity,
        hours: (setup + quantity * op.runMinutesPerUnit) / 60, reason: 'no open shift time left in the week',
      });
      done.set(op.product, { end: Number.POSITIVE_INFINITY, quantity: 0 });
      continue;
    }
    const setupStart = Math.max(t0, windows[wi].start);
    let cur = setupStart + setup;
    let left = quantity;
    let first = true;
    let end = cur;
    while (left > EPS && wi < windows.length) {
      const w = windows[wi];
      cur = Math.max(cur, w.start);
      const room = w.overtimeEnd - cur;
      let units: number;
      if (op.runMinutesPerUnit <= 0) units = left;
      else if (whole) units = Math.min(left, Math.floor(room / op.runMinutesPerUnit + 1e-9));
      else units = Math.min(left, room / op.runMinutesPerUnit);
      if (!whole && left - units < 1e-9) units = left;
      if (units > EPS || (first && setup > 0)) {
        const runEnd = cur + units * op.runMinutesPerUnit;
        pieces.push({
          op, window: w, setupStart: first && setup > 0 ? setupStart : cur, start: cur, end: runEnd,
          setupMinutes: first ? setup : 0, quantity: units, continued: !first,
        });
        first = false;
        left -= units;
        end = runEnd;
        cur = runEnd;
      }
      if (left > EPS) wi++;
    }
    if (left > EPS) {
      unscheduled.push({
        workCenter: op.workCenter, week, product: op.product, operation: op.operation, quantity: left,
        hours: (left * op.runMinutesPerUnit) / 60, reason: 'no open shift time left in the week',
      });
    }
    cursor.set(op.workCenter, end);
    last.set(op.workCenter, { product: op.product, family: op.family });
    done.set(op.product, { end, quantity: quantity - left });
  }
  return pieces;
}

/** what to issue to the first operation of a job: BOM components × quantity, scrap included */
function issuesFor(data: PlanningData, product: string, quantity: number): ShiftSheetJob['materials'] {
  return data.bom
    .filter((b) => b.parent === product)
    .map((b) => {
      const code = (b.material ?? b.componentProduct)!;
      const item = b.material !== undefined ? data.materials.find((m) => m.code === code) : data.products.find((p) => p.code === code);
      return { item: code, name: item?.name ?? code, quantity: componentUsePerUnit(b) * quantity, unit: item?.unit ?? '' };
    });
}

function toSheets(data: PlanningData, week: number, pieces: Piece[], windowsOf: Map<string, ShiftWindow[]>): ShiftSheet[] {
  const weekStartDate = data.weeks.find((w) => w.index === week)!.startDate;
  const product = new Map(data.products.map((p) => [p.code, p]));
  const sheets: ShiftSheet[] = [];
  for (const wc of data.workCenters) {
    for (const w of windowsOf.get(`${wc.code}|${week}`) ?? []) {
      const mine = pieces.filter((p) => p.op.workCenter === wc.code && p.window === w).sort((a, b) => a.setupStart - b.setupStart);
      if (mine.length === 0) continue;
      const jobs: ShiftSheetJob[] = mine.map((p, i) => ({
        sequence: i + 1,
        product: p.op.product,
        productName: product.get(p.op.product)?.name ?? p.op.product,
        family: p.op.family,
        operation: p.op.operation,
        quantity: p.quantity,
        unit: product.get(p.op.product)?.unit ?? '',
        setupStart: wallClock(weekStartDate, p.setupStart),
        start: wallClock(weekStartDate, p.start),
        end: wallClock(weekStartDate, p.end),
        setupStartMinute: p.setupStart,
        startMinute: p.start,
        endMinute: p.end,
        setupMinutes: p.setupMinutes,
        overtime: p.end > w.end + EPS,
        continued: p.continued,
        dueWeek: p.op.dueWeek,
        orderRefs: p.op.orderRefs,
        previousWorkCenter: p.op.previousWorkCenter,
        nextWorkCenter: p.op.nextWorkCenter,
        materials: p.op.previousWorkCenter === null ? issuesFor(data, p.op.product, p.quantity) : [],
      }));
      sheets.push({
        workCenter: wc.code,
        workCenterName: wc.name,
        week,
        date: wallClock(weekStartDate, w.day * 1440).slice(0, 10),
        weekday: weekdayOf(data.plant.weekStart, w.day),
        shift: w.shift,
        shiftStart: wallClock(weekStartDate, w.start),
        shiftEnd: wallClock(weekStartDate, w.end),
        overtimeEnd: w.overtimeEnd > w.end + EPS ? wallClock(weekStartDate, w.overtimeEnd) : null,
        shiftStartMinute: w.start,
        shiftEndMinute: w.end,
        overtimeEndMinute: w.overtimeEnd > w.end + EPS ? w.overtimeEnd : null,
        availableMinutes: w.end - w.start,
        overtimeMinutes: w.overtimeEnd - w.end,
        plannedMinutes: mine.reduce((a, p) => a + (p.end - p.setupStart), 0),
        jobs,
      });
    }
  }
  return sheets;
}
