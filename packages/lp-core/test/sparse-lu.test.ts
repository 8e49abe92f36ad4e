/**
 * Sparse LU (sparse-lu.ts): solves with B and Bᵀ checked against ml-matrix's dense LU solve (a
 * reference library) on seeded sparse matrices; dependent columns refused, as the rank of the
 * dense matrix (ml-matrix's SVD) says they must be.
 */
import { describe, expect, it } from 'vitest';
import { Matrix, SingularValueDecomposition, solve as denseSolve } from 'ml-matrix';
import { SparseLu } from '../src/sparse/sparse-lu';
import { SeededRandom } from './support/seeded-random';

interface SparseColumn {
  rows: number[];
  vals: number[];
}

function randomColumn(rng: SeededRandom, m: number, count: number): SparseColumn {
  const rows = new Set<number>();
  while (rows.size < count) rows.add(rng.integer(0, m - 1));
  const r = [...rows];
  return { rows: r, vals: r.map(() => (rng.chance(0.5) ? -1 : 1) * rng.uniform(0.1, 3)) };
}

function dense(m: number, cols: SparseColumn[]): Matrix {
  const B = Matrix.zeros(m, cols.length);
  cols.forEach((c, k) => c.rows.forEach((i, p) => B.set(i, k, c.vals[p])));
  return B;
}

function offerAll(lu: SparseLu, cols: SparseColumn[]): SparseColumn[] {
  const taken: SparseColumn[] = [];
  for (const c of cols) if (lu.offer(c.rows, c.vals, 0, c.rows.length, 1e-9)) taken.push(c);
  return taken;
}

