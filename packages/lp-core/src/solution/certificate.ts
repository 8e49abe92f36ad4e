/**
 * The certificate of a solution, measured on the original problem (never the scaled or
 * presolved one). With row activities r = A x and reduced costs z = c + Q x − Aᵀ y:
 *
 *   primal residual = max bound violation of r and x            / (1 + ‖finite bounds‖∞)
 *   dual residual   = max sign violation of y and z (a multiplier that pushes against a bound
 *                     that does not exist, e.g. z_j < 0 with u_j = ∞)  / (1 + ‖c‖∞)
 *   relative gap    = |primal − dual objective| / (1 + |primal objective|),
 *   dual objective  = c₀ − ½ xᵀQx + Σ (l_r y⁺ − u_r y⁻) + Σ (l z⁺ − u z⁻).
 */
import type { Problem } from '../problem/problem';
import type { Certificate } from './result';
import { multiplyAx, multiplyATy, multiplySymLower } from '../sparse/csc';

export interface CertifiedPoint {
  certificate: Certificate;
  primalObjective: number;
  dualObjective: number;
  rowActivity: Float64Array;
  reducedCosts: Float64Array;
}

export function certify(p: Problem, x: Float64Array, y: Float64Array): CertifiedPoint {
  const n = p.c.length;
  const m = p.rowLower.length;
  const rowActivity = new Float64Array(m);
  multiplyAx(p.A, x, rowActivity);
  const Qx = new Float64Array(n);
  if (p.Q) multiplySymLower(p.Q, x, Qx);
  const z = new Float64Array(n);
  for (let j = 0; j < n; j++) z[j] = p.c[j] + Qx[j];
  multiplyATy(p.A, y, z, -1);

  let bNorm = 0;
  let pViol = 0;
  let dViol = 0;
  let dualBound = 0;
  const side = (value: number, mult: number, lo: number, up: number): void => {
    if (lo > -Infinity) bNorm = Math.max(bNorm, Math.abs(lo));
    if (up < Infinity) bNorm = Math.max(bNorm, Math.abs(up));
    pViol = Math.max(pViol, lo - value, value - up);
    if (mult > 0) {
      if (lo > -Infinity) dualBound += lo * mult;
      else dViol = Math.max(dViol, mult);
    } else if (mult < 0) {
      if (up < Infinity) dualBound += up * mult;
      else dViol = Math.max(dViol, -mult);
    }
  };
  for (let i = 0; i < m; i++) side(rowActivity[i], y[i], p.rowLower[i], p.rowUpper[i]);
  let cNorm = 0;
  let cx = 0;
  let xQx = 0;
  for (let j = 0; j < n; j++) {
    side(x[j], z[j], p.colLower[j], p.colUpper[j]);
    cNorm = Math.max(cNorm, Math.abs(p.c[j]));
    cx += p.c[j] * x[j];
    xQx += x[j] * Qx[j];
  }
  const primalObjective = p.c0 + cx + 0.5 * xQx;
  const dualObjective = p.c0 - 0.5 * xQx + dualBound;
  return {
    certificate: {
      primalResidual: Math.max(pViol, 0) / (1 + bNorm),
      dualResidual: dViol / (1 + cNorm),
      relativeGap: Math.abs(primalObjective - dualObjective) / (1 + Math.abs(primalObjective)),
    },
    primalObjective,
    dualObjective,
    rowActivity,
    reducedCosts: z,
  };
}
