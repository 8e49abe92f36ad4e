/**
 * Krylov methods for M x = b with M symmetric positive definite, M given only as a product
 * (apply(v, out): out ← M v, returning vᵀ out). Both stop on the residual's largest entry,
 * ‖r‖∞ ≤ target, start from x as given or from a warm vector (whichever leaves the smaller
 * residual), and leave in x the iterate with the smallest ‖r‖∞ seen. They return the steps taken
 * (one product each), negated when `limit` steps or the deadline came first.
 *
 *  - conjugateGradients (optionally preconditioned, z ← P⁻¹ r): minimises the M-norm of the
 *    error over the Krylov space; its residual may grow from one step to the next;
 *  - conjugateResiduals: minimises ‖r‖₂ over the same space (Y. Saad, "Iterative Methods for
 *    Sparse Linear Systems", 2nd ed., §6.8), so the residual never grows, which suits a test on the
 *    residual. The same one product a step; it carries M p by recurrence (in the pass that updates p).
 *    HiGHS's interior point solves its split system this way too. Measured on the bench's split
 *    systems (basis-cg-solver.ts), conjugate gradients against conjugate residuals: XL 8966 →
 *    8222 steps, L 2413 → 2243, same iterations within one. Given the split system's product
 *    taken apart (ScaledProduct), it folds the product's first and last vector passes into its
 *    own: a step on XL's systems (one process, alternating, best of 8 runs of 60 steps) 2.39 →
 *    2.23 ms at the 18th preparation, 3.39 → 3.23 ms at the 30th.
 */
import { maxAbs } from './normal-matrix';
import { dot } from '../vectors';

export type Product = (v: Float64Array, out: Float64Array) => number;

/**
 * A product M v = v + s ∘ R(s ∘ v) whose two ends conjugate residuals can fold into its own vector
 * passes (the split system's, split-system.ts): the method writes s ∘ v into `input` as it updates
 * v, and forms v + s ∘ R(…) as it updates the directions, instead of two more passes in the product.
 * fusedScale is s, or null when the product cannot be taken apart now.
 */
export interface ScaledProduct {
  readonly fusedScale: Float64Array | null;
  readonly input: Float64Array;
  /** out ← R(input); returns inputᵀ R input (= vᵀMv − vᵀv) */
  applyToInput(out: Float64Array): number;
}

/** work vectors of length m, reused from solve to solve */
export class KrylovWork {
  readonly r: Float64Array;
  readonly z: Float64Array;
  readonly p: Float64Array;
  readonly q: Float64Array;
  readonly s: Float64Array;
  readonly best: Float64Array;

  constructor(readonly m: number) {
    this.r = new Float64Array(m);
    this.z = new Float64Array(m);
    this.p = new Float64Array(m);
    this.q = new Float64Array(m);
    this.s = new Float64Array(m);
    this.best = new Float64Array(m);
  }
}

export interface KrylovStop {
  target: number;
  limit: number;
  /** performance.now() past which the method stops (checked every 64 steps) */
  deadline: number;
}

/**
 * r ← b − M x, or b − M warm with x ← warm when that is smaller; returns ‖r‖∞.
 * (The previous solve of an interior-point iteration is often closer.)
 */
function startingResidual(x: Float64Array, b: Float64Array, apply: Product, warm: Float64Array | null, work: KrylovWork): number {
  const { m, r, q } = work;
  apply(x, q);
  for (let i = 0; i < m; i++) r[i] = b[i] - q[i];
  let norm = maxAbs(r);
  if (warm) {
    apply(warm, q);
    for (let i = 0; i < m; i++) q[i] = b[i] - q[i];
    const warmNorm = maxAbs(q);
    if (warmNorm < norm) {
      norm = warmNorm;
      r.set(q);
      x.set(warm);
    }
  }
  return norm;
}

/**
 * Keeps track of the iterate with the smallest ‖r‖∞: x is that iterate until a step makes the
 * residual worse; only then is the iterate before the step kept (x − αp), not copied at every step
 * that improves it.
 */
class BestIterate {
  private isCurrent = true;

  constructor(
    private norm: number,
    private readonly work: KrylovWork,
  ) {}

  /** after the step x += αp that left the residual norm `norm` */
  record(norm: number, x: Float64Array, alpha: number): void {
    if (norm < this.norm) {
      this.norm = norm;
      this.isCurrent = true;
    } else if (this.isCurrent) {
      const { best, p, m } = this.work;
      for (let i = 0; i < m; i++) best[i] = x[i] - alpha * p[i];
      this.isCurrent = false;
    }
  }

  restore(x: Float64Array): void {
    if (!this.isCurrent) x.set(this.work.best);
  }
}

