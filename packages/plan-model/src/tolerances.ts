/** Tolerances used when reading a solution back (absolute; quantities in units, values in currency). */
export const TOLERANCES = {
  /** a quantity below this is zero */
  quantity: 1e-6,
  /** a dual value (bottleneck value, reduced cost) below this is zero */
  value: 1e-6,
  /** a row is tight when its slack is below this × (1 + |bound|) */
  tightRelative: 1e-6,
} as const;

/** snap near-zero solver noise to 0 */
export const snap = (v: number): number => (Math.abs(v) < TOLERANCES.quantity * 0.1 ? 0 : v);
