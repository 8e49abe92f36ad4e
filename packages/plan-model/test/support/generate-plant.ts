import type { PlanningData, Product, WorkCenter, Material, BomLine, RoutingStep, DemandLine } from '../../src/planning-data';

/** mulberry32: a small seeded generator so every generated plant is reproducible */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface PlantSize {
  finished: number;
  subassemblies: number;
  workCenters: number;
  materials: number;
  weeks: number;
  /** regular hours needed to meet all demand ÷ regular hours available (default 1.2: some rows bind) */
  loadFactor?: number;
  /** multiplies every weekly supply cap (default 1) */
  supplyFactor?: number;
}

/**
 * A generated plant (invented data, for property tests only — never an expected value):
 * finished goods built from sub-assemblies and materials, sub-assemblies from materials and
 * lower sub-assemblies (no cycles by construction), routings over 1–3 work centers, calendars
 * with holidays and downtime, capped overtime on some work centers, materials with lead times,
 * scheduled receipts and supply caps, firm and forecast demand tight enough that some
 * capacity and supply rows bind.
 */
export function generatePlant(seed: number, size: PlantSize): PlanningData {
  const rnd = seededRandom(seed);
  const int = (lo: number, hi: number) => lo + Math.floor(rnd() * (hi - lo + 1));
  const pick = <T,>(xs: T[]): T => xs[Math.floor(rnd() * xs.length)];
  const round2 = (v: number) => Math.round(v * 100) / 100;
  const T = size.weeks;

  const workCenters: WorkCenter[] = Array.from({ length: size.workCenters }, (_, k) => {
    const shifts = int(1, 2);
    return {
      code: `WC-${k + 1}`,
      name: `Work center ${k + 1}`,
      efficiency: round2(0.8 + 0.15 * rnd()),
      overtimeCapHoursPerWeek: rnd() < 0.3 ? null : int(4, 16),
      overtimeCostPerHour: int(30, 70),
      shiftPattern: { shiftsPerDay: shifts, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: shifts === 1 ? ['06:00'] : ['06:00', '14:00'] },
      exceptions: Array.from({ length: int(0, 2) }, () => ({ week: int(1, T), holidayDays: int(0, 1), downtimeHours: int(0, 8) })),
    };
  });
  const materials: Material[] = Array.from({ length: size.materials }, (_, j) => {
    const cost = round2(2 + 20 * rnd());
    return {
      code: `M-${j + 1}`,
      name: `Material ${j + 1}`,
      unit: 'pc',
      unitCost: cost,
      onHand: int(0, 400),
      leadTimeWeeks: int(0, 3),
      weeklySupplyCap: rnd() < 0.4 ? Math.round(int(80, 400) * (size.supplyFactor ?? 1)) : null,
      lotRule: pick(['lot_for_lot', 'fixed_order_quantity', 'minimum_order_quantity'] as const),
      lotSize: int(50, 200),
      scheduledReceipts: rnd() < 0.5 ? [{ week: int(1, T), qty: int(20, 200) }] : [],
      holdingCostPerUnitWeek: round2(cost * 0.005),
    };
  });
  const subs: Product[] = Array.from({ length: size.subassemblies }, (_, i) => ({
    code: `S-${i + 1}`,
    name: `Sub-assembly ${i + 1}`,
    unit: 'pc',
    kind: 'subassembly',
    price: 0,
    extraUnitCost: round2(5 * rnd()),
    holdingCostAnnualRate: 0.24,
    safetyStock: rnd() < 0.2 ? int(5, 20) : 0,
    batchMultiple: pick([1, 1, 5, 10]),
    openingStock: int(0, 30),
    latePenalty: int(5, 15),
    family: `F${int(1, 3)}`,
  }));
  const finished: Product[] = Array.from({ length: size.finished }, (_, i) => ({
    code: `P-${i + 1}`,
    name: `Product ${i + 1}`,
    unit: 'pc',
    kind: 'finished',
    price: int(120, 400),
    extraUnitCost: round2(10 * rnd()),
    holdingCostAnnualRate: 0.24,
    safetyStock: rnd() < 0.3 ? int(5, 30) : 0,
    batchMultiple: pick([1, 1, 2, 5]),
    openingStock: int(0, 40),
    latePenalty: int(5, 30),
    family: `F${int(1, 3)}`,
  }));
  // about loadFactor × the regular hours of the plant are needed to meet all demand
  const hoursScale = (0.55 * (size.loadFactor ?? 1.2) * size.workCenters) / size.finished;
  const bom: BomLine[] = [];
  const routings: RoutingStep[] = [];
  const addMaterials = (parent: string) => {
    const n = int(1, Math.min(3, materials.length));
    const used = new Set<string>();
    for (let k = 0; k < n; k++) {
      const m = pick(materials).code;
      if (used.has(m)) continue;
      used.add(m);
      bom.push({ parent, material: m, qtyPer: int(1, 4), scrapPct: pick([0, 0, 2, 5]) });
    }
  };
  subs.forEach((s, i) => {
    addMaterials(s.code);
    if (i > 0 && rnd() < 0.3) bom.push({ parent: s.code, componentProduct: subs[int(0, i - 1)].code, qtyPer: int(1, 2), scrapPct: 0 });
  });
  finished.forEach((p) => {
    addMaterials(p.code);
    if (subs.length > 0 && rnd() < 0.7) bom.push({ parent: p.code, componentProduct: pick(subs).code, qtyPer: int(1, 3), scrapPct: pick([0, 1]) });
  });
  for (const p of [...subs, ...finished]) {
    const steps = int(1, Math.min(3, workCenters.length));
    const used = new Set<string>();
    for (let s = 0; s < steps; s++) {
      const w = pick(workCenters).code;
      if (used.has(w)) continue;
      used.add(w);
      routings.push({ product: p.code, sequence: 10 * (s + 1), workCenter: w, hoursPerUnit: Math.round(1000 * hoursScale * (0.2 + 1.6 * rnd())) / 1000, setupHours: round2(rnd() * 2) });
    }
  }
  const demand: DemandLine[] = [];
  let order = 1000;
  for (const p of finished)
    for (let t = 1; t <= T; t++) {
      if (rnd() < 0.6) demand.push({ product: p.code, week: t, kind: 'firm', qty: int(5, 60), orderRef: String(order++) });
      if (rnd() < 0.5) demand.push({ product: p.code, week: t, kind: 'forecast', qty: int(5, 80) });
    }
  // every week has demand, so the horizon never runs past the demand data
  demand.push({ product: finished[0].code, week: T, kind: 'forecast', qty: 10 });
  const weeks = Array.from({ length: T }, (_, i) => {
    const d = new Date(Date.UTC(2027, 0, 4 + 7 * i));
    return { index: i + 1, startDate: d.toISOString().slice(0, 10) };
  });
  return {
    plant: { name: `Generated plant ${seed}`, currency: 'EUR', weekStart: 'monday', maxWeeklyHours: 48, minDailyRestHours: 11, overtimePremium: 1.5 },
    weeks,
    products: [...finished, ...subs],
    bom,
    routings,
    workCenters,
    materials,
    demand,
  };
}
