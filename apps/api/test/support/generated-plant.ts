import { FIRST_WEEK } from './small-plant';
import type { TestAgent } from './test-app';

/**
 * A generated plant big enough that a solve takes a noticeable moment (for the concurrency and
 * cancel tests; invented numbers from a fixed-seed generator, never expected values):
 * `products` finished products over 4 work centers and 3 materials, firm orders and forecasts
 * for `weeks` weeks from FIRST_WEEK. Entered through the master-data API.
 */
export async function seedGeneratedPlant(planner: TestAgent, products: number, weeks: number): Promise<void> {
  let seed = 12345;
  const rand = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
  const ok = async (p: Promise<{ status: number; body: any }>, status: number) => {
    const r = await p;
    if (r.status !== status) throw new Error(`seeding: expected ${status}, got ${r.status} ${JSON.stringify(r.body)}`);
    return r.body;
  };
  const wcIds: number[] = [];
  for (let w = 0; w < 4; w++) {
    const body = await ok(
      planner.post('/api/work-centers').send({
        code: `W${w}`,
        name: `Station ${w}`,
        efficiency: 0.9,
        overtimeCapHoursPerWeek: 16,
        overtimeCostPerHour: 40 + 5 * w,
        shiftPattern: { shiftsPerDay: 2, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['06:00', '14:00'] },
      }),
      201,
    );
    wcIds.push(body.id);
  }
  const matIds: number[] = [];
  for (let m = 0; m < 3; m++) {
    const body = await ok(
      planner.post('/api/materials').send({ code: `M${m}`, name: `Stock ${m}`, unit: 'kg', unitCost: 2 + m, onHand: 200, leadTimeWeeks: 1, weeklySupplyCap: 4000 }),
      201,
    );
    matIds.push(body.id);
  }
  const changes: unknown[] = [];
  for (let p = 0; p < products; p++) {
    const prod = await ok(
      planner.post('/api/products').send({
        code: `P${String(p).padStart(3, '0')}`,
        name: `Part ${p}`,
        unit: 'pcs',
        kind: 'finished',
        price: Math.round(60 + 140 * rand()),
        latePenalty: 5,
      }),
      201,
    );
    const bom = await ok(
      planner.put(`/api/products/${prod.id}/bom`).send({ version: prod.version, lines: [{ materialId: matIds[p % 3], qtyPer: Math.round(10 * (1 + 3 * rand())) / 10 }] }),
      200,
    );
    await ok(
      planner.put(`/api/products/${prod.id}/routing`).send({
        version: bom.version,
        steps: [
          { sequence: 10, workCenterId: wcIds[p % 4], hoursPerUnit: Math.round(100 * (0.2 + 0.6 * rand())) / 100 },
          { sequence: 20, workCenterId: wcIds[(p + 1) % 4], hoursPerUnit: Math.round(100 * (0.1 + 0.4 * rand())) / 100 },
        ],
      }),
      200,
    );
    for (let t = 0; t < weeks; t++) {
      const weekStart = addDays(FIRST_WEEK, 7 * t);
      changes.push({ kind: 'firm', productId: prod.id, weekStart, orderRef: `G-${p}-${t}`, qty: Math.round(5 + 20 * rand()), version: null });
      changes.push({ kind: 'forecast', productId: prod.id, weekStart, qty: Math.round(10 * rand()), version: null });
    }
  }
  await ok(planner.put('/api/demand').send({ changes }), 200);
}

function addDays(iso: string, days: number): string {
  const d = new Date(`${iso}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}