describe('sparse LU', () => {
  it('1 × 1 and a permutation: pivots where the entries are', () => {
    const lu = new SparseLu(1);
    expect(lu.offer([0], [4], 0, 1, 1e-9)).toBe(true);
    const x = Float64Array.from([2]);
    lu.solve(x, new Float64Array(1));
    expect(x[0]).toBeCloseTo(0.5, 15);
    const p = new SparseLu(3);
    offerAll(p, [
      { rows: [2], vals: [2] },
      { rows: [0], vals: [-1] },
      { rows: [1], vals: [5] },
    ]);
    const y = Float64Array.from([1, 1, 1]);
    p.solve(y, new Float64Array(3));
    expect([...y]).toEqual([0.5, -1, 0.2]);
  });

  it.each([
    [1, 30, 3],
    [2, 120, 4],
    [3, 400, 3],
  ])('seed %i, %i × %i-per-column random matrix plus unit columns: B x = b and Bᵀ y = c match the dense solve', (seed, m, perColumn) => {
    const rng = new SeededRandom(seed);
    const cols: SparseColumn[] = [];
    for (let k = 0; k < 2 * m; k++) cols.push(randomColumn(rng, m, rng.integer(1, perColumn)));
    for (let i = 0; i < m; i++) cols.push({ rows: [i], vals: [1] });
    const lu = new SparseLu(m);
    const taken = offerAll(lu, cols);
    expect(lu.rank).toBe(m);
    const B = dense(m, taken);
    const b = Array.from({ length: m }, () => rng.uniform(-1, 1));
    const x = Float64Array.from(b);
    const work = new Float64Array(m);
    lu.solve(x, work);
    const ref = denseSolve(B, Matrix.columnVector(b)).to1DArray();
    for (let i = 0; i < m; i++) expect(x[i]).toBeCloseTo(ref[i], 8);
    const y = Float64Array.from(b);
    lu.solveTransposed(y, work);
    const refT = denseSolve(B.transpose(), Matrix.columnVector(b)).to1DArray();
    for (let i = 0; i < m; i++) expect(y[i]).toBeCloseTo(refT[i], 8);
  });

  it('with a cost per row, pivots in the cheapest row within a tenth of the largest candidate, and still solves exactly', () => {
    // threshold partial pivoting (the 0.1 threshold is common practice, no source)
    const rng = new SeededRandom(5);
    const m = 200;
    const cols: SparseColumn[] = [];
    for (let k = 0; k < 2 * m; k++) cols.push(randomColumn(rng, m, rng.integer(1, 4)));
    for (let i = 0; i < m; i++) cols.push({ rows: [i], vals: [1] });
    const cost = Int32Array.from({ length: m }, () => rng.integer(1, 30));
    const lu = new SparseLu(m, 4 * m, cost);
    const taken: SparseColumn[] = [];
    for (const c of cols) if (lu.offer(c.rows, c.vals, 0, c.rows.length, 1e-9)) taken.push(c);
    expect(lu.rank).toBe(m);
    const B = dense(m, taken);
    // P B = L U: every pivot |U_kk| is at least a tenth of the largest entry of L's column k times |U_kk|,
    // i.e. no multiplier of L exceeds 10 in size
    for (let k = 0; k < m; k++) for (let p = lu.Lp[k] + 1; p < lu.Lp[k + 1]; p++) expect(Math.abs(lu.Lx[p])).toBeLessThanOrEqual(10 + 1e-12);
    const b = Array.from({ length: m }, () => rng.uniform(-1, 1));
    const x = Float64Array.from(b);
    lu.solve(x, new Float64Array(m));
    const ref = denseSolve(B, Matrix.columnVector(b)).to1DArray();
    for (let i = 0; i < m; i++) expect(x[i]).toBeCloseTo(ref[i], 8);
    // and the costs steered the pivots: cheaper rows on average than plain partial pivoting picks
    const plain = new SparseLu(m);
    for (const c of taken) plain.offer(c.rows, c.vals, 0, c.rows.length, 1e-9);
    const meanCost = (f: SparseLu) => Array.from(f.pivotRow).reduce((s, i) => s + cost[i], 0) / m;
    expect(meanCost(lu)).toBeLessThanOrEqual(meanCost(plain));
  });

  it('a sparse right-hand side: the sparse solve matches the dense one, touches only its pattern, and its pattern holds every nonzero', () => {
    const rng = new SeededRandom(8);
    const m = 300;
    const cols: SparseColumn[] = [];
    for (let k = 0; k < 2 * m; k++) cols.push(randomColumn(rng, m, rng.integer(1, 3)));
    for (let i = 0; i < m; i++) cols.push({ rows: [i], vals: [1] });
    const lu = new SparseLu(m);
    const B = dense(m, offerAll(lu, cols));
    const x = new Float64Array(m);
    const pattern = new Int32Array(m);
    for (let trial = 0; trial < 20; trial++) {
      const b = randomColumn(rng, m, rng.integer(1, 3));
      const count = lu.solveSparse(b.rows, b.vals, 0, b.rows.length, x, pattern);
      const bDense = new Array(m).fill(0);
      b.rows.forEach((i, p) => (bDense[i] = b.vals[p]));
      const ref = denseSolve(B, Matrix.columnVector(bDense)).to1DArray();
      const inPattern = new Set(pattern.subarray(0, count));
      for (let k = 0; k < m; k++) {
        expect(x[k]).toBeCloseTo(ref[k], 8);
        if (!inPattern.has(k)) expect(x[k]).toBe(0);
        if (Math.abs(ref[k]) > 1e-12) expect(inPattern.has(k)).toBe(true);
      }
      for (let q = 0; q < count; q++) x[pattern[q]] = 0;
    }
  });

  it('refuses columns in the span of those taken, and the rank it reaches is the matrix rank', () => {
    const rng = new SeededRandom(11);
    const m = 40;
    const base: SparseColumn[] = Array.from({ length: 25 }, () => randomColumn(rng, m, 3));
    // sums of two earlier columns are dependent
    const sums: SparseColumn[] = Array.from({ length: 20 }, () => {
      const a = base[rng.integer(0, 24)];
      const b = base[rng.integer(0, 24)];
      const acc = new Map<number, number>();
      a.rows.forEach((i, p) => acc.set(i, (acc.get(i) ?? 0) + a.vals[p]));
      b.rows.forEach((i, p) => acc.set(i, (acc.get(i) ?? 0) + 2 * b.vals[p]));
      return { rows: [...acc.keys()], vals: [...acc.values()] };
    });
    const all = [...base, ...sums];
    const lu = new SparseLu(m);
    const taken = offerAll(lu, all);
    const rank = new SingularValueDecomposition(dense(m, all), { autoTranspose: true }).rank;
    expect(lu.rank).toBe(rank);
    // what was taken is independent
    expect(new SingularValueDecomposition(dense(m, taken)).rank).toBe(taken.length);
  });

  it('a refused column leaves the factorisation exactly as it was', () => {
    const m = 3;
    const lu = new SparseLu(m);
    lu.offer([0, 1], [1, 2], 0, 2, 1e-9);
    expect(lu.offer([0, 1], [2, 4], 0, 2, 1e-9)).toBe(false);
    lu.offer([1, 2], [1, 1], 0, 2, 1e-9);
    lu.offer([2], [3], 0, 1, 1e-9);
    const B = dense(m, [
      { rows: [0, 1], vals: [1, 2] },
      { rows: [1, 2], vals: [1, 1] },
      { rows: [2], vals: [3] },
    ]);
    const x = Float64Array.from([1, 2, 3]);
    lu.solve(x, new Float64Array(m));
    const ref = denseSolve(B, Matrix.columnVector([1, 2, 3])).to1DArray();
    for (let i = 0; i < m; i++) expect(x[i]).toBeCloseTo(ref[i], 12);
  });

  it('column singletons offered without a search give the same factors as offer(), a column meeting a filled L column is left to offer(), and the rest still solves like the dense LU', () => {
    // a lower-triangular block (each column has one row not yet taken when offered in order),
    // then random columns: the shape of a planning basis in triangular-first order
    const rng = new SeededRandom(31);
    const m = 60;
    const singletons: SparseColumn[] = [];
    for (let k = 0; k < 40; k++) {
      const extra = new Set<number>();
      for (let t = 0; t < 3 && k > 0; t++) extra.add(rng.integer(0, k - 1));
      const rows = [k, ...extra];
      singletons.push({ rows, vals: rows.map(() => (rng.chance(0.5) ? -1 : 1) * rng.uniform(0.5, 2)) });
    }
    const rest = Array.from({ length: 20 }, () => randomColumn(rng, m, 6));
    const fast = new SparseLu(m);
    const slow = new SparseLu(m);
    for (const c of singletons) {
      expect(fast.offerSingleton(c.rows, c.vals, 0, c.rows.length, 1e-9)).toBe('accepted');
      expect(slow.offer(c.rows, c.vals, 0, c.rows.length, 1e-9)).toBe(true);
    }
    expect(Array.from(fast.pivotRow.subarray(0, 40))).toEqual(Array.from(slow.pivotRow.subarray(0, 40)));
    for (let k = 0; k < 40; k++) {
      const entries = (lu: SparseLu) => {
        const u: string[] = [];
        for (let p = lu.Up[k]; p < lu.Up[k + 1]; p++) u.push(`${lu.Ui[p]}:${lu.Ux[p]}`);
        return { u: u.sort(), l: lu.Lp[k + 1] - lu.Lp[k] };
      };
      expect(entries(fast)).toEqual(entries(slow));
    }
    // a column with two free rows is not a singleton, one with no free row neither; a tiny pivot is refused
    expect(fast.offerSingleton([40, 41], [1, 1], 0, 2, 1e-9)).toBe('not-singleton');
    expect(fast.offerSingleton([0, 1], [1, 1], 0, 2, 1e-9)).toBe('not-singleton');
    expect(fast.offerSingleton([0, 40], [1, 1e-12], 0, 2, 1e-9)).toBe('refused');
    expect(fast.rank).toBe(40);
    const taken = [...singletons, ...offerAll(fast, rest)];
    // a row whose L column has entries below its pivot would change L⁻¹b: not taken this way
    const filled = Array.from({ length: fast.rank }, (_, s) => s).find((s) => fast.Lp[s + 1] - fast.Lp[s] > 1)!;
    const freeRow = Array.from({ length: m }, (_, i) => i).find((i) => fast.pinv[i] < 0)!;
    expect(filled).toBeGreaterThanOrEqual(40);
    expect(fast.offerSingleton([fast.pivotRow[filled], freeRow], [1, 1], 0, 2, 1e-9)).toBe('not-singleton');
    for (let i = 0; i < m && fast.rank < m; i++) if (fast.pinv[i] < 0 && fast.offer([i], [1], 0, 1, 1e-9)) taken.push({ rows: [i], vals: [1] });
    expect(fast.rank).toBe(m);
    const B = dense(m, taken);
    const b = Array.from({ length: m }, () => rng.uniform(-1, 1));
    const x = Float64Array.from(b);
    fast.solve(x, new Float64Array(m));
    const reference = denseSolve(B, Matrix.columnVector(b)).to1DArray();
    reference.forEach((v, k) => expect(x[k]).toBeCloseTo(v, 9));
  });
});
