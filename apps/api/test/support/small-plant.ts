import type { TestAgent } from './test-app';

/**
 * A small fictional joinery (demo-style data, invented; never an expected value): two work
 * centers, two purchased materials, a sub-assembly and two finished products, four weeks of
 * demand from FIRST_WEEK. Entered through the master-data API as a planner would.
 */
export const FIRST_WEEK = '2027-01-04'; // a Monday (the plant's week start)
export const WEEKS = ['2027-01-04', '2027-01-11', '2027-01-18', '2027-01-25'];

export interface SmallPlant {
  workCenters: Record<'SAW' | 'ASM', number>;
  materials: Record<'OAK' | 'FIT', number>;
  products: Record<'TOP' | 'TBL' | 'BEN', number>;
}

async function ok<T = any>(res: Promise<{ status: number; body: any }>, expected: number, what: string): Promise<T> {
  const r = await res;
  if (r.status !== expected) throw new Error(`seeding ${what}: expected ${expected}, got ${r.status} ${JSON.stringify(r.body)}`);
  return r.body as T;
}

export async function seedSmallPlant(planner: TestAgent): Promise<SmallPlant> {
  const wc = async (code: string, name: string, efficiency: number, cap: number, cost: number) =>
    (
      await ok<{ id: number }>(
        planner.post('/api/work-centers').send({
          code,
          name,
          efficiency,
          overtimeCapHoursPerWeek: cap,
          overtimeCostPerHour: cost,
          shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] },
        }),
        201,
        `work center ${code}`,
      )
    ).id;
  const workCenters = { SAW: await wc('SAW', 'Panel saw', 1, 10, 45), ASM: await wc('ASM', 'Assembly bench', 0.9, 8, 40) };

  const mat = async (body: Record<string, unknown>) => (await ok<{ id: number }>(planner.post('/api/materials').send(body), 201, `material ${body.code}`)).id;
  const materials = {
    OAK: await mat({ code: 'OAK', name: 'Oak board', unit: 'm2', unitCost: 12, onHand: 50, leadTimeWeeks: 1, weeklySupplyCap: 120 }),
    FIT: await mat({ code: 'FIT', name: 'Fittings kit', unit: 'pcs', unitCost: 3, onHand: 100, leadTimeWeeks: 0 }),
  };

  const product = async (body: Record<string, unknown>) => ok<{ id: number; version: number }>(planner.post('/api/products').send(body), 201, `product ${body.code}`);
  const top = await product({ code: 'TOP', name: 'Table top', unit: 'pcs', kind: 'subassembly' });
  const tbl = await product({ code: 'TBL', name: 'Dining table', unit: 'pcs', kind: 'finished', price: 420, latePenalty: 20 });
  const ben = await product({ code: 'BEN', name: 'Bench', unit: 'pcs', kind: 'finished', price: 180, latePenalty: 10 });
  const products = { TOP: top.id, TBL: tbl.id, BEN: ben.id };

  const structure = async (
    p: { id: number; version: number },
    lines: Array<{ componentProductId?: number; materialId?: number; qtyPer: number; scrapPct?: number }>,
    steps: Array<{ sequence: number; workCenterId: number; hoursPerUnit: number }>,
  ) => {
    const afterBom = await ok<{ version: number }>(planner.put(`/api/products/${p.id}/bom`).send({ version: p.version, lines }), 200, `BOM of ${p.id}`);
    const version = afterBom.version ?? p.version + 1;
    await ok(planner.put(`/api/products/${p.id}/routing`).send({ version, steps }), 200, `routing of ${p.id}`);
  };
  await structure(top, [{ materialId: materials.OAK, qtyPer: 1.2, scrapPct: 5 }], [{ sequence: 10, workCenterId: workCenters.SAW, hoursPerUnit: 0.5 }]);
  await structure(
    tbl,
    [
      { componentProductId: top.id, qtyPer: 1 },
      { materialId: materials.FIT, qtyPer: 1 },
    ],
    [
      { sequence: 10, workCenterId: workCenters.SAW, hoursPerUnit: 0.3 },
      { sequence: 20, workCenterId: workCenters.ASM, hoursPerUnit: 1.5 },
    ],
  );
  await structure(
    ben,
    [
      { materialId: materials.OAK, qtyPer: 0.8 },
      { materialId: materials.FIT, qtyPer: 1 },
    ],
    [
      { sequence: 10, workCenterId: workCenters.SAW, hoursPerUnit: 0.4 },
      { sequence: 20, workCenterId: workCenters.ASM, hoursPerUnit: 0.8 },
    ],
  );

  const firm = [15, 20, 25, 20];
  const changes = [
    ...firm.map((qty, i) => ({ kind: 'firm', productId: tbl.id, weekStart: WEEKS[i], orderRef: `SO-${101 + i}`, qty, version: null })),
    ...WEEKS.map((weekStart) => ({ kind: 'forecast', productId: ben.id, weekStart, qty: 20, version: null })),
    { kind: 'firm', productId: ben.id, weekStart: WEEKS[1], orderRef: 'SO-201', qty: 10, version: null },
  ];
  await ok(planner.put('/api/demand').send({ changes }), 200, 'demand');
  return { workCenters, materials, products };
}
