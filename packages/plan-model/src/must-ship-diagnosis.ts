import { solve as lpCoreSolve, type Problem, type SolveResult } from '@millrace/lp-core';
import type { PlanningData } from './planning-data';
import type { BuiltModel } from './build-model';
import { qty, weekRanges } from './format';
import { TOLERANCES } from './tolerances';

/**
 * Which must-ship orders cannot be met, and what stands in the way — found by solving an
 * elastic copy of the model (a phase-one problem: Chvátal, Linear Programming, ch. 3;
 * Winston, the Big-M and two-phase methods): every must-ship row gets a shortfall column
 * e ≥ 0 (late[t] − late[t−1] − e ≤ ordinary orders), and the total shortfall Σ e is minimised
 * with all other costs set to zero. A positive minimum proves the must-ship orders infeasible
 * together; the shortfall per row says by how much, and the rows with a non-zero dual at that
 * optimum (capacity, materials, supply caps) are what limits them.
 *
 * Used when the solver ends without a certificate (iteration limit, numerical trouble) or to
 * put numbers on one. Returns null when every must-ship order can be met.
 */
export interface MustShipShortfall {
  product: string;
  week: number;
  orderRefs: string[];
  required: number;
  short: number;
}

export interface MustShipDiagnosis {
  shortfalls: MustShipShortfall[];
  /** the limiting rows, in words */
  limits: string[];
  sentences: string[];
}

type SolveFn = (problem: Problem) => SolveResult | Promise<SolveResult>;

export async function diagnoseMustShip(data: PlanningData, built: BuiltModel, solveFn: SolveFn = lpCoreSolve): Promise<MustShipDiagnosis | null> {
  const { problem, index } = built;
  const mustRows: number[] = [];
  index.row.must_ship.forEach((perWeek) => perWeek.forEach((r) => r >= 0 && mustRows.push(r)));
  if (mustRows.length === 0) return null;

  // elastic copy: one new column per must-ship row, cost 1; every other cost 0
  const n = problem.colNames.length;
  const k = mustRows.length;
  const A = problem.A;
  const colPtr = new Int32Array(n + k + 1);
  colPtr.set(A.colPtr);
  const nnz = A.colPtr[n];
  const rowIdx = new Int32Array(nnz + k);
  const values = new Float64Array(nnz + k);
  rowIdx.set(A.rowIdx);
  values.set(A.values);
  mustRows.forEach((r, j) => {
    rowIdx[nnz + j] = r;
    values[nnz + j] = -1;
    colPtr[n + j + 1] = nnz + j + 1;
  });
  const c = new Float64Array(n + k);
  c.fill(1, n);
  const elastic: Problem = {
    name: `${problem.name ?? 'plan'}-must-ship-elastic`,
    colNames: [...problem.colNames, ...mustRows.map((r) => `short_${problem.rowNames[r]}`)],
    rowNames: problem.rowNames,
    c,
    c0: 0,
    A: { m: A.m, n: n + k, colPtr, rowIdx, values },
    rowLower: problem.rowLower,
    rowUpper: problem.rowUpper,
    colLower: Float64Array.from([...problem.colLower, ...new Array<number>(k).fill(0)]),
    colUpper: Float64Array.from([...problem.colUpper, ...new Array<number>(k).fill(Infinity)]),
  };
  const result = await solveFn(elastic);
  if (result.status !== 'optimal') throw new Error(`the must-ship check could not be solved (status ${result.status})`);
  if (result.objective <= TOLERANCES.quantity * 10) return null;

  const shortfalls: MustShipShortfall[] = [];
  mustRows.forEach((r, j) => {
    const short = result.x[n + j];
    if (short <= TOLERANCES.quantity * 10) return;
    const info = index.rowInfo[r];
    const orders = data.demand.filter((d) => d.product === info.item && d.week === info.week && d.kind === 'firm' && d.mustShip);
    shortfalls.push({
      product: info.item,
      week: info.week,
      orderRefs: orders.map((d) => d.orderRef ?? `${d.product}/week ${d.week}`),
      required: orders.reduce((a, d) => a + d.qty, 0),
      short,
    });
  });

  // limiting rows: capacity, material and supply rows with a non-zero dual in the elastic optimum
  const limits: string[] = [];
  const byItem = new Map<string, { kind: string; weeks: number[]; value: number }>();
  index.rowInfo.forEach((info, r) => {
    if (info.kind !== 'capacity' && info.kind !== 'material' && info.kind !== 'supply') return;
    const v = Math.abs(result.rowDuals[r]);
    if (v <= TOLERANCES.value) return;
    const key = `${info.kind}|${info.item}`;
    const e = byItem.get(key) ?? { kind: info.kind, weeks: [], value: 0 };
    e.weeks.push(info.week);
    e.value = Math.max(e.value, v);
    byItem.set(key, e);
  });
  for (const [key, e] of byItem) {
    const item = key.slice(key.indexOf('|') + 1);
    if (e.kind === 'capacity') {
      const w = data.workCenters.find((x) => x.code === item)!;
      limits.push(`${w.name} is full in ${weekRanges(e.weeks)} (one more hour would cut the shortfall by ${qty(e.value)})`);
    } else {
      const m = data.materials.find((x) => x.code === item)!;
      limits.push(
        e.kind === 'supply'
          ? `${m.name} is limited by its supply cap in ${weekRanges(e.weeks)}`
          : `${m.name} runs out in ${weekRanges(e.weeks)} (lead time ${m.leadTimeWeeks} week${m.leadTimeWeeks === 1 ? '' : 's'})`,
      );
    }
  }
  const name = (code: string) => data.products.find((p) => p.code === code)?.name ?? code;
  const sentences = [
    ...shortfalls.map(
      (s) => `Must-ship order${s.orderRefs.length > 1 ? 's' : ''} ${s.orderRefs.join(', ')} (${name(s.product)}, ${qty(s.required)} in week ${s.week}): at most ${qty(s.required - s.short)} can ship — ${qty(s.short)} short.`,
    ),
    ...limits.map((l) => `${l}.`),
  ];
  return { shortfalls, limits, sentences };
}
