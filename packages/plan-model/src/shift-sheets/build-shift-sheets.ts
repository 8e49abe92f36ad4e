import type { PlanningData } from '../planning-data';
import type { Plan } from '../plan';
import type { ShiftSheet, ShiftSheetJob, ShiftSheetResult, ShiftSheetSettings, UnscheduledWork } from './shift-sheet';
import { shiftWindows, type ShiftWindow } from './shift-windows';
import { weekOperations, type WeekOperation } from './week-operations';
import { wallClock, weekdayOf } from './plant-clock';
import { workingTimeCautions } from './working-time';
import { componentUsePerUnit } from '../bom-graph';
import { comparePriority, dispatchPriority, DISPATCH_RULES } from './dispatch-priority';

/**
 * Approved plan → shift sheets: for each work center, day and shift, the jobs in run order with
 * times (issue 8; DOMAIN.md §4). Each week is loaded forward, operation by operation: of the
 * operations whose predecessors are placed, the one that can start earliest fixes the work
 * center and time (non-delay dispatching); of the operations that could start there then, the
 * settings' dispatch rule picks (dispatch-priority.ts; default most work remaining after the
 * operation), remaining ties in the order of weekOperations (earliest firm due week first,
 * grouped by family and product, sub-assemblies before their parents, routing steps in sequence):
 *
 *  - operations overlap by transfer batches (lot streaming: Trietsch & Baker 1993, Basic
 *    techniques for lot streaming, Operations Research 41(6), from memory; DOMAIN.md §4
 *    "previous operation's finish plus transfer"): a product's quantity
 *    moves on in batches (settings.transferBatchShare of the week's quantity, or
 *    settings.transferBatchUnits per product), and batch k of an operation starts at the latest
 *    of: the work center free (after the batch before it), the previous routing step's finish
 *    of batch k plus the transfer lag, and — for a first step — its sub-assemblies' finish of the
 *    same share plus the lag; when the later step is faster it waits for the next batch, and
 *    the sheet shows the continuation as its own line;
 *  - a setup is needed when the product changes on the work center (× the family factor when
 *    the previous product is of the same family) and is never started where it cannot finish
 *    inside the shift (overtime included);
 *  - the run fills open shift time, split across shifts when needed (whole units when the
 *    quantity is whole); the split parts add up exactly to the plan's quantity;
 *  - no time outside open shifts: closed weeks, holidays and downtime have no windows;
 *  - overtime from the plan extends the day's last shift and is marked on the jobs in it;
 *  - what does not fit in the week is listed as unscheduled with its reason, never dropped.
 */
/**
 * Defaults: no transfer lag; transfer batches of a quarter of the week's quantity (four batches,
 * rounded up to whole units — common practice, no source: a split into a few batches gains
 * most of the overlap, smaller ones mostly add handling); no family setup saving; a caution
 * after five nights in a row.
 */
