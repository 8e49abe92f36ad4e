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
 * The longest primal and dual steps along each blend a + w_k (b − a) of two directions, for the
 * weights w (ratio tests as above, in one pass, without forming the blends): primal[k], dual[k].
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
  const { lower, upper } = prob;
  const { v, zl, zu } = it;
  const K = w.length;
  primal.fill(1);
  dual.fill(1);
  for (let j = 0; j < v.length; j++) {
    const k = kind[j];
    const lo = hasLower(k);
    const up = hasUpper(k);
    if (!lo && !up) continue;
    const av = a.v[j];
    const bv = b.v[j] - av;
    const azl = a.zl[j];
    const bzl = b.zl[j] - azl;
    const azu = a.zu[j];
    const bzu = b.zu[j] - azu;
    for (let q = 0; q < K; q++) {
      const wq = w[q];
      const dj = av + wq * bv;
      if (dj < 0 && lo) {
        const r = (lower[j] - v[j]) / dj;
        if (r < primal[q]) primal[q] = r;
      } else if (dj > 0 && up) {
        const r = (upper[j] - v[j]) / dj;
        if (r < primal[q]) primal[q] = r;
      }
      if (lo) {
        const dz = azl + wq * bzl;
        if (dz < 0) {
          const r = -zl[j] / dz;
          if (r < dual[q]) dual[q] = r;
        }
      }
      if (up) {
        const dz = azu + wq * bzu;
        if (dz < 0) {
          const r = -zu[j] / dz;
          if (r < dual[q]) dual[q] = r;
        }
      }
    }
  }
  for (let q = 0; q < K; q++) {
    primal[q] = Math.max(primal[q], 0);
    dual[q] = Math.max(dual[q], 0);
  }
}
