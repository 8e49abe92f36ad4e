import type { CscMatrix, Problem } from '@millrace/lp-core';

/**
 * Accumulates named columns and rows of a linear program and emits lp-core's Problem
 * (minimise cᵀx + ½xᵀQx + c₀ s.t. rowLower ≤ Ax ≤ rowUpper, colLower ≤ x ≤ colUpper).
 * Q is diagonal here (the smoothing term), stored as its lower triangle in CSC form.
 */
export class LpBuilder {
  private colNames: string[] = [];
  private colLower: number[] = [];
  private colUpper: number[] = [];
  private cost: number[] = [];
  private qDiag = new Map<number, number>();
  private rowNames: string[] = [];
  private rowLower: number[] = [];
  private rowUpper: number[] = [];
  /** entries per column: row index and value */
  private colEntries: { row: number; value: number }[][] = [];
  private constant = 0;

  addColumn(name: string, lower: number, upper: number, cost: number): number {
    if (!(lower <= upper)) throw new Error(`column ${name}: lower bound ${lower} above upper bound ${upper}`);
    this.colNames.push(name);
    this.colLower.push(lower);
    this.colUpper.push(upper);
    this.cost.push(cost);
    this.colEntries.push([]);
    return this.colNames.length - 1;
  }

  addCost(col: number, cost: number): void {
    this.cost[col] += cost;
  }

  /** adds ½·q·x² to the objective */
  addQuadratic(col: number, q: number): void {
    this.qDiag.set(col, (this.qDiag.get(col) ?? 0) + q);
  }

  addConstant(value: number): void {
    this.constant += value;
  }

  /** a row lower ≤ Σ value·x[col] ≤ upper; repeated columns are summed */
  addRow(name: string, lower: number, upper: number, terms: [number, number][]): number {
    const row = this.rowNames.length;
    this.rowNames.push(name);
    this.rowLower.push(lower);
    this.rowUpper.push(upper);
    const merged = new Map<number, number>();
    for (const [col, value] of terms) merged.set(col, (merged.get(col) ?? 0) + value);
    for (const [col, value] of merged) if (value !== 0) this.colEntries[col].push({ row, value });
    return row;
  }

  get numCols(): number {
    return this.colNames.length;
  }

  get numRows(): number {
    return this.rowNames.length;
  }

  build(name: string): Problem {
    const n = this.colNames.length;
    const m = this.rowNames.length;
    const A = toCsc(m, n, this.colEntries);
    const problem: Problem = {
      name,
      colNames: this.colNames.slice(),
      rowNames: this.rowNames.slice(),
      c: Float64Array.from(this.cost),
      c0: this.constant,
      A,
      rowLower: Float64Array.from(this.rowLower),
      rowUpper: Float64Array.from(this.rowUpper),
      colLower: Float64Array.from(this.colLower),
      colUpper: Float64Array.from(this.colUpper),
    };
    if (this.qDiag.size > 0) {
      const perCol: { row: number; value: number }[][] = Array.from({ length: n }, () => []);
      for (const [col, q] of this.qDiag) perCol[col].push({ row: col, value: q });
      problem.Q = toCsc(n, n, perCol);
    }
    return problem;
  }
}

function toCsc(m: number, n: number, entries: { row: number; value: number }[][]): CscMatrix {
  const colPtr = new Int32Array(n + 1);
  let nnz = 0;
  for (let j = 0; j < n; j++) {
    colPtr[j] = nnz;
    nnz += entries[j].length;
  }
  colPtr[n] = nnz;
  const rowIdx = new Int32Array(nnz);
  const values = new Float64Array(nnz);
  for (let j = 0; j < n; j++) {
    const sorted = entries[j].slice().sort((a, b) => a.row - b.row);
    sorted.forEach((e, k) => {
      rowIdx[colPtr[j] + k] = e.row;
      values[colPtr[j] + k] = e.value;
    });
  }
  return { m, n, colPtr, rowIdx, values };
}