export const DEFAULT_SHIFT_SHEET_SETTINGS: ShiftSheetSettings = {
  transferLagMinutes: 0,
  transferBatchShare: 0.25,
  transferBatchUnits: {},
  familySetupFactor: 1,
  nightRunDays: 5,
  dispatchRule: 'most_work_remaining',
};

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
  if (!(settings.transferBatchShare > 0 && settings.transferBatchShare <= 1))
    throw new ShiftSheetError([{ item: 'settings', message: `transfer batch share must be above 0 and at most 1, got ${settings.transferBatchShare}` }]);
  const badBatches = Object.entries(settings.transferBatchUnits).filter(([, units]) => !(units > 0 && Number.isFinite(units)));
  if (badBatches.length > 0)
    throw new ShiftSheetError(badBatches.map(([product, units]) => ({ item: `product ${product}`, message: `the transfer batch of ${product} must be a positive number of units, got ${units}` })));
  if (!(settings.familySetupFactor >= 0 && settings.familySetupFactor <= 1))
    throw new ShiftSheetError([{ item: 'settings', message: `family setup factor must be between 0 and 1, got ${settings.familySetupFactor}` }]);
  if (!DISPATCH_RULES.includes(settings.dispatchRule))
    throw new ShiftSheetError([{ item: 'settings', message: `dispatch rule must be one of ${DISPATCH_RULES.join(', ')}, got ${String(settings.dispatchRule)}` }]);
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
  /** per product: how its latest operation this week completed its output */
  const done = new Map<string, Completion>();
  const lag = settings.transferLagMinutes;

  // Non-delay dispatching (Giffler & Thompson 1960; Baker & Trietsch 2009, ch. on dispatching):
  // of the operations whose predecessors are placed — the product's previous routing step, or
  // for a first step every sub-assembly made this week — the one that can start earliest fixes
  // its work center and time; of all that could start there at that time the dispatch rule
  // picks, then the priority order of weekOperations. A work center thus never waits for a
  // late-released job while work that is ready could run.
  const queues = new Map<string, WeekOperation[]>();
  for (const op of ops) queues.set(op.product, [...(queues.get(op.product) ?? []), op]);
  const priority = [...queues.keys()];
  const componentsOf = new Map<string, string[]>();
  for (const b of data.bom)
    if (b.componentProduct !== undefined && queues.has(b.componentProduct) && queues.has(b.parent) && b.componentProduct !== b.parent)
      componentsOf.set(b.parent, [...(componentsOf.get(b.parent) ?? []), b.componentProduct]);
  const ready = (product: string) => done.has(product) || (componentsOf.get(product) ?? []).every((c) => queues.get(c)!.length === 0);

  /**
   * What an operation may work and when each of its transfer batches is released: a later
   * routing step gets batch k (cumulative quantity c_k) when the earlier step has completed c_k
   * units, plus the lag, and can only work what the earlier step completed this week; a first
   * step gets batch k when each sub-assembly made this week has completed the same share
   * (c_k ÷ quantity) of what it completed, plus the lag.
   */
  const feed = (op: WeekOperation) => {
    const before = done.get(op.product);
    const quantity = before ? Math.min(op.quantity, before.quantity) : op.quantity;
    const batch = transferBatch(settings, op.product, op.quantity);
    const release = (cumulative: number): number => {
      if (before) return completedAt(before, cumulative) + lag;
      let t = 0;
      for (const b of data.bom)
        if (b.parent === op.product && b.componentProduct !== undefined) {
          const c = done.get(b.componentProduct);
          if (c) t = Math.max(t, completedAt(c, quantity > EPS ? (c.quantity * cumulative) / quantity : c.quantity) + lag);
        }
      return t;
    };
    return { before, quantity, batch, release };
  };
  const earliestStart = (op: WeekOperation) => {
    const f = feed(op);
    return Math.max(cursor.get(op.workCenter) ?? 0, f.release(Math.min(f.batch, f.quantity)));
  };
  const rank = dispatchPriority(data, ops, (code) => windowsOf.get(`${code}|${week}`) ?? [], settings.dispatchRule);
  const next = (): WeekOperation | undefined => {
    // the operation that can start earliest fixes the work center and the time; of the
    // operations that could start on that work center by then (the conflict set), the rule picks
    let first: { product: string; t: number; wc: string } | undefined;
    const heads: { product: string; t: number; op: WeekOperation }[] = [];
    for (const product of priority) {
      const head = queues.get(product)![0];
      if (!head || !ready(product)) continue;
      const t = earliestStart(head);
      heads.push({ product, t, op: head });
      if (!first || t < first.t - EPS) first = { product, t, wc: head.workCenter };
    }
    let pick = first?.product;
    if (first) {
      let best: number[] | undefined;
      for (const h of heads) {
        if (h.op.workCenter !== first.wc || h.t > first.t + EPS) continue;
        const key = rank(h.op);
        if (best === undefined || comparePriority(key, best) < 0) [pick, best] = [h.product, key];
      }
    }
    // nothing ready (a cycle among this week's products): fall back to the priority order
    pick ??= priority.find((p) => queues.get(p)!.length > 0);
    return pick === undefined ? undefined : queues.get(pick)!.shift();
  };

  for (let op = next(); op !== undefined; op = next()) {
    const windows = windowsOf.get(`${op.workCenter}|${week}`)!;
    const { before, quantity, batch, release } = feed(op);
    // a later step can only work what the earlier step finished this week
    if (before && before.quantity < op.quantity - EPS) {
      unscheduled.push({
        workCenter: op.workCenter, week, product: op.product, operation: op.operation, quantity: op.quantity - before.quantity,
        hours: ((op.quantity - before.quantity) * op.runMinutesPerUnit) / 60, reason: 'the previous operation did not finish this quantity in the week',
      });
    }
    if (quantity <= EPS) {
      done.set(op.product, { end: release(0), quantity: 0, runs: [] });
      continue;
    }
    const prev = last.get(op.workCenter);
    const setup = prev?.product === op.product ? 0 : prev && op.family !== null && prev.family === op.family ? op.setupMinutes * settings.familySetupFactor : op.setupMinutes;
    const whole = Math.abs(quantity - Math.round(quantity)) < 1e-9;
    const t0 = Math.max(cursor.get(op.workCenter) ?? 0, release(Math.min(batch, quantity)));

    // the setup must finish inside one shift (overtime included)
    let wi = windows.findIndex((w) => Math.max(t0, w.start) + setup <= w.overtimeEnd + EPS && (setup > 0 || Math.max(t0, w.start) < w.overtimeEnd));
    if (wi < 0) {
      unscheduled.push({
        workCenter: op.workCenter, week, product: op.product, operation: op.operation, quantity,
        hours: (setup + quantity * op.runMinutesPerUnit) / 60, reason: 'no open shift time left in the week',
      });
      done.set(op.product, { end: Number.POSITIVE_INFINITY, quantity: 0, runs: [] });
      continue;
    }
    const setupStart = Math.max(t0, windows[wi].start);
    let cur = setupStart + setup;
    let placed = 0;
    let first = true;
    let end = cur;
    const runs: Completion['runs'] = [];
    let mine: Piece | undefined;
    // batch by batch: each starts at the latest of the work center free and its release
    for (let k = 1; placed < quantity - EPS && wi < windows.length; k++) {
      const target = Math.min(k * batch, quantity);
      let left = target - placed;
      if (left <= EPS) continue;
      if (!first) {
        cur = Math.max(cur, release(target));
        while (wi < windows.length && windows[wi].overtimeEnd - cur <= EPS) wi++;
      }
      while (left > EPS && wi < windows.length) {
        const w = windows[wi];
        cur = Math.max(cur, w.start);
        const room = Math.max(0, w.overtimeEnd - cur);
        let units: number;
        if (op.runMinutesPerUnit <= 0) units = left;
        else if (whole) units = Math.min(left, Math.floor(room / op.runMinutesPerUnit + 1e-9));
        else units = Math.min(left, room / op.runMinutesPerUnit);
        if (!whole && left - units < 1e-9) units = left;
        if (units > EPS || (first && setup > 0)) {
          const runEnd = cur + units * op.runMinutesPerUnit;
          if (units > EPS) runs.push({ start: cur, end: runEnd, before: placed, units });
          if (mine && mine.window === w && Math.abs(mine.end - cur) <= EPS) {
            // the next batch follows on without a wait: one job line
            mine.end = runEnd;
            mine.quantity += units;
          } else {
            mine = {
              op, window: w, setupStart: first && setup > 0 ? setupStart : cur, start: cur, end: runEnd,
              setupMinutes: first ? setup : 0, quantity: units, continued: !first,
            };
            pieces.push(mine);
          }
          first = false;
          left -= units;
          placed += units;
          end = runEnd;
          cur = runEnd;
        }
        if (left > EPS) wi++;
      }
    }
    if (quantity - placed > EPS) {
      unscheduled.push({
        workCenter: op.workCenter, week, product: op.product, operation: op.operation, quantity: quantity - placed,
        hours: ((quantity - placed) * op.runMinutesPerUnit) / 60, reason: 'no open shift time left in the week',
      });
    }
    cursor.set(op.workCenter, end);
    last.set(op.workCenter, { product: op.product, family: op.family });
    done.set(op.product, { end, quantity: placed, runs });
  }
  return pieces;
}

