import type { DataSource, EntityManager } from 'typeorm';
import { addDays } from '@millrace/contracts';
import { hashPassword } from '../auth/password';
import { loadConfig } from '../config';
import { insertPerson } from '../people/people.repository';
import { replacePersonWorkCenters } from '../people/person-work-centers.repository';
import { currentWeekStart } from '../master-data/weeks';
import { createDataSource } from './data-source';
import { BomLineEntity } from './entities/bom-line.entity';
import { CalendarWeekEntity } from './entities/calendar-week.entity';
import { DemandForecastEntity } from './entities/demand-forecast.entity';
import { FirmOrderEntity } from './entities/firm-order.entity';
import { MaterialEntity } from './entities/material.entity';
import { PersonEntity } from './entities/person.entity';
import { PlantSettingsEntity } from './entities/plant-settings.entity';
import { ProductEntity } from './entities/product.entity';
import { RoutingStepEntity } from './entities/routing-step.entity';
import { ScheduledReceiptEntity } from './entities/scheduled-receipt.entity';
import { WorkCenterEntity } from './entities/work-center.entity';
import { demoDemand } from './demo-plant/demand';
import { demoMaterials } from './demo-plant/materials';
import { demoPassword, demoPeople, demoPlant, demoWorkCenterAssignments } from './demo-plant/plant';
import { demoProducts } from './demo-plant/products';
import { demoCalendar, demoWorkCenters } from './demo-plant/work-centers';

/** What the loader did. */
export type SeedOutcome = 'loaded' | 'skipped_not_empty';

/**
 * Loads the demo plant (Quillfen Joinery, invented) and the four demo sign-ins, only when the
 * database has no products and no people; everything in one transaction, so a failure leaves
 * the database as it was. Running it again does nothing. Weeks are counted from the current
 * week (`now`), so the demo's demand always lies ahead.
 */
