/**
 * Starting point in the manner of Mehrotra (1992), adapted to bounds:
 *  1. v: the point of the bound box nearest 0, projected onto Â v = 0 (one solve with D = I);
 *  2. y: least squares  min ‖c − Âᵀ y‖  (same factorisation), z = c + Q v − Âᵀ y split by sign;
 *  3. both shifted into the interior, first by 1.5 × the most negative entry, then by
 *     ½ (x_lᵀz_l + x_uᵀz_u) / Σz (primal) and / Σx (dual) so products are balanced.
 */
import { multiplyAx, multiplyATy, multiplySymLower } from '../sparse/csc';
import { BOXED, FIXED, FREE, LOWER, UPPER, type IpmProblem } from './ipm-problem';
import type { Iterate } from './iterate';
import type { KktSolver, KktStatus } from './kkt-solver';

const SLACK_FLOOR = 1e-2;
const DUAL_FLOOR = 1e-2;

export function startingPoint(
  prob: IpmProblem,
  kind: Uint8Array,
  kkt: KktSolver,
  it: Iterate,
  dir: Iterate,
  rhat: Float64Array,
  rp: Float64Array,
  deadline = Infinity,
): KktStatus {
  const { n, m, A, c, lower, upper } = prob;
  const N = n + m;
  const D = new Float64Array(N);
  for (let j = 0; j < N; j++) D[j] = kind[j] === FIXED ? Infinity : 1;
  const status = kkt.factorise(D, deadline);
  if (status !== 'factorised') return status;
  const { v, y, zl, zu } = it;
  for (let j = 0; j < N; j++) v[j] = Math.min(Math.max(0, lower[j]), upper[j]);
  // project onto Â v = 0
  for (let i = 0; i < m; i++) rp[i] = v[n + i];
  multiplyAx(A, v, rp, -1);
  rhat.fill(0);
  kkt.solve(rhat, rp, dir.v, dir.y);
  for (let j = 0; j < N; j++) if (kind[j] !== FIXED) v[j] += dir.v[j];
  // least-squares duals
  for (let j = 0; j < N; j++) rhat[j] = j < n ? -c[j] : 0;
  rp.fill(0);
  kkt.solve(rhat, rp, dir.v, y);
  const g = new Float64Array(N);
  g.set(c);
  if (prob.Q) multiplySymLower(prob.Q, v, g);
  multiplyATy(A, y, g, -1);
  for (let i = 0; i < m; i++) g[n + i] = y[i];

  const sl = new Float64Array(N);
  const su = new Float64Array(N);
  let minSlack = Infinity;
  let minDual = Infinity;
  for (let j = 0; j < N; j++) {
    const k = kind[j];
    zl[j] = 0;
    zu[j] = 0;
    if (k === LOWER || k === BOXED) {
      sl[j] = v[j] - lower[j];
      minSlack = Math.min(minSlack, sl[j]);
    }
    if (k === UPPER || k === BOXED) {
      su[j] = upper[j] - v[j];
      minSlack = Math.min(minSlack, su[j]);
    }
    if (k === LOWER) zl[j] = g[j];
    else if (k === UPPER) zu[j] = -g[j];
    else if (k === BOXED) {
      zl[j] = Math.max(g[j], 0);
      zu[j] = Math.max(-g[j], 0);
    }
    if (k === LOWER || k === BOXED) minDual = Math.min(minDual, zl[j]);
    if (k === UPPER || k === BOXED) minDual = Math.min(minDual, zu[j]);
  }
  const dp = Number.isFinite(minSlack) ? Math.max(-1.5 * minSlack, 0) : 0;
  const dd = Number.isFinite(minDual) ? Math.max(-1.5 * minDual, 0) : 0;
  let pd = 0;
  let sumS = 0;
  let sumZ = 0;
  for (let j = 0; j < N; j++) {
    const k = kind[j];
    if (k === LOWER || k === BOXED) {
      pd += (sl[j] + dp) * (zl[j] + dd);
      sumS += sl[j] + dp;
      sumZ += zl[j] + dd;
    }
    if (k === UPPER || k === BOXED) {
      pd += (su[j] + dp) * (zu[j] + dd);
      sumS += su[j] + dp;
      sumZ += zu[j] + dd;
    }
  }
  const dp2 = sumZ > 0 && pd > 0 ? (0.5 * pd) / sumZ : 0;
  const dd2 = sumS > 0 && pd > 0 ? (0.5 * pd) / sumS : 0;
  const shift = dp + dp2;
  for (let j = 0; j < N; j++) {
    const k = kind[j];
    if (k === FIXED) {
      v[j] = lower[j];
      continue;
    }
    if (k === FREE) continue;
    if (k === LOWER) {
      v[j] = lower[j] + Math.max(sl[j] + shift, SLACK_FLOOR);
      zl[j] = Math.max(zl[j] + dd + dd2, DUAL_FLOOR);
    } else if (k === UPPER) {
      v[j] = upper[j] - Math.max(su[j] + shift, SLACK_FLOOR);
      zu[j] = Math.max(zu[j] + dd + dd2, DUAL_FLOOR);
    } else {
      const half = 0.5 * (upper[j] - lower[j]);
      const margin = Math.min(Math.max(shift, 1), half);
      v[j] = Math.min(Math.max(v[j], lower[j] + margin), upper[j] - margin);
      zl[j] = Math.max(zl[j] + dd + dd2, DUAL_FLOOR);
      zu[j] = Math.max(zu[j] + dd + dd2, DUAL_FLOOR);
    }
  }
  return 'factorised';
}
