/**
 * The Krylov methods the basis-preconditioned solver runs (ipm/krylov.ts), on systems of the
 * split system's form I + W Wᵀ. References: the solution of the same system by ml-matrix's dense
 * LU; and the defining property of conjugate residuals (Y. Saad, "Iterative Methods for Sparse
 * Linear Systems", 2nd ed., §6.8, from memory): its k-th residual is the smallest ‖b − M x‖₂ over
 * x ∈ x₀ + span{r₀, M r₀, …, M^{k−1} r₀}, computed here by dense least squares (ml-matrix's QR).
 */
import { Matrix, QrDecomposition, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { conjugateGradients, conjugateResiduals, KrylovWork, type Product, type ScaledProduct } from '../src/ipm/krylov';
import { SeededRandom } from './support/seeded-random';

/** M = I + W Wᵀ with W m × k, entries of W spread over several magnitudes, and a right-hand side */
function splitLikeSystem(seed: number, m: number, k: number): { M: Matrix; b: Float64Array } {
  const rng = new SeededRandom(seed);
  const W = new Matrix(m, k);
  for (let i = 0; i < m; i++) for (let j = 0; j < k; j++) if (rng.uniform(0, 1) < 0.3) W.set(i, j, rng.uniform(-2, 2) * 10 ** rng.uniform(-1, 1));
  const M = Matrix.eye(m).add(W.mmul(W.transpose()));
  const b = Float64Array.from({ length: m }, () => rng.uniform(-1, 1));
  return { M, b };
}

/** out ← M v, returning vᵀ out; records each vector it is applied to */
function productOf(M: Matrix, seen: Float64Array[] = []): Product {
  return (v, out) => {
    seen.push(Float64Array.from(v));
    const mv = M.mmul(Matrix.columnVector(Array.from(v))).getColumn(0);
    let s = 0;
    for (let i = 0; i < v.length; i++) {
      out[i] = mv[i];
      s += v[i] * mv[i];
    }
    return s;
  };
}

/** M⁻¹b by ml-matrix's dense solve */
const denseSolution = (M: Matrix, b: Float64Array): number[] => solve(M, Matrix.columnVector(Array.from(b))).getColumn(0);

/** x is the dense solution to 1e-8 of its largest entry */
function expectDenseSolution(M: Matrix, b: Float64Array, x: Float64Array): void {
  const exact = denseSolution(M, b);
  const scale = Math.max(...exact.map(Math.abs));
  exact.forEach((v, i) => expect(Math.abs(x[i] - v)).toBeLessThan(1e-8 * scale));
}

const norm2 = (v: ArrayLike<number>): number => Math.sqrt(Array.from(v).reduce((s, x) => s + x * x, 0));
const noDeadline = { deadline: Infinity };

describe('conjugate residuals and conjugate gradients on I + W Wᵀ', () => {
  it('both reach the dense solution; conjugate residuals from a warm start at the solution take no step', () => {
    for (const seed of [1, 2, 3]) {
      const m = 50;
      const { M, b } = splitLikeSystem(seed, m, 30);
      const exact = denseSolution(M, b);
      const work = new KrylovWork(m);
      const xr = new Float64Array(m);
      const stepsCr = conjugateResiduals(xr, b, productOf(M), null, { target: 1e-11, limit: 500, ...noDeadline }, work);
      const xg = new Float64Array(m);
      const diag = Float64Array.from({ length: m }, (_, i) => M.get(i, i));
      const stepsCg = conjugateGradients(xg, b, productOf(M), (r, z) => z.forEach((_, i) => (z[i] = r[i] / diag[i])), null, { target: 1e-11, limit: 500, ...noDeadline }, work);
      expect(stepsCr).toBeGreaterThan(0);
      expect(stepsCg).toBeGreaterThan(0);
      expectDenseSolution(M, b, xr);
      expectDenseSolution(M, b, xg);
      const again = new Float64Array(m);
      expect(conjugateResiduals(again, b, productOf(M), Float64Array.from(exact), { target: 1e-9, limit: 500, ...noDeadline }, work)).toBe(0);
      expect(Array.from(again)).toEqual(exact);
    }
  });

  it("conjugate residuals' k-th residual is the least ‖b − M x‖₂ over x₀ + the k-th Krylov space, and never grows", () => {
    const m = 40;
    const { M, b } = splitLikeSystem(7, m, 25);
    // the method applies M to x₀ (= 0: r₀ = b), then to each residual r₀, r₁, …
    const seen: Float64Array[] = [];
    const x = new Float64Array(m);
    const steps = conjugateResiduals(x, b, productOf(M, seen), null, { target: 0, limit: 8, ...noDeadline }, new KrylovWork(m));
    expect(steps).toBe(-8);
    const residuals = seen.slice(1).map(norm2);
    expect(residuals.length).toBe(8);
    for (let k = 1; k < residuals.length; k++) expect(residuals[k]).toBeLessThanOrEqual(residuals[k - 1] * (1 + 1e-12));
    // least squares over span{b, M b, …, M^{k−1} b}, with an orthonormalised basis for conditioning
    const r0 = Matrix.columnVector(Array.from(b));
    const powers: Matrix[] = [r0];
    for (let k = 1; k < residuals.length; k++) powers.push(M.mmul(powers[k - 1]));
    for (let k = 1; k < residuals.length; k++) {
      const V = new Matrix(m, k);
      for (let c = 0; c < k; c++) V.setColumn(c, powers[c].getColumn(0));
      const Q = new QrDecomposition(V).orthogonalMatrix.subMatrix(0, m - 1, 0, k - 1);
      const MQ = M.mmul(Q);
      const coef = new QrDecomposition(MQ).solve(r0);
      const best = norm2(r0.clone().sub(MQ.mmul(coef)).getColumn(0));
      expect(Math.abs(residuals[k] - best)).toBeLessThan(1e-9 * norm2(b));
    }
  });

  it('a limit of steps returns the steps negated and leaves the iterate of smallest ‖r‖∞ seen', () => {
    const m = 60;
    const { M, b } = splitLikeSystem(11, m, 45);
    const seen: Float64Array[] = [];
    const x = new Float64Array(m);
    const steps = conjugateResiduals(x, b, productOf(M, seen), null, { target: 0, limit: 5, ...noDeadline }, new KrylovWork(m));
    expect(steps).toBe(-5);
    // r₀ … r₄ were multiplied; r₅ is what x leaves
    const left = M.mmul(Matrix.columnVector(Array.from(x))).getColumn(0).map((v, i) => b[i] - v);
    const leftNorm = Math.max(...left.map(Math.abs));
    const smallest = Math.min(...seen.slice(1).map((r) => Math.max(...Array.from(r, Math.abs))));
    expect(leftNorm).toBeLessThanOrEqual(smallest * (1 + 1e-9));
  });

  it('taken apart as v + s ∘ R(s ∘ v), the product gives conjugate residuals the same residuals step by step', () => {
    // M = I + S R S with R = W Wᵀ positive semidefinite and S a positive diagonal
    const m = 45;
    const rng = new SeededRandom(23);
    const { M: IplusR, b } = splitLikeSystem(19, m, 30);
    const R = IplusR.sub(Matrix.eye(m));
    const s = Float64Array.from({ length: m }, () => 10 ** rng.uniform(-1, 1));
    const S = Matrix.diag(Array.from(s));
    const M = Matrix.eye(m).add(S.mmul(R).mmul(S));
    const input = new Float64Array(m);
    const scaled: ScaledProduct = {
      fusedScale: s,
      input,
      applyToInput(out) {
        const rv = R.mmul(Matrix.columnVector(Array.from(input))).getColumn(0);
        rv.forEach((v, i) => (out[i] = v));
        return rv.reduce((sum, v, i) => sum + v * input[i], 0);
      },
    };
    const whole: Float64Array[] = [];
    const xWhole = new Float64Array(m);
    const stepsWhole = conjugateResiduals(xWhole, b, productOf(M, whole), null, { target: 1e-10, limit: 200, ...noDeadline }, new KrylovWork(m));
    // taken apart, the method multiplies whole only at the start (x₀ and r₀); it puts s ∘ r_k in input
    const apart: Float64Array[] = [];
    const recording: ScaledProduct = { ...scaled, input, applyToInput: (out) => (apart.push(input.map((v, i) => v / s[i])), scaled.applyToInput(out)) };
    const xApart = new Float64Array(m);
    const stepsApart = conjugateResiduals(xApart, b, productOf(M), null, { target: 1e-10, limit: 200, ...noDeadline }, new KrylovWork(m), recording);
    // the same iterates up to rounding (which, over this many steps, may move the last step or two)
    expect(Math.abs(stepsApart - stepsWhole)).toBeLessThanOrEqual(3);
    expect(stepsWhole).toBeGreaterThan(12);
    for (let k = 0; k < 10; k++) expect(norm2(apart[k])).toBeCloseTo(norm2(whole[k + 2]), 8);
    expectDenseSolution(M, b, xApart);
  });

  it('with no scale to hand (updates pending in the split system) the whole product serves', () => {
    const m = 30;
    const { M, b } = splitLikeSystem(5, m, 20);
    const unused: ScaledProduct = { fusedScale: null, input: new Float64Array(m), applyToInput: () => { throw new Error('not to be called'); } };
    const x = new Float64Array(m);
    const steps = conjugateResiduals(x, b, productOf(M), null, { target: 1e-10, limit: 200, ...noDeadline }, new KrylovWork(m), unused);
    expect(steps).toBeGreaterThan(0);
    expectDenseSolution(M, b, x);
  });
});
