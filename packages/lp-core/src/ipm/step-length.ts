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
