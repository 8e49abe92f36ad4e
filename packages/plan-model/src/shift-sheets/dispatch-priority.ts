import type { PlanningData } from '../planning-data';
import type { ShiftWindow } from './shift-windows';
import type { WeekOperation } from './week-operations';

/**
 * Which waiting operation a work center runs next when several could start at the same time
 * (the conflict set of non-delay dispatching; DOMAIN.md §4):
 *
 *  - `earliest_start`: no rule beyond the week's base order (earliest firm due week, then
 *    family, sub-assemblies before their parents — weekOperations);
 *  - `most_work_remaining`: the operation with the most work still ahead of it after it first —
 *    the rest of its routing plus, for a sub-assembly, the longest remaining path through the
 *    products using it this week (most work remaining, MWKR: Conway, Maxwell & Miller, Theory of
 *    Scheduling 1967, from memory; Baker & Trietsch 2009, ch. on dispatching rules). The
 *    operation's own time is left out (measured on the demo plant: counting it favours long
 *    router jobs that hold the work center and leaves 1463 h unscheduled against 1218 h);
 *    ties by the base order;
 *  - `bottleneck_first`: the operation whose later work centers are loaded most (load ÷ open
 *    time of the week) first, so the most loaded downstream work center is fed early
 *    (DOMAIN.md §4 "bottleneck first"; Goldratt & Cox, The Goal 1984, drum-buffer-rope, from
 *    memory); ties by most work remaining, then the base order.
 */
export type DispatchRule = 'earliest_start' | 'most_work_remaining' | 'bottleneck_first';

export const DISPATCH_RULES: readonly DispatchRule[] = ['earliest_start', 'most_work_remaining', 'bottleneck_first'];

/** clock minutes of an operation (setup + quantity × run time) */
export const operationMinutes = (op: WeekOperation) => op.setupMinutes + op.quantity * op.runMinutesPerUnit;

/**
 * Priority of each operation of a week under a rule: a tuple compared element by element, larger
 * first; the base order (position in `ops`, smaller first) breaks remaining ties.
 */
export function dispatchPriority(
  data: PlanningData,
  ops: WeekOperation[],
  windowsOf: (workCenter: string) => ShiftWindow[],
  rule: DispatchRule,
): (op: WeekOperation) => number[] {
  if (rule === 'earliest_start') return () => [];
  const byProduct = new Map<string, WeekOperation[]>();
  for (const op of ops) byProduct.set(op.product, [...(byProduct.get(op.product) ?? []), op]);
  const parentsOf = new Map<string, string[]>();
  for (const b of data.bom)
    if (b.componentProduct !== undefined && b.componentProduct !== b.parent && byProduct.has(b.componentProduct) && byProduct.has(b.parent))
      parentsOf.set(b.componentProduct, [...(parentsOf.get(b.componentProduct) ?? []), b.parent]);

  // what follows a product's last step: the longest path through the products it goes into
  // (a cycle among this week's products is cut where it closes)
  const afterMemo = new Map<string, { minutes: number; centers: Set<string> }>();
  const after = (product: string, path: Set<string>): { minutes: number; centers: Set<string> } => {
    const memo = afterMemo.get(product);
    if (memo) return memo;
    path.add(product);
    let minutes = 0;
    const centers = new Set<string>();
    for (const parent of parentsOf.get(product) ?? []) {
      if (path.has(parent)) continue;
      const steps = byProduct.get(parent)!;
      const tail = after(parent, path);
      const total = steps.reduce((a, s) => a + operationMinutes(s), 0) + tail.minutes;
      minutes = Math.max(minutes, total);
      for (const s of steps) centers.add(s.workCenter);
      for (const c of tail.centers) centers.add(c);
    }
    path.delete(product);
    const result = { minutes, centers };
    afterMemo.set(product, result);
    return result;
  };
  const workRemaining = (op: WeekOperation) => {
    const steps = byProduct.get(op.product)!;
    const i = steps.indexOf(op);
    return steps.slice(i + 1).reduce((a, s) => a + operationMinutes(s), 0) + after(op.product, new Set()).minutes;
  };
  if (rule === 'most_work_remaining') return (op) => [workRemaining(op)];

  // load of each work center this week: planned minutes ÷ open minutes (overtime included)
  const load = new Map<string, number>();
  for (const code of new Set(ops.map((o) => o.workCenter))) {
    const open = windowsOf(code).reduce((a, w) => a + (w.overtimeEnd - w.start), 0);
    const planned = ops.filter((o) => o.workCenter === code).reduce((a, o) => a + operationMinutes(o), 0);
    load.set(code, open > 0 ? planned / open : Number.POSITIVE_INFINITY);
  }
  return (op) => {
    const steps = byProduct.get(op.product)!;
    const later = new Set([...steps.slice(steps.indexOf(op) + 1).map((s) => s.workCenter), ...after(op.product, new Set()).centers]);
    const downstream = Math.max(0, ...[...later].map((c) => load.get(c) ?? 0));
    return [downstream, workRemaining(op)];
  };
}

/** compare two priority tuples: negative when `a` goes first */
export function comparePriority(a: number[], b: number[]): number {
  for (let i = 0; i < Math.max(a.length, b.length); i++) {
    const d = (b[i] ?? 0) - (a[i] ?? 0);
    if (Math.abs(d) > 1e-9) return d;
  }
  return 0;
}
