/**
 * A bill of materials must be acyclic: no product may, through any chain of components, contain
 * itself (MRP's low-level codes exist only for an acyclic product structure; Orlicky, MRP ch. 7).
 *
 * Given every product-to-product edge in the database, the parent whose BOM is being replaced and
 * its new product components, returns the first cycle the new BOM would close, as a path of codes
 * that starts and ends at the parent (`['T-1', 'F-2', 'T-1']`), or null when there is none.
 */
export function findBomCycle(
  edges: ReadonlyArray<{ parent: string; child: string }>,
  parent: string,
  newChildren: readonly string[],
): string[] | null {
  const children = new Map<string, string[]>();
  for (const e of edges) {
    if (e.parent === parent) continue; // the parent's old lines are being replaced
    const list = children.get(e.parent) ?? [];
    list.push(e.child);
    children.set(e.parent, list);
  }
  children.set(parent, [...newChildren]);

  // Depth-first search from the parent; `onPath` holds the current chain.
  const done = new Set<string>();
  const path: string[] = [];
  const visit = (node: string): string[] | null => {
    path.push(node);
    for (const child of children.get(node) ?? []) {
      if (child === parent) return [...path, parent];
      if (done.has(child) || path.includes(child)) continue;
      const found = visit(child);
      if (found) return found;
    }
    path.pop();
    done.add(node);
    return null;
  };
  return visit(parent);
}
