import type { BomLine } from './planning-data';

/**
 * The bill-of-materials graph: parents → component products and materials.
 * Component use per parent unit includes scrap: qtyPer / (1 − scrapPct/100).
 */

/** Quantity of a component consumed per unit of the parent made, scrap included. */
export function componentUsePerUnit(line: BomLine): number {
  return line.qtyPer / (1 - line.scrapPct / 100);
}

/** Every cycle among products, each as a path that starts and ends with the same product. */
export function findBomCycles(bom: BomLine[]): string[][] {
  const children = new Map<string, string[]>();
  for (const b of bom) {
    if (b.componentProduct === undefined) continue;
    const list = children.get(b.parent) ?? [];
    list.push(b.componentProduct);
    children.set(b.parent, list);
  }
  const state = new Map<string, 'open' | 'done'>();
  const cycles: string[][] = [];
  const seenCycle = new Set<string>();
  const stack: string[] = [];
  const visit = (p: string) => {
    state.set(p, 'open');
    stack.push(p);
    for (const c of children.get(p) ?? []) {
      const s = state.get(c);
      if (s === 'open') {
        const ring = stack.slice(stack.indexOf(c));
        // start the path at its smallest code so the same cycle always reads the same way
        const first = ring.indexOf([...ring].sort()[0]);
        const cycle = [...ring.slice(first), ...ring.slice(0, first), ring[first]];
        const key = [...ring].sort().join('|');
        if (!seenCycle.has(key)) {
          seenCycle.add(key);
          cycles.push(cycle);
        }
      } else if (s === undefined) visit(c);
    }
    stack.pop();
    state.set(p, 'done');
  };
  for (const p of [...children.keys()].sort()) if (!state.has(p)) visit(p);
  return cycles;
}

/**
 * Low-level code of every item (products and materials): 0 for items no one uses, else one more
 * than the deepest parent. MRP explodes items in increasing low-level code. Assumes no cycles.
 */
export function lowLevelCodes(items: string[], links: { parent: string; component: string }[]): Map<string, number> {
  const code = new Map<string, number>(items.map((i) => [i, 0]));
  const parentsOf = new Map<string, string[]>();
  for (const l of links) {
    const ps = parentsOf.get(l.component) ?? [];
    ps.push(l.parent);
    parentsOf.set(l.component, ps);
    if (!code.has(l.component)) code.set(l.component, 0);
    if (!code.has(l.parent)) code.set(l.parent, 0);
  }
  const memo = new Map<string, number>();
  const depth = (i: string, guard: Set<string>): number => {
    const known = memo.get(i);
    if (known !== undefined) return known;
    if (guard.has(i)) throw new Error(`bill of materials has a cycle through ${i}`);
    guard.add(i);
    let d = 0;
    for (const p of parentsOf.get(i) ?? []) d = Math.max(d, depth(p, guard) + 1);
    guard.delete(i);
    memo.set(i, d);
    return d;
  };
  for (const i of code.keys()) code.set(i, depth(i, new Set()));
  return code;
}

/** All products and materials reachable below `product` in the BOM (multi-level), product excluded. */
export function bomDescendants(bom: BomLine[], product: string): { products: Set<string>; materials: Set<string> } {
  const products = new Set<string>();
  const materials = new Set<string>();
  const todo = [product];
  while (todo.length) {
    const p = todo.pop()!;
    for (const b of bom) {
      if (b.parent !== p) continue;
      if (b.material !== undefined) materials.add(b.material);
      if (b.componentProduct !== undefined && !products.has(b.componentProduct)) {
        products.add(b.componentProduct);
        todo.push(b.componentProduct);
      }
    }
  }
  return { products, materials };
}
