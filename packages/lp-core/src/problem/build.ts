/**
 * Builds a Problem from plain JavaScript arrays, for other packages and tests.
 * Sense 'maximise' negates c, Q and c₀ (Problem keeps the minimisation form and remembers it).
 */
import type { CscMatrix, Problem } from './problem';
import { cscFromTriplets } from '../sparse/csc';

export interface TripletProblemInput {
  name?: string;
  sense?: 'minimise' | 'maximise';
  /** number of rows and columns */
  m: number;
  n: number;
  c: ArrayLike<number>;
  c0?: number;
  /** A as triplets (duplicates are summed) */
  A: { rows: ArrayLike<number>; cols: ArrayLike<number>; values: ArrayLike<number> };
  rowLower: ArrayLike<number>;
  rowUpper: ArrayLike<number>;
  /** default 0 */
  colLower?: ArrayLike<number>;
  /** default +Infinity */
  colUpper?: ArrayLike<number>;
  /** Q as triplets of the full symmetric matrix or of one triangle (see qTriangle) */
  Q?: { rows: ArrayLike<number>; cols: ArrayLike<number>; values: ArrayLike<number> };
  /** 'full' (default): both (i, j) and (j, i) are given; 'lower': only i ≥ j is given */
  qTriangle?: 'full' | 'lower';
  colNames?: string[];
  rowNames?: string[];
  integerCols?: number[];
}

export interface DenseProblemInput extends Omit<TripletProblemInput, 'm' | 'n' | 'A' | 'Q' | 'qTriangle'> {
  /** A by rows */
  A: number[][];
  /** full symmetric Q by rows */
  Q?: number[][];
}

export function problemFromTriplets(input: TripletProblemInput): Problem {
  const { m, n } = input;
  const sign = input.sense === 'maximise' ? -1 : 1;
  const A = cscFromTriplets(m, n, input.A.rows, input.A.cols, input.A.values);
  let Q: CscMatrix | undefined;
  if (input.Q) Q = lowerTriangle(n, input.Q, input.qTriangle ?? 'full', sign);
  const fill = (v: ArrayLike<number> | undefined, d: number, len: number): Float64Array =>
    v === undefined ? new Float64Array(len).fill(d) : Float64Array.from(v);
  const c = Float64Array.from(input.c, (v) => sign * v);
  return {
    name: input.name,
    maximise: sign < 0 ? true : undefined,
    colNames: input.colNames ?? Array.from({ length: n }, (_, j) => `x${j + 1}`),
    rowNames: input.rowNames ?? Array.from({ length: m }, (_, i) => `r${i + 1}`),
    c,
    c0: sign * (input.c0 ?? 0),
    A,
    rowLower: Float64Array.from(input.rowLower),
    rowUpper: Float64Array.from(input.rowUpper),
    colLower: fill(input.colLower, 0, n),
    colUpper: fill(input.colUpper, Infinity, n),
    Q,
    integerCols: input.integerCols,
  };
}

export function problemFromDense(input: DenseProblemInput): Problem {
  const m = input.A.length;
  const n = input.c.length;
  const rows: number[] = [];
  const cols: number[] = [];
  const values: number[] = [];
  input.A.forEach((r, i) => {
    if (r.length !== n) throw new Error(`problemFromDense: row ${i} of A has ${r.length} entries, expected ${n}`);
    r.forEach((v, j) => {
      if (v !== 0) {
        rows.push(i);
        cols.push(j);
        values.push(v);
      }
    });
  });
  let Q: TripletProblemInput['Q'];
  if (input.Q) {
    const qr: number[] = [];
    const qc: number[] = [];
    const qv: number[] = [];
    input.Q.forEach((r, i) =>
      r.forEach((v, j) => {
        if (v !== 0) {
          qr.push(i);
          qc.push(j);
          qv.push(v);
        }
      }),
    );
    Q = { rows: qr, cols: qc, values: qv };
  }
  return problemFromTriplets({ ...input, m, n, A: { rows, cols, values }, Q, qTriangle: 'full' });
}

/** Lower triangle (diagonal included) of a symmetric Q, scaled by sign. */
function lowerTriangle(
  n: number,
  q: { rows: ArrayLike<number>; cols: ArrayLike<number>; values: ArrayLike<number> },
  triangle: 'full' | 'lower',
  sign: number,
): CscMatrix {
  const rows: number[] = [];
  const cols: number[] = [];
  const vals: number[] = [];
  for (let t = 0; t < q.rows.length; t++) {
    const i = q.rows[t];
    const j = q.cols[t];
    if (triangle === 'lower' && i < j) {
      throw new Error(`Q entry (${i}, ${j}) lies above the diagonal but qTriangle is 'lower'`);
    }
    if (i < j) continue; // the full matrix repeats it below the diagonal
    rows.push(i);
    cols.push(j);
    vals.push(sign * q.values[t]);
  }
  return cscFromTriplets(n, n, rows, cols, vals);
}
