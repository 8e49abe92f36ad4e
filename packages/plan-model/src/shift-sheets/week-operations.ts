import type { PlanningData } from '../planning-data';
import type { Plan } from '../plan';

/**
 * The operations a plan week asks of the floor: for every product made that week, one operation
 * per routing step (in step order), with its quantity, setup, clock run time per unit
 * (standard hours ÷ efficiency: DOMAIN.md §4, operation time = setup + quantity × run time ÷
 * efficiency), the firm orders it serves, and the order to run products in: earliest firm due
 * week first (Jackson's earliest-due-date rule), grouped by family and product, with every
 * sub-assembly made that week placed before the products that use it.
 */
export interface WeekOperation {
  product: string;
  operation: number;
  workCenter: string;
  quantity: number;
  setupMinutes: number;
  runMinutesPerUnit: number;
  previousWorkCenter: string | null;
  nextWorkCenter: string | null;
  dueWeek: number | null;
  orderRefs: string[];
  family: string | null;
}

export function weekOperations(data: PlanningData, plan: Plan, week: number): WeekOperation[] {
  const made = new Map(plan.products.filter((l) => l.week === week && l.make > 1e-9).map((l) => [l.product, l.make]));
  const product = new Map(data.products.map((p) => [p.code, p]));
  const wc = new Map(data.workCenters.map((w) => [w.code, w]));

  // due week of a product: its earliest firm order from this week on; a sub-assembly inherits
  // the earliest due week of the parents it goes into
  const ownDue = (code: string): number | null => {
    const weeks = data.demand.filter((d) => d.product === code && d.kind === 'firm' && d.week >= week && d.qty > 0).map((d) => d.week);
    return weeks.length ? Math.min(...weeks) : null;
  };
  const dueMemo = new Map<string, number | null>();
  const due = (code: string, seen = new Set<string>()): number | null => {
    if (dueMemo.has(code)) return dueMemo.get(code)!;
    seen.add(code);
    let d = ownDue(code);
    for (const b of data.bom)
      if (b.componentProduct === code && !seen.has(b.parent) && made.has(b.parent)) {
        const pd = due(b.parent, seen);
        if (pd !== null && (d === null || pd < d)) d = pd;
      }
    dueMemo.set(code, d);
    return d;
  };

  const key = (code: string) => [due(code) ?? Number.MAX_SAFE_INTEGER, product.get(code)?.family ?? '\uffff', code] as const;
  const byPriority = [...made.keys()].sort((a, b) => {
    const [x, y] = [key(a), key(b)];
    return x[0] - y[0] || x[1].localeCompare(y[1]) || x[2].localeCompare(y[2]);
  });
  const order: string[] = [];
  const placed = new Set<string>();
  const place = (code: string, path: Set<string>) => {
    if (placed.has(code) || path.has(code)) return;
    path.add(code);
    const components = data.bom.filter((b) => b.parent === code && b.componentProduct !== undefined && made.has(b.componentProduct)).map((b) => b.componentProduct!);
    for (const c of components.sort((a, b) => byPriority.indexOf(a) - byPriority.indexOf(b))) place(c, path);
    placed.add(code);
    order.push(code);
  };
  for (const code of byPriority) place(code, new Set());

  const ops: WeekOperation[] = [];
  for (const code of order) {
    const steps = data.routings.filter((r) => r.product === code).sort((a, b) => a.sequence - b.sequence);
    const dueWeek = due(code);
    const orderRefs = dueWeek === null ? [] : data.demand.filter((d) => d.product === code && d.kind === 'firm' && d.week === dueWeek && d.orderRef).map((d) => d.orderRef!);
    steps.forEach((r, i) => {
      const w = wc.get(r.workCenter);
      if (!w) throw new Error(`routing ${code} step ${r.sequence} points at work center ${r.workCenter}, which does not exist`);
      ops.push({
        product: code,
        operation: r.sequence,
        workCenter: r.workCenter,
        quantity: made.get(code)!,
        setupMinutes: r.setupHours * 60,
        runMinutesPerUnit: (r.hoursPerUnit * 60) / w.efficiency,
        previousWorkCenter: i > 0 ? steps[i - 1].workCenter : null,
        nextWorkCenter: i + 1 < steps.length ? steps[i + 1].workCenter : null,
        dueWeek,
        orderRefs,
        family: product.get(code)?.family ?? null,
      });
    });
  }
  return ops;
}
