/**
 * The problem form every lp-core solver accepts:
 *
 *   minimise    cᵀx + ½ xᵀQx + c₀
 *   subject to  rowLower ≤ A x ≤ rowUpper
 *               colLower ≤ x   ≤ colUpper
 *
 * Any bound may be ±Infinity. A row with rowLower = rowUpper is an equality; a column with
 * colLower = colUpper is fixed. Q is symmetric positive semidefinite and given by its lower
 * triangle (diagonal included) in compressed-sparse-column form; omit it for an LP.
 * Row and column names are kept so every result can be mapped back.
 */
export interface CscMatrix {
  /** number of rows */
  m: number;
  /** number of columns */
  n: number;
  /** column pointers, length n + 1 */
  colPtr: Int32Array;
  /** row index of each stored entry, length nnz */
  rowIdx: Int32Array;
  /** value of each stored entry, length nnz */
  values: Float64Array;
}

export interface Problem {
  name?: string;
  /** true when the source asked to maximise; c, Q and c₀ are then already negated */
  maximise?: boolean;
  colNames: string[];
  rowNames: string[];
  c: Float64Array;
  /** objective constant c₀ */
  c0: number;
  A: CscMatrix;
  rowLower: Float64Array;
  rowUpper: Float64Array;
  colLower: Float64Array;
  colUpper: Float64Array;
  /** lower triangle of the PSD Hessian, n × n; undefined for an LP */
  Q?: CscMatrix;
  /** columns marked integer in the source file (reported; the IPM solves the relaxation) */
  integerCols?: number[];
}