/** how an operation completed its output: runs of units in time order, each at a steady rate */
interface Completion {
  /** end of the operation (its release when it worked nothing, +∞ when it found no room) */
  end: number;
  /** units completed this week */
  quantity: number;
  runs: { start: number; end: number; before: number; units: number }[];
}

/** the minute the operation has completed `cumulative` units (its end from its last unit on) */
function completedAt(c: Completion, cumulative: number): number {
  if (cumulative >= c.quantity - EPS) return c.end;
  for (const r of c.runs) if (r.before + r.units >= cumulative - EPS) return r.start + (Math.max(0, cumulative - r.before) / r.units) * (r.end - r.start);
  return c.end;
}

/**
 * The transfer batch of a product's operations in a week (see ShiftSheetSettings): the product's
 * own size in units, else the share of the week's quantity; at least one unit (or the whole
 * quantity when it is less), whole units when the quantity is whole, at most the quantity.
 */
export function transferBatch(settings: ShiftSheetSettings, product: string, quantity: number): number {
  const raw = Math.max(settings.transferBatchUnits[product] ?? settings.transferBatchShare * quantity, Math.min(1, quantity));
  const whole = Math.abs(quantity - Math.round(quantity)) < 1e-9;
  return Math.min(quantity, whole ? Math.ceil(raw - 1e-9) : raw);
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
