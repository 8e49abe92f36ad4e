/**
 * What each row and column of the planning LP means, so a solution (or an infeasibility ray)
 * can be mapped back to products, work centers, materials and weeks.
 *
 * Arrays are indexed [item][week − 1]; −1 marks a column or row that the model does not have
 * (e.g. no `late` column before a product's first firm order, no `buy` column whose delivery
 * would fall after the horizon).
 */
export type RowKind = 'balance' | 'backlog' | 'capacity' | 'material' | 'supply' | 'safety_stock' | 'must_ship' | 'smoothing';
export type ColKind = 'make' | 'stock' | 'late' | 'sell' | 'short' | 'overtime' | 'buy' | 'mstock' | 'change';

export interface RowInfo {
  kind: RowKind;
  /** product, work center or material code */
  item: string;
  week: number;
}

export interface ColInfo {
  kind: ColKind;
  item: string;
  week: number;
}

export interface ModelIndex {
  horizonWeeks: number;
  products: string[];
  workCenters: string[];
  materials: string[];
  col: Record<ColKind, number[][]>;
  row: Record<RowKind, number[][]>;
  rowInfo: RowInfo[];
  colInfo: ColInfo[];
  /** objective constant: −(price × firm demand in the horizon) */
  firmRevenueConstant: number;
  smoothingWeight: number;
  wholeUnits: boolean;
}

/** `kind[item,wN]` with blanks in codes replaced so names survive MPS files */
export function modelName(kind: string, item: string, week: number): string {
  return `${kind}[${item.replace(/\s+/g, '_')},w${week}]`;
}
