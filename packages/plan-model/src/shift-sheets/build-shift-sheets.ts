import type { PlanningData } from '../planning-data';
import type { Plan } from '../plan';
import type { CarriedWork, ShiftSheet, ShiftSheetJob, ShiftSheetResult, ShiftSheetSettings, UnscheduledWork } from './shift-sheet';
import { shiftWindows, type ShiftWindow } from './shift-windows';
import { weekOperations, type WeekOperation } from './week-operations';
import { wallClock, weekdayOf } from './plant-clock';
import { workingTimeCautions } from './working-time';
import { componentUsePerUnit } from '../bom-graph';
import { comparePriority, dispatchPriority, DISPATCH_RULES } from './dispatch-priority';

/**
 * Approved plan → shift sheets: for each work center, day and shift, the jobs in run order with
 * times (issue 8; DOMAIN.md §4). The weeks are loaded forward from the plan's first week,
 * operation by operation: of the operations whose predecessors are placed, the one that can
 * start earliest fixes the work center and time (non-delay dispatching); of the operations that
 * could start there then, work carried over from an earlier week goes first, then the settings'
 * dispatch rule picks (dispatch-priority.ts; default most work remaining after the operation),
 * remaining ties in the order of weekOperations (earliest firm due week first, grouped by family
 * and product, sub-assemblies before their parents, routing steps in sequence):
 *
 *  - each week has the open clock time of the plan's capacity model (shift-windows.ts over
 *    capacity.ts) plus the plan's overtime, so the sheets and the plan count the same hours;
 *  - operations overlap by transfer batches (lot streaming: Trietsch & Baker 1993, Basic
 *    techniques for lot streaming, Operations Research 41(6), from memory; DOMAIN.md §4
 *    "previous operation's finish plus transfer"): a product's quantity
 *    moves on in batches (settings.transferBatchShare of the week's quantity, or
 *    settings.transferBatchUnits per product), and batch k of an operation starts at the latest
 *    of: the work center free (after the batch before it), the previous routing step's finish
 *    of batch k plus the transfer lag, and — for a first step — its sub-assemblies' finish of the
 *    same share of their plan quantity plus the lag; when the later step is faster it waits for
 *    the next batch, and the sheet shows the continuation as its own line;
 *  - a setup is needed when the product changes on the work center (× the family factor when
 *    the previous product is of the same family) and is never started where it cannot finish
 *    inside the shift (overtime included);
 *  - the run fills open shift time, split across shifts when needed (whole units when the
 *    quantity is whole); the split parts add up exactly to the plan's quantity;
 *  - no time outside open shifts: closed weeks, holidays and downtime have no windows;
 *  - overtime from the plan extends the day's last shift and is marked on the jobs in it;
 *  - what a week cannot finish — its open time is used up, or the previous step (a
 *    sub-assembly made the same week on a loaded work center) finished late — is carried over
 *    into the next week, marked with the plan week it belongs to, ahead of that week's own work;
 *    so the jobs of a plan week's product add up to its quantity over that week and the weeks
 *    after, and the sheets of week t are computed from the plan's first week on;
 *  - only what is still open after the plan's last week is listed as unscheduled, with its
 *    reason, never dropped.
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

/** one plan week's production of a product (a lot): its routing steps in order */
interface Lot {
  product: string;
  week: number;
  quantity: number;
  ops: LotOperation[];
  /** lots of the sub-assemblies made for it in the same plan week (with routing steps) */
  components: Lot[];
  /** position in the week's base order (weekOperations) */
  order: number;
}

/** one routing step of a lot, worked over one or more weeks */
interface LotOperation {
  op: WeekOperation;
  lot: Lot;
  /** step index in the lot's routing */
  index: number;
  batch: number;
  whole: boolean;
  /** units worked so far, over every week */
  placed: number;
  /** how the step completed its units, in minutes from the plan's first week */
  completion: Completion;
  /** why the step stopped short in the latest week it was dispatched */
  short: 'previous' | 'time' | null;
}

interface Piece {
  lo: LotOperation;
  /** the sheet week the piece runs in */
  week: number;
  window: ShiftWindow;
  /** minutes from the start of the plan's first week */
  setupStart: number;
  start: number;
  end: number;
  setupMinutes: number;
  quantity: number;
  continued: boolean;
}

const EPS = 1e-9;
const tol = (quantity: number) => 1e-9 * (1 + Math.abs(quantity));

