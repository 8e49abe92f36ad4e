import type { Material } from './planning-data';

/** Most of a material that can be bought in a week: a week's own cap when set, else the weekly cap; null = no cap. */
export function supplyCap(m: Material, week: number): number | null {
  const own = m.supplyCapByWeek?.find((c) => c.week === week);
  return own ? own.cap : m.weeklySupplyCap;
}
