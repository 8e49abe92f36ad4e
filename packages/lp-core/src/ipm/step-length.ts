/**
 * Longest steps that keep the iterate interior (ratio tests):
 *   α_p = max{α ≤ 1 : x_l + α dv > 0, x_u − α dv > 0},  α_d = max{α ≤ 1 : z + α dz ≥ 0}.
 */
import { hasLower, hasUpper, type IpmProblem } from './ipm-problem';
import type { Iterate } from './iterate';

export function maxPrimalStep(prob: IpmProblem, kind: Uint8Array, it: Iterate, d: Iterate): number {
  const { lower, upper } = prob;
  const { v } = it;
  const dv = d.v;
  let a = 1;
  for (let j = 0; j < v.length; j++) {
    const k = kind[j];
    const dj = dv[j];
    if (dj < 0 && hasLower(k)) {
      const r = (lower[j] - v[j]) / dj;
      if (r < a) a = r;
    } else if (dj > 0 && hasUpper(k)) {
      const r = (upper[j] - v[j]) / dj;
      if (r < a) a = r;
    }
  }
  return Math.max(a, 0);
}

export function maxDualStep(kind: Uint8Array, it: Iterate, d: Iterate): number {
  let a = 1;
  const { zl, zu } = it;
  for (let j = 0; j < zl.length; j++) {
    const k = kind[j];
    if (hasLower(k) && d.zl[j] < 0) {
      const r = -zl[j] / d.zl[j];
      if (r < a) a = r;
    }
    if (hasUpper(k) && d.zu[j] < 0) {
      const r = -zu[j] / d.zu[j];
      if (r < a) a = r;
    }
  }
  return Math.max(a, 0);
}

/**
 * The longest primal and dual steps along each blend a + w_q (b − a) of two directions, for four
 * weights w (ratio tests as above, in one pass, without forming the blends): primal[q], dual[q].
 * The minima are kept in locals, not the output arrays, while the entries stream past.
 */
export function blendedSteps(
  prob: IpmProblem,
  kind: Uint8Array,
  it: Iterate,
  a: Iterate,
  b: Iterate,
  w: Float64Array,
  primal: Float64Array,
  dual: Float64Array,
): void {
  if (w.length !== 4) throw new Error(`blendedSteps takes 4 weights, got ${w.length}`);
  const { lower, upper } = prob;
  const { v, zl, zu } = it;
  const [w0, w1, w2, w3] = w;
  let p0 = 1, p1 = 1, p2 = 1, p3 = 1; // prettier-ignore
  let d0 = 1, d1 = 1, d2 = 1, d3 = 1; // prettier-ignore
  for (let j = 0; j < v.length; j++) {
    const k = kind[j];
    const lo = hasLower(k);
    const up = hasUpper(k);
    if (!lo && !up) continue;
    // primal: the slack to the bound the blended step heads for, over that step (r < p written
    // as a product, the direction's sign taken into account)
    const av = a.v[j];
    const bv = b.v[j] - av;
    const gl = lo ? lower[j] - v[j] : 0;
    const gu = up ? upper[j] - v[j] : 0;
    let s = av + w0 * bv;
    if (s < 0 ? lo && gl > p0 * s : up && s > 0 && gu < p0 * s) p0 = (s < 0 ? gl : gu) / s;
    s = av + w1 * bv;
    if (s < 0 ? lo && gl > p1 * s : up && s > 0 && gu < p1 * s) p1 = (s < 0 ? gl : gu) / s;
    s = av + w2 * bv;
    if (s < 0 ? lo && gl > p2 * s : up && s > 0 && gu < p2 * s) p2 = (s < 0 ? gl : gu) / s;
    s = av + w3 * bv;
    if (s < 0 ? lo && gl > p3 * s : up && s > 0 && gu < p3 * s) p3 = (s < 0 ? gl : gu) / s;
    // dual: z + α dz ≥ 0 for each bound the entry has (side 0 the lower, side 1 the upper)
    for (let side = 0; side < 2; side++) {
      if (side === 0 ? !lo : !up) continue;
      const az = side === 0 ? a.zl[j] : a.zu[j];
      const bz = (side === 0 ? b.zl[j] : b.zu[j]) - az;
      const z = side === 0 ? zl[j] : zu[j];
      s = az + w0 * bz;
      if (s < 0 && -z > d0 * s) d0 = -z / s;
      s = az + w1 * bz;
      if (s < 0 && -z > d1 * s) d1 = -z / s;
      s = az + w2 * bz;
      if (s < 0 && -z > d2 * s) d2 = -z / s;
      s = az + w3 * bz;
      if (s < 0 && -z > d3 * s) d3 = -z / s;
    }
  }
  primal[0] = Math.max(p0, 0);
  primal[1] = Math.max(p1, 0);
  primal[2] = Math.max(p2, 0);
  primal[3] = Math.max(p3, 0);
  dual[0] = Math.max(d0, 0);
  dual[1] = Math.max(d1, 0);
  dual[2] = Math.max(d2, 0);
  dual[3] = Math.max(d3, 0);
}