export function buildShiftSheets(data: PlanningData, plan: Plan, options: Partial<ShiftSheetSettings> & { weeks?: number[] } = {}): ShiftSheetResult {
  const { weeks: asked, ...rest } = options;
  const settings: ShiftSheetSettings = { ...DEFAULT_SHIFT_SHEET_SETTINGS, ...rest };
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
  const planWeeks = Array.from({ length: plan.horizonWeeks }, (_, i) => i + 1);
  const weeks = asked ?? planWeeks;
  const outside = weeks.filter((w) => !planWeeks.includes(w) || !data.weeks.some((x) => x.index === w));
  if (outside.length > 0) throw new ShiftSheetError(outside.map((w) => ({ item: `week ${w}`, message: `week ${w} is not in the plan's calendar` })));
  // the sheets of a week continue from the plan's first week: earlier weeks hand on what they could not finish
  const lastWeek = Math.max(0, ...weeks);
  const simulated = planWeeks.filter((w) => w <= lastWeek);

  // bad input first, all of it, before anything is built
  const issues: ShiftSheetIssue[] = [];
  const wcByCode = new Map(data.workCenters.map((w) => [w.code, w]));
  const opsByWeek = new Map<number, WeekOperation[]>();
  const windowsOf = new Map<string, ShiftWindow[]>();
  const overtimeNotPlaced: ShiftSheetResult['overtimeNotPlaced'] = [];
  for (const week of simulated) {
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
    for (const wc of data.workCenters) {
      const overtime = plan.workCenters.find((l) => l.workCenter === wc.code && l.week === week)?.overtimeHours ?? 0;
      const { windows, unplacedOvertimeMinutes } = shiftWindows(wc, week, overtime);
      windowsOf.set(`${wc.code}|${week}`, windows);
      if (unplacedOvertimeMinutes > 1e-6) overtimeNotPlaced.push({ workCenter: wc.code, week, hours: unplacedOvertimeMinutes / 60 });
      const mine = ops.filter((o) => o.workCenter === wc.code);
      // named for the weeks asked for; an earlier week's such load is carried into the next open time
      if (windows.length === 0 && mine.length > 0 && weeks.includes(week)) {
        const hours = mine.reduce((a, o) => a + (o.setupMinutes + o.quantity * o.runMinutesPerUnit) / 60, 0);
        issues.push({ item: `work center ${wc.code} week ${week}`, message: `work center ${wc.code} has no open shift in week ${week} but the plan loads it with ${hours.toFixed(1)} h` });
      }
    }
    for (const code of new Set(ops.map((o) => o.workCenter)))
      if (!wcByCode.has(code)) issues.push({ item: `work center ${code}`, message: `work center ${code} does not exist` });
  }
  if (issues.length > 0) throw new ShiftSheetError(issues);

  // minutes from the plan's first week to the start of each week
  const firstStart = Date.parse(`${data.weeks.find((w) => w.index === (simulated[0] ?? 1))?.startDate ?? '1970-01-01'}T00:00:00Z`);
  const offsetOf = new Map(simulated.map((w) => [w, Math.round((Date.parse(`${data.weeks.find((x) => x.index === w)!.startDate}T00:00:00Z`) - firstStart) / 60000)]));

  const { pieces, left, carriedOver } = scheduleWeeks(data, simulated, opsByWeek, windowsOf, offsetOf, settings);
  const shown = new Set(weeks);
  const sheets: ShiftSheet[] = [];
  for (const week of simulated)
    if (shown.has(week)) sheets.push(...toSheets(data, week, offsetOf.get(week)!, pieces.filter((p) => p.week === week), windowsOf));

  // what is still open after the plan's last week stays on paper as unscheduled, with its reason
  const unscheduled: UnscheduledWork[] = [];
  if (lastWeek === plan.horizonWeeks)
    for (const lo of left) {
      const remaining = lo.op.quantity - lo.placed;
      const openLater = simulated.some((w) => w >= lo.lot.week && (windowsOf.get(`${lo.op.workCenter}|${w}`) ?? []).length > 0);
      unscheduled.push({
        workCenter: lo.op.workCenter, week: lo.lot.week, product: lo.op.product, operation: lo.op.operation, quantity: remaining,
        hours: remainingHours(lo),
        reason: !openLater
          ? `work center ${lo.op.workCenter} has no open shift time from week ${lo.lot.week} to the plan's last week`
          : lo.short === 'previous'
            ? `the previous operation did not finish this quantity by the end of the plan's last week (week ${lastWeek})`
            : `no open shift time left by the end of the plan's last week (week ${lastWeek})`,
      });
    }
  return {
    sheets,
    unscheduled,
    carriedOver: carriedOver.filter((c) => shown.has(c.outOfWeek)),
    overtimeNotPlaced: overtimeNotPlaced.filter((o) => shown.has(o.week)),
    cautions: workingTimeCautions(data, sheets, settings.nightRunDays),
    settings,
  };
}

