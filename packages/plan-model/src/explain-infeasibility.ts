import type { InfeasibilityRay } from '@millrace/lp-core';
import type { PlanningData } from './planning-data';
import type { BuiltModel } from './build-model';
import type { ColInfo, RowInfo } from './model/model-index';
import { availableHours, overtimeCapHours } from './capacity';
import { qty } from './format';
import { supplyCap } from './material-supply';

/**
 * Infeasible model → the conflicting requirements in words. The rows (and column bounds) with a
 * non-zero entry in the solver's infeasibility ray (a Farkas certificate: a combination of
 * these requirements that cannot all hold) are each turned into one sentence, must-ship orders
 * first since they are the only hard demands of the model.
 */
export function explainInfeasibility(data: PlanningData, built: BuiltModel, ray: InfeasibilityRay | undefined): string[] {
  if (!ray || ray.entries.length === 0)
    return ['The plan is infeasible, but the solver gave no certificate naming the conflicting requirements. Check the must-ship orders first: they are the only hard demands.'];
  const { problem, index } = built;
  const rowByName = new Map(problem.rowNames.map((n, i) => [n, index.rowInfo[i]]));
  const colByName = new Map(problem.colNames.map((n, i) => [n, index.colInfo[i]]));
  const scale = Math.max(...ray.entries.map((e) => Math.abs(e.value)));
  const sentences: { order: number; text: string }[] = [];
  const seen = new Set<string>();
  for (const e of ray.entries) {
    if (Math.abs(e.value) <= 1e-7 * scale) continue;
    const row = rowByName.get(e.name);
    const col = row ? undefined : colByName.get(e.name);
    const s = row ? rowSentence(data, index.horizonWeeks, row) : col ? colSentence(data, col) : undefined;
    if (s && !seen.has(s.text)) {
      seen.add(s.text);
      sentences.push(s);
    }
  }
  sentences.sort((a, b) => a.order - b.order);
  return [
    `The plan is infeasible: these ${sentences.length} requirements cannot all be met together.`,
    ...sentences.map((s) => s.text),
  ];
}

function rowSentence(data: PlanningData, T: number, r: RowInfo): { order: number; text: string } | undefined {
  const product = data.products.find((p) => p.code === r.item);
  const wc = data.workCenters.find((w) => w.code === r.item);
  const mat = data.materials.find((m) => m.code === r.item);
  switch (r.kind) {
    case 'must_ship': {
      const orders = data.demand.filter((d) => d.product === r.item && d.mustShip && d.kind === 'firm' && d.week === r.week);
      const total = orders.reduce((a, d) => a + d.qty, 0);
      const refs = orders.map((d) => d.orderRef ?? `week ${d.week}`).join(', ');
      return { order: 0, text: `Must-ship orders for ${product?.name ?? r.item} (${refs}; ${qty(total)} ${product?.unit ?? 'units'}) must ship complete in week ${r.week}.` };
    }
    case 'capacity': {
      if (!wc) return undefined;
      const cap = overtimeCapHours(wc, r.week);
      const ot = cap === Infinity ? 'unlimited overtime' : cap === 0 ? 'no overtime' : `at most ${qty(cap)} h overtime`;
      return { order: 1, text: `${wc.name} in week ${r.week} has ${qty(availableHours(wc, r.week))} h of regular time and ${ot}.` };
    }
    case 'material':
      if (!mat) return undefined;
      return {
        order: 2,
        text: `${mat.name} used in week ${r.week} must come from stock on hand, scheduled receipts or purchases placed at least ${mat.leadTimeWeeks} weeks earlier.`,
      };
    case 'supply':
      if (!mat) return undefined;
      return { order: 3, text: `${mat.name} purchases are capped at ${qty(supplyCap(mat, r.week) ?? 0)} ${mat.unit} in week ${r.week}.` };
    case 'balance':
      if (!product) return undefined;
      {
        const firm = data.demand
          .filter((d) => d.product === r.item && d.kind === 'firm' && d.week === r.week)
          .reduce((a, d) => a + d.qty, 0);
        const opening = r.week === 1 ? `, with ${qty(product.openingStock)} in stock at the start` : '';
        return {
          order: 4,
          text: `${product.name} in week ${r.week}: firm orders of ${qty(firm)} ${product.unit} and use in parent products must come from production and stock${opening}.`,
        };
      }
    case 'backlog':
      if (!product) return undefined;
      return { order: 5, text: `${product.name} in week ${r.week}: the backlog can grow only by that week's new firm orders.` };
    case 'safety_stock':
    case 'smoothing':
      return undefined;
  }
}

function colSentence(data: PlanningData, c: ColInfo): { order: number; text: string } | undefined {
  if (c.kind !== 'overtime') return undefined;
  const wc = data.workCenters.find((w) => w.code === c.item);
  if (!wc) return undefined;
  const cap = overtimeCapHours(wc, c.week);
  return { order: 1, text: `${wc.name} may work at most ${qty(cap)} h overtime in week ${c.week}.` };
}
