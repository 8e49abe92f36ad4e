/**
 * The primal–dual iterate (v, y, z_l, z_u) with slacks to the bounds
 *   x_l = v − lower > 0,  x_u = upper − v > 0,  z_l, z_u ≥ 0,
 * and the search direction of the same shape. Allocated once per solve.
 */
export interface Iterate {
  v: Float64Array;
  y: Float64Array;
  zl: Float64Array;
  zu: Float64Array;
}

export function allocateIterate(N: number, m: number): Iterate {
  return { v: new Float64Array(N), y: new Float64Array(m), zl: new Float64Array(N), zu: new Float64Array(N) };
}

export function copyIterate(from: Iterate, to: Iterate): void {
  to.v.set(from.v);
  to.y.set(from.y);
  to.zl.set(from.zl);
  to.zu.set(from.zu);
}