/** clock hours still to work on a step: its setup when it has not begun, plus the run of the units left */
function remainingHours(lo: LotOperation): number {
  return ((lo.placed > 0 ? 0 : lo.op.setupMinutes) + (lo.op.quantity - lo.placed) * lo.op.runMinutesPerUnit) / 60;
}

/**
 * Dispatch the plan's weeks in order, from its first week. Each week takes the steps its own
 * production needs plus what earlier weeks could not finish (carried over); carried work goes
 * ahead of the week's own work wherever both could start, the oldest first. A step works only
 * what its previous step (or, for a first step, its sub-assemblies made in the same plan week)
 * has completed, batch by batch, in whatever week that was; what it cannot finish in a week is
 * carried into the next.
 */
function scheduleWeeks(
  data: PlanningData,
  weeks: number[],
  opsByWeek: Map<number, WeekOperation[]>,
  windowsOf: Map<string, ShiftWindow[]>,
  offsetOf: Map<number, number>,
  settings: ShiftSheetSettings,
): { pieces: Piece[]; left: LotOperation[]; carriedOver: CarriedWork[] } {
  const pieces: Piece[] = [];
  const carriedOver: CarriedWork[] = [];
  const cursor = new Map<string, number>();
  const last = new Map<string, { product: string; family: string | null; lo: LotOperation }>();
  const lag = settings.transferLagMinutes;
  let open: Lot[] = [];
  const rankOf = new Map<number, (op: WeekOperation) => number[]>();

  for (const week of weeks) {
    const offset = offsetOf.get(week)!;
    const ops = opsByWeek.get(week)!;
    rankOf.set(week, dispatchPriority(data, ops, (code) => windowsOf.get(`${code}|${week}`) ?? [], settings.dispatchRule));

    // this week's lots, in the base order of weekOperations
    const own = new Map<string, Lot>();
    for (const op of ops) {
      let lot = own.get(op.product);
      if (!lot) own.set(op.product, (lot = { product: op.product, week, quantity: op.quantity, ops: [], components: [], order: own.size }));
      const whole = Math.abs(op.quantity - Math.round(op.quantity)) < 1e-9;
      lot.ops.push({ op, lot, index: lot.ops.length, batch: transferBatch(settings, op.product, op.quantity), whole, placed: 0, completion: { end: 0, quantity: 0, runs: [] }, short: null });
    }
    for (const b of data.bom) {
      const [parent, comp] = [own.get(b.parent), b.componentProduct === undefined ? undefined : own.get(b.componentProduct)];
      if (parent && comp && parent !== comp && !parent.components.includes(comp)) parent.components.push(comp);
    }
    // carried lots first (oldest week first), then the week's own
    const lots = [...open.sort((a, b) => a.week - b.week || a.order - b.order), ...own.values()];
    const queue = new Map(lots.map((l) => [l, l.ops.filter((o) => o.placed < o.op.quantity - tol(o.op.quantity))]));
    const ready = (lot: Lot) => queue.get(lot)![0].index > 0 || lot.components.every((c) => (queue.get(c)?.length ?? 0) === 0);

    /** units a step may work: what its previous step completed, or the share its sub-assemblies completed */
    const available = (lo: LotOperation): number => {
      if (lo.index > 0) return lo.lot.ops[lo.index - 1].placed;
      let share = 1;
      for (const c of lo.lot.components) share = Math.min(share, c.ops[c.ops.length - 1].placed / c.quantity);
      const units = share * lo.lot.quantity;
      return share >= 1 - 1e-12 ? lo.lot.quantity : lo.whole ? Math.floor(units + 1e-9) : units;
    };
    /** when cumulative unit `c` of the step is released to it (transfer batch done upstream + lag) */
    const release = (lo: LotOperation, c: number): number => {
      if (lo.index > 0) return completedAt(lo.lot.ops[lo.index - 1].completion, c) + lag;
      let t = Number.NEGATIVE_INFINITY;
      for (const comp of lo.lot.components) t = Math.max(t, completedAt(comp.ops[comp.ops.length - 1].completion, (comp.quantity * c) / lo.lot.quantity) + lag);
      return t;
    };
    /** cumulative units at the end of the next transfer batch (batches count from the lot's first unit) */
    const nextTarget = (lo: LotOperation) => Math.min(lo.op.quantity, (Math.floor(lo.placed / lo.batch + 1e-9) + 1) * lo.batch);
    const canWork = (lo: LotOperation) => nextTarget(lo) <= available(lo) + tol(lo.op.quantity);
    const absWindows = (code: string) => (windowsOf.get(`${code}|${week}`) ?? []).map((w) => ({ ref: w, start: w.start + offset, end: w.end + offset, overtimeEnd: w.overtimeEnd + offset }));

    // Non-delay dispatching (Giffler & Thompson 1960; Baker & Trietsch 2009, ch. on
    // dispatching): of the steps whose predecessors were dispatched, the one that can start
    // earliest fixes its work center and time; of all that could start there by then, carried
    // work goes first (oldest plan week first), then the dispatch rule, then the base order.
    const next = (): LotOperation | undefined => {
      let first: { t: number; wc: string } | undefined;
      const heads: { lo: LotOperation; t: number; pos: number }[] = [];
      lots.forEach((lot, pos) => {
        const lo = queue.get(lot)![0];
        if (!lo || !ready(lot)) return;
        const t = canWork(lo) ? Math.max(cursor.get(lo.op.workCenter) ?? 0, release(lo, nextTarget(lo)), offset) : Number.NEGATIVE_INFINITY;
        heads.push({ lo, t, pos });
        if (!first || t < first.t - EPS) first = { t, wc: lo.op.workCenter };
      });
      let pick: LotOperation | undefined;
      if (first) {
        let best: number[] | undefined;
        for (const h of heads) {
          if (h.lo.op.workCenter !== first.wc || h.t > first.t + EPS) continue;
          const key = [week - h.lo.lot.week, ...rankOf.get(h.lo.lot.week)!(h.lo.op), -h.pos];
          if (best === undefined || comparePriority(key, best) < 0) [pick, best] = [h.lo, key];
        }
      }
      // nothing ready (a cycle among the products): fall back to the base order
      pick ??= lots.map((l) => queue.get(l)![0]).find((lo) => lo !== undefined);
      if (pick) queue.get(pick.lot)!.shift();
      return pick;
    };

    for (let lo = next(); lo !== undefined; lo = next()) {
      const { op } = lo;
      lo.short = null;
      if (!canWork(lo)) {
        lo.short = 'previous';
        continue;
      }
      const windows = absWindows(op.workCenter);
      const prev = last.get(op.workCenter);
      const setup = prev?.product === op.product ? 0 : prev && op.family !== null && prev.family === op.family ? op.setupMinutes * settings.familySetupFactor : op.setupMinutes;
      const continuing = lo.placed > 0 && setup === 0;
      const t0 = Math.max(cursor.get(op.workCenter) ?? 0, release(lo, nextTarget(lo)), offset);
      // the setup must finish inside one shift (overtime included)
      let wi = windows.findIndex((w) => Math.max(t0, w.start) + setup <= w.overtimeEnd + EPS && (setup > 0 || Math.max(t0, w.start) < w.overtimeEnd));
      if (wi < 0) {
        lo.short = 'time';
        continue;
      }
      const setupStart = Math.max(t0, windows[wi].start);
      let cur = setupStart + setup;
      let first = true;
      let end = cur;
      let mine: Piece | undefined;
      // batch by batch: each starts at the latest of the work center free and its release
      while (lo.placed < op.quantity - tol(op.quantity)) {
        const target = nextTarget(lo);
        if (target > available(lo) + tol(op.quantity)) {
          lo.short = 'previous';
          break;
        }
        let left = target - lo.placed;
        if (!first) {
          cur = Math.max(cur, release(lo, target));
          while (wi < windows.length && windows[wi].overtimeEnd - cur <= EPS) wi++;
        }
        while (left > tol(op.quantity) && wi < windows.length) {
          const w = windows[wi];
          cur = Math.max(cur, w.start);
          const room = Math.max(0, w.overtimeEnd - cur);
          let units: number;
          if (op.runMinutesPerUnit <= 0) units = left;
          else if (lo.whole) units = Math.min(left, Math.floor(room / op.runMinutesPerUnit + 1e-9));
          else units = Math.min(left, room / op.runMinutesPerUnit);
          if (!lo.whole && left - units < 1e-9) units = left;
          if (units > EPS || (first && setup > 0)) {
            const runEnd = cur + units * op.runMinutesPerUnit;
            if (units > EPS) lo.completion.runs.push({ start: cur, end: runEnd, before: lo.placed, units });
            if (mine && mine.window === w.ref && Math.abs(mine.end - cur) <= EPS) {
              // the next batch follows on without a wait: one job line
              mine.end = runEnd;
              mine.quantity += units;
            } else {
              mine = {
                lo, week, window: w.ref, setupStart: first && setup > 0 ? setupStart : cur, start: cur, end: runEnd,
                setupMinutes: first ? setup : 0, quantity: units, continued: !first || continuing,
              };
              pieces.push(mine);
            }
            first = false;
            left -= units;
            lo.placed += units;
            end = runEnd;
            cur = runEnd;
          }
          if (left > tol(op.quantity)) wi++;
        }
        if (wi >= windows.length) {
          if (lo.placed < op.quantity - tol(op.quantity)) lo.short = 'time';
          break;
        }
      }
      if (lo.placed >= op.quantity - tol(op.quantity)) lo.placed = op.quantity;
      lo.completion.quantity = lo.placed;
      lo.completion.end = Math.max(lo.completion.end, end);
      cursor.set(op.workCenter, end);
      last.set(op.workCenter, { product: op.product, family: op.family, lo });
    }

    open = lots.filter((l) => l.ops.some((o) => o.placed < o.op.quantity - tol(o.op.quantity)));
    if (week !== weeks[weeks.length - 1])
      for (const l of open)
        for (const lo of l.ops.filter((o) => o.placed < o.op.quantity - tol(o.op.quantity)))
          carriedOver.push({
            workCenter: lo.op.workCenter, fromWeek: l.week, outOfWeek: week, product: lo.op.product, operation: lo.op.operation,
            quantity: lo.op.quantity - lo.placed, hours: remainingHours(lo),
            reason: lo.short === 'time' ? 'no open shift time left in the week' : 'the previous operation had not finished this quantity',
          });
  }
  return { pieces, left: open.flatMap((l) => l.ops.filter((o) => o.placed < o.op.quantity - tol(o.op.quantity))), carriedOver };
}