export async function seedDemoPlant(dataSource: DataSource, now: Date = new Date()): Promise<SeedOutcome> {
  const hashes = await Promise.all(demoPeople.map(() => hashPassword(demoPassword)));
  return dataSource.transaction(async (db) => {
    // Lock the settings row first: two loaders started together run one after the other.
    await db.query('SELECT id FROM plant_settings WHERE id = 1 FOR UPDATE');
    const [products, people] = await Promise.all([db.getRepository(ProductEntity).count(), db.getRepository(PersonEntity).count()]);
    if (products > 0 || people > 0) return 'skipped_not_empty';

    const week0 = currentWeekStart(demoPlant.weekStart, now);
    const weekAt = (offset: number) => addDays(week0, 7 * offset);
    const stamp = { version: 1, createdAt: now, updatedAt: now };

    await db.getRepository(PlantSettingsEntity).update(
      { id: 1 },
      {
        plantName: demoPlant.plantName,
        currency: demoPlant.currency,
        weekStart: demoPlant.weekStart,
        defaultShiftsPerDay: demoPlant.defaultShiftPattern.shiftsPerDay,
        defaultHoursPerShift: demoPlant.defaultShiftPattern.hoursPerShift,
        defaultDaysPerWeek: demoPlant.defaultShiftPattern.daysPerWeek,
        defaultShiftStarts: demoPlant.defaultShiftPattern.shiftStarts,
        updatedAt: now,
      },
    );
    const personIds = new Map<string, number>();
    for (const [i, person] of demoPeople.entries()) personIds.set(person.email, (await insertPerson(db, { ...person, passwordHash: hashes[i] })).id);

    const wcIds = await insertByCode(db, WorkCenterEntity, demoWorkCenters.map(({ shiftPattern, ...w }) => ({ ...w, ...shiftPattern, ...stamp })));
    for (const [email, codes] of Object.entries(demoWorkCenterAssignments)) {
      const ids = codes.map((code) => wcIds.get(code) ?? fail(`demo plant: ${email} is assigned work center ${code}, which the demo plant does not have`));
      await replacePersonWorkCenters(db, personIds.get(email) ?? fail(`demo plant: work centers are assigned to ${email}, who is not a demo person`), ids);
    }
    await db.getRepository(CalendarWeekEntity).insert(
      demoCalendar.map((c) => ({ workCenterId: wcIds.get(c.workCenter)!, weekStart: weekAt(c.weekOffset), holidayDays: c.holidayDays, downtimeHours: c.downtimeHours, extraShifts: 0, note: c.note })),
    );

    const materialIds = await insertByCode(db, MaterialEntity, demoMaterials.map(({ receipts: _r, ...m }) => ({ ...m, ...stamp })));
    await db.getRepository(ScheduledReceiptEntity).insert(
      demoMaterials.flatMap((m) => (m.receipts ?? []).map((r) => ({ materialId: materialIds.get(m.code)!, weekStart: weekAt(r.weekOffset), qty: r.qty, reference: r.reference }))),
    );

    const productIds = await insertByCode(db, ProductEntity, demoProducts.map(({ bom: _b, routing: _r, weeklyRate: _w, ...p }) => ({ ...p, ...stamp })));
    await db.getRepository(BomLineEntity).insert(
      demoProducts.flatMap((p) =>
        p.bom.map(([component, qtyPer, scrapPct = 0], i) => ({
          parentProductId: productIds.get(p.code)!,
          position: i + 1,
          componentProductId: component.startsWith('p:') ? productIds.get(component.slice(2))! : null,
          materialId: component.startsWith('m:') ? materialIds.get(component.slice(2))! : null,
          qtyPer,
          scrapPct,
        })),
      ),
    );
    await db.getRepository(RoutingStepEntity).insert(
      demoProducts.flatMap((p) =>
        p.routing.map(([wc, hoursPerUnit, setupHours = 0], i) => ({ productId: productIds.get(p.code)!, sequence: (i + 1) * 10, workCenterId: wcIds.get(wc)!, hoursPerUnit, setupHours })),
      ),
    );

    const demand = demoDemand();
    await db.getRepository(FirmOrderEntity).insert(
      demand.firm.map((o) => ({ productId: productIds.get(o.product)!, weekStart: weekAt(o.weekOffset), orderRef: o.orderRef, qty: o.qty, ...stamp })),
    );
    await db.getRepository(DemandForecastEntity).insert(
      demand.forecast.map((f) => ({ productId: productIds.get(f.product)!, weekStart: weekAt(f.weekOffset), qty: f.qty, ...stamp })),
    );
    return 'loaded';
  });
}

function fail(message: string): never {
  throw new Error(message);
}

/** Inserts rows that have a `code` and returns their ids by code; a code the data names twice fails the load. */
async function insertByCode<T extends { code: string }>(db: EntityManager, entity: Parameters<EntityManager['getRepository']>[0], rows: T[]): Promise<Map<string, number>> {
  const ids = new Map<string, number>();
  for (const row of rows) {
    if (ids.has(row.code)) throw new Error(`demo plant: the code ${row.code} appears twice`);
    const result = await db.getRepository(entity).insert(row as never);
    ids.set(row.code, Number(result.identifiers[0].id));
  }
  return ids;
}

/** CLI: `node --import tsx apps/api/src/db/seed-demo.ts` (the start script runs it after the migrations). */
async function main(): Promise<void> {
  const config = loadConfig();
  const dataSource = createDataSource(config.db);
  await dataSource.initialize();
  try {
    const outcome = await seedDemoPlant(dataSource);
    console.log(outcome === 'loaded' ? 'seed-demo: loaded the demo plant (Quillfen Joinery) and the demo sign-ins' : 'seed-demo: the database already has products or people; left as it is');
  } finally {
    await dataSource.destroy();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  main().catch((err: unknown) => {
    console.error(`seed-demo: failed: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
}
