/**
 * Solves with a factor L D Lᵀ (unit lower L in CSC): x ← L⁻ᵀ D⁻¹ L⁻¹ x, in place.
 */
import type { SymbolicFactor } from './symbolic';
import type { NumericFactor } from './ldl';

/** x ← L⁻¹ x (forward substitution, column oriented) */
export function lowerSolve(sym: SymbolicFactor, Lx: Float64Array, x: Float64Array): void {
  const { n, Lp, Li } = sym;
  for (let j = 0; j < n; j++) {
    const xj = x[j];
    if (xj === 0) continue;
    for (let p = Lp[j]; p < Lp[j + 1]; p++) x[Li[p]] -= Lx[p] * xj;
  }
}

/** x ← L⁻ᵀ x (backward substitution, dot products down each column) */
export function lowerTransposeSolve(sym: SymbolicFactor, Lx: Float64Array, x: Float64Array): void {
  const { n, Lp, Li } = sym;
  for (let j = n - 1; j >= 0; j--) {
    let s = x[j];
    for (let p = Lp[j]; p < Lp[j + 1]; p++) s -= Lx[p] * x[Li[p]];
    x[j] = s;
  }
}

/** x ← (L D Lᵀ)⁻¹ x */
export function ldlSolve(sym: SymbolicFactor, F: NumericFactor, x: Float64Array): void {
  lowerSolve(sym, F.Lx, x);
  const { Dinv } = F;
  for (let j = 0; j < sym.n; j++) x[j] *= Dinv[j];
  lowerTransposeSolve(sym, F.Lx, x);
}