/** how an operation completed its output: runs of units in time order, each at a steady rate */
interface Completion {
  /** end of the latest run */
  end: number;
  /** units completed so far */
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

function toSheets(data: PlanningData, week: number, offset: number, pieces: Piece[], windowsOf: Map<string, ShiftWindow[]>): ShiftSheet[] {
  const weekStartDate = data.weeks.find((w) => w.index === week)!.startDate;
  const product = new Map(data.products.map((p) => [p.code, p]));
  const sheets: ShiftSheet[] = [];
  for (const wc of data.workCenters) {
    for (const w of windowsOf.get(`${wc.code}|${week}`) ?? []) {
      const mine = pieces.filter((p) => p.lo.op.workCenter === wc.code && p.window === w).sort((a, b) => a.setupStart - b.setupStart);
      if (mine.length === 0) continue;
      const jobs: ShiftSheetJob[] = mine.map((p, i) => ({
        sequence: i + 1,
        product: p.lo.op.product,
        productName: product.get(p.lo.op.product)?.name ?? p.lo.op.product,
        family: p.lo.op.family,
        operation: p.lo.op.operation,
        quantity: p.quantity,
        unit: product.get(p.lo.op.product)?.unit ?? '',
        setupStart: wallClock(weekStartDate, p.setupStart - offset),
        start: wallClock(weekStartDate, p.start - offset),
        end: wallClock(weekStartDate, p.end - offset),
        setupStartMinute: p.setupStart - offset,
        startMinute: p.start - offset,
        endMinute: p.end - offset,
        setupMinutes: p.setupMinutes,
        overtime: p.end - offset > w.end + EPS,
        continued: p.continued,
        carriedFromWeek: p.lo.lot.week === week ? null : p.lo.lot.week,
        dueWeek: p.lo.op.dueWeek,
        orderRefs: p.lo.op.orderRefs,
        previousWorkCenter: p.lo.op.previousWorkCenter,
        nextWorkCenter: p.lo.op.nextWorkCenter,
        materials: p.lo.op.previousWorkCenter === null ? issuesFor(data, p.lo.op.product, p.quantity) : [],
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
