import type { PlanningData, Product } from './planning-data';
import { componentUsePerUnit } from './bom-graph';

/**
 * Rolled-up standard cost per unit: purchased materials (scrap included) plus each product's
 * extra unit cost, through all BOM levels. Assumes a BOM without cycles (validated first).
 */
export function standardCosts(data: PlanningData): Map<string, number> {
  const materialCost = new Map(data.materials.map((m) => [m.code, m.unitCost]));
  const product = new Map(data.products.map((p) => [p.code, p]));
  const memo = new Map<string, number>();
  const cost = (code: string): number => {
    const known = memo.get(code);
    if (known !== undefined) return known;
    let c = product.get(code)?.extraUnitCost ?? 0;
    for (const b of data.bom) {
      if (b.parent !== code) continue;
      const use = componentUsePerUnit(b);
      if (b.material !== undefined) c += use * (materialCost.get(b.material) ?? 0);
      if (b.componentProduct !== undefined) c += use * cost(b.componentProduct);
    }
    memo.set(code, c);
    return c;
  };
  for (const p of data.products) cost(p.code);
  return memo;
}

/** holding cost per unit and week: explicit, else annual rate × standard cost / 52 */
export function holdingCostPerUnitWeek(p: Product, standardCost: number): number {
  if (p.holdingCostPerUnitWeek !== undefined) return p.holdingCostPerUnitWeek;
  if (p.holdingCostAnnualRate !== undefined) return (p.holdingCostAnnualRate * standardCost) / 52;
  return 0;
}
