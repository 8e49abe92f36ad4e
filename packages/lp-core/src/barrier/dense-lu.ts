/**
 * Dense LU factorisation with partial pivoting, P K = L U, in place on a row-major Float64Array
 * (Golub & Van Loan, Matrix Computations, Alg. 3.4.1). Used for the Newton KKT systems of the
 * barrier method, which are small and symmetric indefinite. Buffers are owned by the caller.
 */
export class DenseLu {
  readonly size: number;
  /** row-major n×n: the matrix before factorise(), L (unit, below) and U (on and above) after */
  readonly a: Float64Array;
  private readonly pivot: Int32Array;

  constructor(size: number) {
    this.size = size;
    this.a = new Float64Array(size * size);
    this.pivot = new Int32Array(size);
  }

  /** Factorises `a` in place; returns false when a pivot is exactly zero or not finite (singular). */
  factorise(): boolean {
    const { a, size: n, pivot } = this;
    for (let k = 0; k < n; k++) {
      let p = k;
      let best = Math.abs(a[k * n + k]);
      for (let i = k + 1; i < n; i++) {
        const v = Math.abs(a[i * n + k]);
        if (v > best) {
          best = v;
          p = i;
        }
      }
      if (!(best > 0) || !Number.isFinite(best)) return false;
      pivot[k] = p;
      if (p !== k) {
        for (let j = 0; j < n; j++) {
          const tmp = a[k * n + j];
          a[k * n + j] = a[p * n + j];
          a[p * n + j] = tmp;
        }
      }
      const inv = 1 / a[k * n + k];
      for (let i = k + 1; i < n; i++) {
        const lik = (a[i * n + k] *= inv);
        if (lik === 0) continue;
        for (let j = k + 1; j < n; j++) a[i * n + j] -= lik * a[k * n + j];
      }
    }
    return true;
  }

  /** Solves (P K) x = P b in place in `b` after factorise(). */
  solve(b: Float64Array): void {
    const { a, size: n, pivot } = this;
    for (let k = 0; k < n; k++) {
      const p = pivot[k];
      if (p !== k) {
        const tmp = b[k];
        b[k] = b[p];
        b[p] = tmp;
      }
    }
    for (let i = 0; i < n; i++) {
      let s = b[i];
      for (let j = 0; j < i; j++) s -= a[i * n + j] * b[j];
      b[i] = s;
    }
    for (let i = n - 1; i >= 0; i--) {
      let s = b[i];
      for (let j = i + 1; j < n; j++) s -= a[i * n + j] * b[j];
      b[i] = s / a[i * n + i];
    }
  }
}
