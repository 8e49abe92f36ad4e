/**
 * The reductions presolve may apply, each recorded with what postsolve needs to undo it
 * (Andersen & Andersen, "Presolving in linear programming", Math. Programming 71, 1995;
 * Gondzio, "Presolve analysis of linear programs prior to applying an interior point method",
 * INFORMS J. Comput. 9, 1997).
 */
export type Reduction =
  /** column j removed at value x_j (fixed, or empty and set at its best bound) */
  | { kind: 'fixed_column'; j: number; value: number }
  /** row i had no entries left; its dual is 0 */
  | { kind: 'empty_row'; i: number }
  /** row i could never bind; its dual is 0 */
  | { kind: 'redundant_row'; i: number }
  /** row i = a·x_j became bounds on x_j; sides tightened by the row are flagged */
  | { kind: 'singleton_row'; i: number; j: number; a: number; lowerFromRow: boolean; upperFromRow: boolean }
  /** row i can only be met with every column at a bound; those columns were fixed */
  | { kind: 'forcing_row'; i: number; side: 'lower' | 'upper'; cols: Int32Array; coefs: Float64Array };