export function conjugateGradients(
  x: Float64Array,
  b: Float64Array,
  apply: Product,
  precondition: ((r: Float64Array, z: Float64Array) => void) | null,
  warm: Float64Array | null,
  stop: KrylovStop,
  work: KrylovWork,
): number {
  const { m, r, p, q } = work;
  const z = precondition ? work.z : r;
  const startNorm = startingResidual(x, b, apply, warm, work);
  if (!(startNorm > stop.target)) return 0;
  const best = new BestIterate(startNorm, work);
  precondition?.(r, z);
  p.set(z);
  let rz = dot(r, z);
  let steps = 0;
  let converged = false;
  while (steps < stop.limit) {
    steps++;
    const pq = apply(p, q);
    const alpha = rz / pq;
    // a breakdown leaves x as it was (and the best iterate recoverable from it)
    if (!(pq > 0) || !Number.isFinite(alpha)) break;
    // one pass: the update, ‖r‖∞ and rᵀr
    let norm = 0;
    let rr = 0;
    for (let i = 0; i < m; i++) {
      x[i] += alpha * p[i];
      const ri = r[i] - alpha * q[i];
      r[i] = ri;
      const a = Math.abs(ri);
      if (a > norm) norm = a;
      rr += ri * ri;
    }
    if (!(rr < Infinity)) norm = Infinity;
    best.record(norm, x, alpha);
    if (norm <= stop.target) {
      converged = true;
      break;
    }
    if ((steps & 63) === 0 && performance.now() > stop.deadline) break;
    let rzNext = rr;
    if (precondition) {
      precondition(r, z);
      rzNext = dot(r, z);
    }
    const beta = rzNext / rz;
    rz = rzNext;
    for (let i = 0; i < m; i++) p[i] = z[i] + beta * p[i];
  }
  best.restore(x);
  return converged ? steps : -steps;
}

export function conjugateResiduals(
  x: Float64Array,
  b: Float64Array,
  apply: Product,
  warm: Float64Array | null,
  stop: KrylovStop,
  work: KrylovWork,
  /** the same product taken apart (see ScaledProduct), or null */
  scaled: ScaledProduct | null = null,
): number {
  const { m, r, p } = work;
  // q carries M p, s holds M r (or, fused, R(scale ∘ r))
  const { q: mp, s: mr } = work;
  const startNorm = startingResidual(x, b, apply, warm, work);
  if (!(startNorm > stop.target)) return 0;
  const best = new BestIterate(startNorm, work);
  // taken apart only while the product has a scale to hand
  const scale = scaled?.fusedScale ?? null;
  const input = scale ? scaled!.input : null;
  p.set(r);
  let rMr = apply(r, mr);
  mp.set(mr);
  // (M p)ᵀ(M p), summed in the pass that updates M p
  let mpmp = dot(mp, mp);
  let steps = 0;
  let converged = false;
  while (steps < stop.limit) {
    steps++;
    const alpha = rMr / mpmp;
    // a breakdown leaves x as it was (and the best iterate recoverable from it)
    if (!(mpmp > 0) || !(rMr > 0) || !Number.isFinite(alpha)) break;
    // one pass: the update, ‖r‖∞, rᵀr, and (taken apart) the product's input s ∘ r
    let norm = 0;
    let rr = 0;
    for (let i = 0; i < m; i++) {
      x[i] += alpha * p[i];
      const ri = r[i] - alpha * mp[i];
      r[i] = ri;
      if (input) input[i] = scale![i] * ri;
      const a = Math.abs(ri);
      if (a > norm) norm = a;
      rr += ri * ri;
    }
    if (!(norm < Infinity) || !(rr < Infinity)) norm = Infinity;
    best.record(norm, x, alpha);
    if (norm <= stop.target) {
      converged = true;
      break;
    }
    if (steps === stop.limit || ((steps & 63) === 0 && performance.now() > stop.deadline)) break;
    // the next step's product: M r of the new residual
    const rMrNext = input ? rr + scaled!.applyToInput(mr) : apply(r, mr);
    const beta = rMrNext / rMr;
    rMr = rMrNext;
    // one pass: p and M p (M r = r + s ∘ R(s ∘ r) when taken apart), and (M p)ᵀ(M p)
    mpmp = 0;
    for (let i = 0; i < m; i++) {
      const ri = r[i];
      p[i] = ri + beta * p[i];
      const v = (input ? ri + scale![i] * mr[i] : mr[i]) + beta * mp[i];
      mp[i] = v;
      mpmp += v * v;
    }
  }
  best.restore(x);
  return converged ? steps : -steps;
}
